/**
 * Four-switch (non-inverting) buck-boost with one inductor: a buck leg (Q1 + Q2/D1) feeding a boost leg
 * (Q3 + Q4/D2) through L1. Regions, duties and the loss-inclusive averaged model: four-switch-solve.ts;
 * components and slots: four-switch-parts.ts.
 *
 * Waveforms: the period is a list of up to three intervals, each named by the switches that conduct
 * (A: Q1+Q3, B: Q1+Q4/D2, C: Q2/D1+Q4/D2, idle: nothing). Every branch current is the inductor current
 * in the intervals where the branch conducts and zero elsewhere:
 *   Q1: A, B    Q2/D1: C    Q3: A    Q4/D2: B, C    L1, Rsense: always
 *   Cin: Iin − iQ1 (the source delivers its average)    Cout: iQ4 − Iout
 * A switch that is on (or off) for the whole period in a region carries conduction loss only: it gets
 * no switching edges, so the generic loss model gives it no switching or gate loss.
 *
 * DCM (diode rectifiers only; with synchronous rectifiers the stage stays in forced CCM): when the CCM
 * valley current is negative the stage runs three intervals with an idle one (Erickson & Maksimović,
 * Fundamentals of Power Electronics, 2nd ed., 2001, ch. 5, K = 2L/(R·T), drops: diode knees only):
 *   buck region   (B, C, idle)  D = √(2·Iout·T⁻¹·L / (vB·(1 + vB/|vC|)))  [M = 2/(1 + √(1 + 4K/D²))]
 *   boost region  (A, B, idle)  D = √(2·Iout·|vB|·L/T) / Vin              [M = (1 + √(1 + 4D²/K))/2]
 *   transition    (A, C, idle)  both legs switch together (two-switch buck-boost: D = √K·M), because a
 *                               light-load controller near Vin ≈ Vout cannot hold the three-interval scheme
 * with vB = Vin − Vout − Vf2, |vC| = Vout + Vf1 + Vf2. The mode is then reported as 'dcm'.
 */
import type { Design } from '../engine/design.ts';
import type { Caution, RectifierKind } from '../engine/types.ts';
import type { WaveSet } from '../engine/wave.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSi } from '../units/format.ts';
import * as parts from './four-switch-parts.ts';
import { fourSwitchComponents, newDrops, readDrops } from './four-switch-parts.ts';
import { type FourSwitchPoint, newPoint, solveFourSwitch, transitionBandV } from './four-switch-solve.ts';
import { rhpZeroHz } from './rhp-zero.ts';
import type { OperatingPoint, OperatingScalars, Topology } from './topology.ts';

// Slot numbers read once: compiled to CommonJS (as tsx runs the engine) every read of an imported
// binding is a property getter, and operate() reads these dozens of times per corner.
const { CIN, COUT, L1, Q1, Q3, R2, R4, RS, U1 } = parts;

/** Interval kinds, as bit positions of the conduction masks below. */
const A = 0;
const B = 1;
const C = 2;
const IDLE = 3;
/** Which intervals each branch conducts in (bit t set = conducts in interval kind t). */
const ON_Q1 = (1 << A) | (1 << B);
const ON_R2 = 1 << C;
const ON_Q3 = 1 << A;
const ON_R4 = (1 << B) | (1 << C);

// module-level scratch: operate() must not allocate
const drops = newDrops();
const pt = newPoint();
const segKind = new Int8Array(3);
const segF = new Float64Array(3);
const segA = new Float64Array(3);
const segB = new Float64Array(3);
const scratchF = new Float64Array(3);
const scratchA = new Float64Array(3);
const scratchB = new Float64Array(3);

/** The three CCM intervals of the solved point (A, B, C with iL at their edges). */
function setCcmSegments(p: FourSwitchPoint): void {
  segKind[0] = A;
  segKind[1] = B;
  segKind[2] = C;
  segF[0] = Math.max(0, p.d3);
  segF[1] = Math.max(0, p.d1 - p.d3);
  segF[2] = Math.max(0, 1 - p.d1);
  segA[0] = p.i0A;
  segB[0] = p.i1A;
  segA[1] = p.i1A;
  segB[1] = p.i2A;
  segA[2] = p.i2A;
  segB[2] = p.i0A;
}

