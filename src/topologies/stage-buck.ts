/**
 * A plain buck stage (high-side switch to the switch node, low-side rectifier, inductor to the output),
 * as one stage of a cascade. Writes the waveforms of its switch, sense resistor (in series with the
 * high-side switch), rectifier and inductor; the capacitors around it are the cascade's.
 *
 * CCM, ideal (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 2):
 *   D = Vo/Vi, IL = Io, ΔIL = (Vi − Vo)·D/(L·fsw); switch and rectifier block Vi.
 * With drops — switch path Rq (on-resistance + sense resistor), rectifier Vf + rr·i, winding RL — the
 * volt-second balance on L in the averaged model (derived here) is
 *   D·(Vi − Io·Rq − Io·RL − Vo) − D′·(Vf + rr·Io + Io·RL + Vo) = 0
 *   ⇒ D = (Vo + Io·RL + Vd) / (Vi − Io·Rq + Vd),  Vd = Vf + rr·Io,
 * explicit because IL = Io does not depend on D. The stage draws Iin = D·Io from its input (charge
 * balance of the switch); Vi·Iin = Vo·Io + Io²·RL + D·Io²·Rq + D′·Io·Vd follows, so the input power
 * carries exactly the drops.
 *
 * DCM (diode rectifier, CCM valley below zero): the inductor ramps from zero to Ipk = (Vi − Vo)·D·T/L,
 * falls to zero during D₂ = D·(Vi − Vo)/(Vo + Vf), then idles; the output gets Io = ½·Ipk·(D + D₂), so
 *   D = √(2·Io·L·(Vo + Vf) / ((Vi − Vo)·(Vi + Vf)·T)),
 * which with Vf = 0 is Erickson & Maksimović's M = 2/(1 + √(1 + 4K/D²)), K = 2L·fsw/R (ch. 5). The
 * resistive drops are left out of the DCM duty (they are small at the light loads where DCM occurs).
 */
import type { Design } from '../engine/design.ts';
import { type Fractions3, newTriangle, type WaveSet } from '../engine/wave.ts';
import { newDrops, readDrops, type StageSlots, type StageState, writeStageBranches } from './stage.ts';

const drops = newDrops();
const f3: Fractions3 = { d0: 0, d1: 0, d2: 0 };
const tri = newTriangle();

/** Steady state of a buck stage from `viV` down to `voV` delivering `ioA` (all > 0). */
export function operateBuckStage(d: Design, slots: StageSlots, w: WaveSet, st: StageState): void {
  const viV = st.viV;
  const voV = st.voV;
  const ioA = st.ioA;
  readDrops(d, slots, drops);
  const { rqOhm: rq, vfV: vf, rrOhm: rr, rlOhm: rl } = drops;
  const T = 1 / d.params.fswHz;
  const L = d.parts[slots.inductor].value;

  const vd = vf + rr * ioA;
  const den = viV - ioA * rq + vd;
  let D = den > 0 ? (voV + ioA * rl + vd) / den : 1;
  let converged = den > 0 && D <= 1;
  if (D > 1) {
    // the input is below the output plus drops: a buck cannot step up
    D = 1;
    converged = false;
  }
  const vOn = viV - ioA * (rq + rl) - voV;
  const ripple = (Math.max(vOn, 0) * D * T) / L;

  st.mode = 'ccm';
  st.converged = converged;
  const vo = voV + vf;
  if (drops.diode && ioA - ripple / 2 < 0 && viV > voV) {
    // discontinuous: see the header for the three-interval solution
    const dDcm = Math.sqrt((2 * ioA * L * vo) / ((viV - voV) * (viV + vf) * T));
    const d2 = (dDcm * (viV - voV)) / vo;
    if (dDcm + d2 < 1) {
      D = dDcm;
      const ipk = ((viV - voV) * D * T) / L;
      f3.d0 = D;
      f3.d1 = d2;
      f3.d2 = 1 - D - d2;
      st.mode = 'dcm';
      st.converged = true;
      st.duty = D;
      st.rectDuty = d2;
      st.iinA = 0.5 * ipk * D;
      st.ilA = ioA;
      st.ripplePpA = ipk;
      tri.lo = 0;
      tri.hi = ipk;
      w.setTriangleIdle(slots.inductor, tri, f3);
      writeStageBranches(slots, w);
      w.iOnA[slots.sw] = 0;
      w.iOffA[slots.sw] = ipk;
      w.vSwV[slots.sw] = Math.abs(viV + vf);
      w.iOnA[slots.rect] = 0;
      w.iOffA[slots.rect] = 0;
      w.vSwV[slots.rect] = Math.abs(viV);
      w.vPeakV[slots.sw] = Math.abs(viV + vf);
      w.vPeakV[slots.rect] = Math.abs(viV);
      w.vPeakV[slots.inductor] = Math.max(Math.abs(viV - voV), Math.abs(vo));
      return;
    }
  }

  const lo = ioA - ripple / 2;
  const hi = ioA + ripple / 2;
  st.duty = D;
  st.rectDuty = 1 - D;
  st.iinA = D * ioA;
  st.ilA = ioA;
  st.ripplePpA = ripple;
  tri.duty = D;
  tri.lo = lo;
  tri.hi = hi;
  w.setTriangle(slots.inductor, tri);
  writeStageBranches(slots, w);
  // the high-side switch turns on at the valley and off at the peak, swinging the switch node from
  // −Vd to Vi; the rectifier commutates the same two currents and blocks Vi
  w.iOnA[slots.sw] = lo;
  w.iOffA[slots.sw] = hi;
  w.vSwV[slots.sw] = Math.abs(viV + vd);
  w.iOnA[slots.rect] = lo;
  w.iOffA[slots.rect] = hi;
  w.vSwV[slots.rect] = Math.abs(viV);
  w.vPeakV[slots.sw] = Math.abs(viV + vd);
  w.vPeakV[slots.rect] = Math.abs(viV);
  w.vPeakV[slots.inductor] = Math.max(Math.abs(vOn), Math.abs(voV + vd + ioA * rl));
}
