/**
 * A plain boost stage (inductor from the input to the switch node, low-side switch, rectifier to the
 * output), as one stage of a cascade. Writes the waveforms of its switch, sense resistor, rectifier and
 * inductor; the capacitors around it are the cascade's.
 *
 * CCM, ideal (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 2):
 *   Vo = Vi/(1−D), IL = Io/(1−D), ΔIL = Vi·D/(L·fsw); switch and rectifier block Vo.
 * With drops — switch path Rq (on-resistance + sense resistor), rectifier Vf + rr·i, winding RL — the
 * volt-second balance on L in the averaged model (derived here) is
 *   D·(Vi − IL·RL − IL·Rq) + D′·(Vi − IL·RL − Vo − Vf − rr·IL) = 0,  IL = Io/D′,
 * and multiplying by D′ gives a quadratic in D′ that is solved in closed form (no iteration needed):
 *   (Vo + Vf)·D′² − (Vi + Io·Rq − Io·rr)·D′ + Io·(RL + Rq) = 0.
 * The larger root is the operating point (it tends to Vi/Vo as the drops vanish); a negative
 * discriminant means the drops eat the whole gain (no steady state). Multiplying the balance by IL shows
 * Vi·IL = Vo·Io + IL²·RL + D·IL²·Rq + D′·IL·(Vf + rr·IL): the input power carries exactly the drops.
 *
 * DCM (diode rectifier, CCM valley below zero): the inductor ramps from zero to Ipk = Vi·D·T/L, falls
 * to zero during D₂ = D·Vi/(Vo + Vf − Vi), then idles; the rectifier delivers Io = ½·Ipk·D₂, so
 *   D = √(2·Io·L·(Vo + Vf − Vi) / (Vi²·T)),
 * which with Vf = 0 is Erickson & Maksimović's M = ½ + √(¼ + D²/K), K = 2L·fsw/R (ch. 5). The
 * resistive drops are left out of the DCM duty (they are small at the light loads where DCM occurs).
 */
import type { Design } from '../engine/design.ts';
import { type Fractions3, newTriangle, type WaveSet } from '../engine/wave.ts';
import { newDrops, readDrops, type StageSlots, type StageState, writeStageBranches } from './stage.ts';

const drops = newDrops();
const f3: Fractions3 = { d0: 0, d1: 0, d2: 0 };
const tri = newTriangle();

/** Steady state of a boost stage from `viV` up to `voV` delivering `ioA` (all > 0). */
export function operateBoostStage(d: Design, slots: StageSlots, w: WaveSet, st: StageState): void {
  const viV = st.viV;
  const voV = st.voV;
  const ioA = st.ioA;
  readDrops(d, slots, drops);
  const { rqOhm: rq, vfV: vf, rrOhm: rr, rlOhm: rl } = drops;
  const T = 1 / d.params.fswHz;
  const L = d.parts[slots.inductor].value;

  // CCM duty with drops: the larger root of a·D′² − b·D′ + c = 0
  const a = voV + vf;
  const b = viV + ioA * (rq - rr);
  const c = ioA * (rl + rq);
  const disc = b * b - 4 * a * c;
  let converged = disc >= 0;
  let dp = converged ? (b + Math.sqrt(disc)) / (2 * a) : (0.5 * b) / a;
  if (dp > 1) {
    // the input is above the output: a boost cannot step down
    dp = 1;
    converged = false;
  }
  dp = Math.max(dp, 1e-6);
  let D = 1 - dp;
  const il = ioA / dp;
  const vd = vf + rr * il;
  const vOn = viV - il * (rl + rq);
  const ripple = (vOn * D * T) / L;

  st.mode = 'ccm';
  st.converged = converged;
  if (drops.diode && il - ripple / 2 < 0 && a > viV) {
    // discontinuous: see the header for the three-interval solution
    const dDcm = Math.sqrt((2 * ioA * L * (a - viV)) / (viV * viV * T));
    const d2 = (dDcm * viV) / (a - viV);
    if (dDcm + d2 < 1) {
      D = dDcm;
      const ipk = (viV * D * T) / L;
      f3.d0 = D;
      f3.d1 = d2;
      f3.d2 = 1 - D - d2;
      st.mode = 'dcm';
      st.converged = true;
      st.duty = D;
      st.rectDuty = d2;
      st.iinA = 0.5 * ipk * (D + d2);
      st.ilA = st.iinA;
      st.ripplePpA = ipk;
      tri.lo = 0;
      tri.hi = ipk;
      w.setTriangleIdle(slots.inductor, tri, f3);
      writeStageBranches(slots, w);
      w.iOnA[slots.sw] = 0;
      w.iOffA[slots.sw] = ipk;
      w.vSwV[slots.sw] = Math.abs(a);
      w.iOnA[slots.rect] = 0;
      w.iOffA[slots.rect] = 0;
      w.vSwV[slots.rect] = Math.abs(voV);
      // the inductor sees Vi (on) or Vo + Vf − Vi (off)
      w.vPeakV[slots.sw] = Math.abs(a);
      w.vPeakV[slots.rect] = Math.abs(voV);
      w.vPeakV[slots.inductor] = Math.max(Math.abs(viV), Math.abs(a - viV));
      return;
    }
  }

  const lo = il - ripple / 2;
  const hi = il + ripple / 2;
  st.duty = D;
  st.rectDuty = dp;
  st.iinA = il;
  st.ilA = il;
  st.ripplePpA = ripple;
  tri.duty = D;
  tri.lo = lo;
  tri.hi = hi;
  w.setTriangle(slots.inductor, tri);
  writeStageBranches(slots, w);
  // the switch turns on at the valley and off at the peak against Vo + Vd; the rectifier commutates
  // the same two currents (dead times of a synchronous rectifier) and blocks Vo
  w.iOnA[slots.sw] = lo;
  w.iOffA[slots.sw] = hi;
  w.vSwV[slots.sw] = Math.abs(voV + vd);
  w.iOnA[slots.rect] = lo;
  w.iOffA[slots.rect] = hi;
  w.vSwV[slots.rect] = Math.abs(voV);
  // the inductor sees Vi (on) or Vo + Vd − Vi (off)
  w.vPeakV[slots.sw] = Math.abs(voV + vd);
  w.vPeakV[slots.rect] = Math.abs(voV);
  w.vPeakV[slots.inductor] = Math.max(Math.abs(vOn), Math.abs(voV + vd - vOn));
}