/** Light load: iL rises from 0 to dcm.peakA in interval kind `rise`, falls back in `fall`, then idles. */
const dcm = { on: 0, off: 0, peakA: 0 };

function setDcmSegments(rise: number, fall: number): void {
  segKind[0] = rise;
  segKind[1] = fall;
  segKind[2] = IDLE;
  segF[0] = Math.max(0, dcm.on);
  segF[1] = Math.max(0, dcm.off);
  segF[2] = Math.max(0, 1 - dcm.on - dcm.off);
  segA[0] = 0;
  segB[0] = dcm.peakA;
  segA[1] = dcm.peakA;
  segB[1] = 0;
  segA[2] = 0;
  segB[2] = 0;
}

/**
 * The non-empty intervals, compacted once per operating point (buck and boost regions use two of the
 * three): their kinds, fractions and iL at both ends, in order. Filled by compactSegments.
 */
let nSeg = 0;
const useKind = new Int8Array(3);

function compactSegments(): void {
  nSeg = 0;
  for (let j = 0; j < 3; j++) {
    if (!(segF[j] > 0)) continue;
    useKind[nSeg] = segKind[j];
    scratchF[nSeg] = segF[j];
    scratchA[nSeg] = segA[j];
    scratchB[nSeg] = segB[j];
    nSeg++;
  }
}

/**
 * Switching edges of a branch: it switches when it conducts for part of the period only; it turns on at
 * the start of its first conducting interval and off at the end of its last (the masks are contiguous),
 * switching the voltage it blocks (its vPeakV, written before).
 */
function writeEdges(w: WaveSet, k: number, mask: number): void {
  let frac = 0;
  let first = -1;
  let last = -1;
  for (let j = 0; j < 3; j++) {
    if (!(segF[j] > 0) || !((mask >> segKind[j]) & 1)) continue;
    frac += segF[j];
    if (first < 0) first = j;
    last = j;
  }
  const switches = first >= 0 && frac < 1 - 1e-12;
  w.iOnA[k] = switches ? segA[first] : 0;
  w.iOffA[k] = switches ? segB[last] : 0;
  w.vSwV[k] = switches ? w.vPeakV[k] : 0;
}

export function operateFourSwitch(d: Design, at: OperatingPoint, w: WaveSet, s: OperatingScalars): void {
  const vin = at.vinV;
  const iout = at.ioutA;
  const vout = Math.abs(d.voutV);
  const tOverL = 1 / (d.params.fswHz * d.parts[L1].value);
  readDrops(d, drops);
  pt.vinV = vin;
  pt.ioutA = iout;
  pt.tOverL = tOverL;
  solveFourSwitch(d, drops, pt);
  const { d1, d3, i0A, i1A, i2A } = pt;
  setCcmSegments(pt);
  let mode: OperatingScalars['mode'] = pt.region;
  let duty = pt.region === 'buck' ? d1 : d3;
  let duty2 = pt.region === 'buck-boost' ? d1 : 0;
  let vL = Math.max(
    d3 > 0 ? Math.abs(pt.vAV) : 0,
    d1 > d3 ? Math.abs(pt.vBV) : 0,
    d1 < 1 ? Math.abs(pt.vCV) : 0,
  );

  const valley = Math.min(
    d3 > 0 || d1 > d3 ? i0A : Number.POSITIVE_INFINITY,
    d1 > d3 ? i1A : Number.POSITIVE_INFINITY,
    d1 < 1 ? i2A : Number.POSITIVE_INFINITY,
  );
  if (d.params.rect === 'diode' && pt.converged && valley < 0) {
    const vo = vout + drops.vf2V;
    const vFall = vo + drops.vf1V; // |vC|
    let dOn: number;
    let dOff: number;
    let ip: number;
    if (pt.region === 'buck') {
      const vRise = vin - vo;
      dOn = Math.sqrt((2 * iout) / (vRise * tOverL * (1 + vRise / vFall)));
      ip = vRise * dOn * tOverL;
      dOff = ip / (vFall * tOverL);
      dcm.on = dOn;
      dcm.off = dOff;
      dcm.peakA = ip;
      setDcmSegments(B, C);
      duty = dOn;
      duty2 = 0;
    } else if (pt.region === 'boost' && vo > vin) {
      dOn = Math.sqrt((2 * iout * (vo - vin)) / tOverL) / vin;
      ip = vin * dOn * tOverL;
      dOff = ip / ((vo - vin) * tOverL);
      dcm.on = dOn;
      dcm.off = dOff;
      dcm.peakA = ip;
      setDcmSegments(A, B);
      duty = dOn;
      duty2 = 0;
    } else {
      dOn = Math.sqrt((2 * iout * vFall) / tOverL) / vin;
      ip = vin * dOn * tOverL;
      dOff = ip / (vFall * tOverL);
      dcm.on = dOn;
      dcm.off = dOff;
      dcm.peakA = ip;
      setDcmSegments(A, C);
      duty = dOn;
      duty2 = dOn;
    }
    if (dOn + dOff < 1) {
      mode = 'dcm';
      vL = Math.max(vin, vFall);
    } else {
      // the light-load solution would not leave an idle interval: keep the CCM one
      setCcmSegments(pt);
      duty = pt.region === 'buck' ? d1 : d3;
      duty2 = pt.region === 'buck-boost' ? d1 : 0;
    }
  }
  s.duty = duty;
  s.duty2 = duty2;
  s.mode = mode;
  s.converged = pt.converged;

  // the input current: iL averaged over the intervals where Q1 conducts
  let iin = 0;
  for (let j = 0; j < 3; j++) if ((ON_Q1 >> segKind[j]) & 1) iin += segF[j] * 0.5 * (segA[j] + segB[j]);
  s.iinA = iin;
  compactSegments();
  // every branch is iL where its switch conducts: the inductor written once, the rest masked from it
  w.setSegments(L1, nSeg, scratchF, scratchA, scratchB);
  w.setSegments(RS, nSeg, scratchF, scratchA, scratchB);
  w.setGated(Q1, nSeg, scratchF, scratchA, scratchB, useKind, ON_Q1, 1);
  w.setGated(R2, nSeg, scratchF, scratchA, scratchB, useKind, ON_R2, 1);
  w.setGated(Q3, nSeg, scratchF, scratchA, scratchB, useKind, ON_Q3, 1);
  w.setGated(R4, nSeg, scratchF, scratchA, scratchB, useKind, ON_R4, 1);
  // Cin supplies the AC of Q1's current (the input carries its average); Cout takes Q4/D2's current
  // minus the load
  w.setGated(CIN, nSeg, scratchF, scratchA, scratchB, useKind, ON_Q1, -1);
  w.removeMean(CIN);
  w.setGated(COUT, nSeg, scratchF, scratchA, scratchB, useKind, ON_R4, 1);
  w.shift(COUT, -iout);
  w.setDc(U1, 0);

  // Blocking voltages hold in every region (an idle switch still blocks its leg's voltage):
  // Q1 sees Vin plus the low-side drop, Q2/D1 sees Vin, Q3 sees Vout plus the high-side drop, Q4/D2 Vout.
  const il = Math.abs(pt.ilA);
  const vQ1 = vin + drops.vf1V + drops.r2Ohm * il;
  const vQ3 = vout + drops.vf2V + drops.r4Ohm * il;
  w.vPeakV[Q1] = Math.abs(vQ1);
  w.vPeakV[R2] = Math.abs(vin);
  w.vPeakV[Q3] = Math.abs(vQ3);
  w.vPeakV[R4] = Math.abs(vout);
  writeEdges(w, Q1, ON_Q1);
  writeEdges(w, R2, ON_R2);
  writeEdges(w, Q3, ON_Q3);
  writeEdges(w, R4, ON_R4);
  w.vPeakV[L1] = Math.abs(vL);
  w.vPeakV[CIN] = Math.abs(vin);
  w.vDcV[CIN] = vin;
  w.vPeakV[COUT] = Math.abs(vout);
  w.vDcV[COUT] = vout;
  w.vPeakV[U1] = Math.abs(vin);
  w.vDcV[U1] = vin;
}

/** The design's own risks: the transition band and the boost region's RHP zero. */
export function fourSwitchCautions(d: Design, spec: RailSpec): Caution[] {
  const out: Caution[] = [];
  const vout = Math.abs(d.voutV);
  const iout = spec.load.maxA;
  const { minV, maxV } = spec.input;
  const band = { loV: 0, hiV: 0 };
  transitionBandV(d, iout, band);
  if (band.hiV >= minV && band.loV <= maxV) {
    const collapsed = band.hiV - band.loV < 1e-6 * vout;
    out.push({
      code: 'transition-region',
      value: band.hiV - band.loV,
      message: collapsed
        ? `Transition region collapses to Vin ≈ ${formatSi(band.loV, 'V')}: with no duty limits Q1 and Q4 simply stay on there. ` +
          'Real controllers have minimum on- and off-times, so in practice a band exists where both legs switch every period ' +
          '(more switching loss and ripple) and the mode hand-over needs care.'
        : `Transition region from Vin ≈ ${formatSi(band.loV, 'V')} to ${formatSi(band.hiV, 'V')} at full load: there both legs ` +
          `switch every period (buck leg ≤ ${(d.dutyMax * 100).toFixed(0)} %, boost leg ≥ ${(d.dutyMin * 100).toFixed(1)} %), ` +
          'so switching loss and inductor ripple are higher than in pure buck or boost, and the duties jump at the band edges: ' +
          'the mode hand-over needs hysteresis and a loop that is stable in all three regions.',
    });
  }
  // RHP zero of the boost leg at the lowest input (largest boost duty): ωz = D′²·R/L (E&M Table 8.2)
  const rLoad = vout / iout;
  const l = d.parts[L1].value;
  const r = newDrops();
  readDrops(d, r);
  const p = newPoint();
  p.vinV = minV;
  p.ioutA = iout;
  p.tOverL = 1 / (d.params.fswHz * l);
  solveFourSwitch(d, r, p);
  if (p.region !== 'buck' && p.d3 > 0 && l > 0) {
    const fz = rhpZeroHz(rLoad, p.d3, l, 'boost');
    out.push({
      code: 'rhp-zero',
      value: fz,
      message:
        `Right-half-plane zero near ${formatSi(fz, 'Hz')} at full load and minimum input (${formatSi(minV, 'V')}, boost duty ` +
        `${(p.d3 * 100).toFixed(0)} %): hold the loop crossover below about ${formatSi(fz / 5, 'Hz')}–${formatSi(fz / 3, 'Hz')}; ` +
        'the buck region has no RHP zero, so the compensation is set by the boost corner.',
    });
  }
  out.push({
    code: 'switching-loop',
    message:
      'Two hot loops: Q1–Q2–Cin (buck leg) and Q3–Q4–Cout (boost leg); keep each tight, the boost loop matters most since Cout sees pulsed current in the boost region (common practice).',
  });
  return out;
}

export const fourSwitchBuckBoost: Topology = {
  id: 'four-switch-buck-boost',
  title: 'Four-switch buck-boost',
  summary:
    'Buck leg and boost leg sharing one inductor: above the output it runs as a buck (boost leg parked), below as a boost ' +
    '(buck leg parked), and near Vin ≈ Vout both legs switch. Non-inverting, one inductor, switches block only Vin or Vout; ' +
    'pulsating input current in buck mode and an RHP zero in boost mode.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'] satisfies RectifierKind[],
  modeChanging: true,
  loops: 1,
  components: fourSwitchComponents,
  operate: operateFourSwitch,
  cautions: (d, spec) => fourSwitchCautions(d, spec),
};
