/**
 * Four-switch (non-inverting) buck-boost: operating regions and the loss-inclusive duties (components,
 * slots and path drops: four-switch-parts.ts).
 *
 * Circuit: Q1 from Vin to node A, Q2 (or diode D1, anode at ground) from ground to A, L1 in series with
 * Rsense from A to B (iL flows A → B), Q3 from B to ground, Q4 (or diode D2, anode at B) from B to Vout.
 * Each period is split into three intervals (fractions of T), by which pair of switches conducts:
 *   A: Q1, Q3 on       fA = D3          L sees vA = Vin − mA·(Rq1 + RL + Rq3)
 *   B: Q1, Q4/D2 on    fB = D1 − D3     L sees vB = Vin − Vout − Vf2 − mB·(Rq1 + RL + R4)
 *   C: Q2/D1, Q4/D2    fC = 1 − D1      L sees vC = −Vout − Vf2 − Vf1 − mC·(R2 + RL + R4)
 * with D1 the buck leg's duty (Q1 on-time), D3 the boost leg's (Q3 on-time), RL = DCR + Rsense (both
 * carry iL all the time), R2/R4 the sync Ron or diode rd, Vf1/Vf2 the diode knees (0 when synchronous)
 * and mA, mB, mC the MEAN inductor current within each interval (drops taken at the segment mean).
 * Relations (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 2–3:
 * volt-second and charge balance in the averaged model, extended here to three intervals):
 *   volt-second balance on L1:   fA·vA + fB·vB + fC·vC = 0
 *   charge balance on Cout:      Iout = fB·mB + fC·mC          (Q4/D2 conducts in B and C)
 *   input current:               Iin  = fA·mA + fB·mB          (Q1 conducts in A and B)
 * With a fixed D3 the balance is linear in D1:  D1 = (D3·(vB − vA) − vC) / (vB − vC);
 * with a fixed D1 it is linear in D3:           D3 = −(D1·vB + (1 − D1)·vC) / (vA − vB).
 * The segment means follow from the ripple: iL rises by vA·fA·T/L, then vB·fB·T/L, then returns; they
 * differ from the average IL only in the three-interval case. Taking the drops at the segment means makes
 * the model conserve energy exactly (Vin·Iin = Pout + Σ R·Σ f·m² + Vf·I): the inductor's energy
 * ∮ L·i di closes over a period. Duties, IL and the means are iterated to a fixed point; the coupling is
 * weak (R·T/L ≪ 1, R·I ≪ V), so a few iterations reach 1e-13. A region test only needs to know on which
 * side of a duty limit the fixed point lies: once the iteration contracts (each change under half the
 * one before, so the rest of the path is shorter than the last change) and the duty is further past
 * the limit than EARLY_MARGIN changes, the test stops there (the full iteration reaches the same verdict).
 * Ideal limits: buck D1 = Vout/Vin with D3 = 0; boost D3 = 1 − Vin/Vout with D1 = 1, IL = Iout/(1 − D3).
 *
 * Regions, in this order (common practice; each controller family has its own hand-over):
 *   buck        D3 = 0 (Q3 off, Q4 on or D2 conducting), when the buck duty D1 ≤ dutyMax and < 1;
 *   boost       D1 = 1 (Q1 on, Q2 off), when the boost duty D3 ≥ dutyMin and > 0;
 *   buck-boost  otherwise: the transition region, where both legs switch every period. The buck leg runs at
 *               D1 = min(dutyMax, Vout·(1 − dutyMin)/Vin) and the boost leg at D3 = 1 − D1·Vin/Vout ≥
 *               dutyMin (ideal forms): the boost leg sits at its minimum on-time while the buck leg can
 *               still regulate, then the buck leg sits at its maximum and the boost leg regulates. This is
 *               one common way to run the transition; others alternate whole buck and boost cycles, or
 *               switch both legs together (the two-switch buck-boost, higher ripple); real controllers
 *               differ in phasing and hysteresis. Where a leg's duty meets its limit the other jumps: at
 *               the boost edge Q1 goes from 100 % to dutyMax, at the buck edge Q3 from 0 to dutyMin.
 * With dutyMin = 0 and dutyMax = 1 (ideal technology) the transition region collapses to the single point
 * Vin = Vout (+ drops), where D1 = 1 and D3 = 0: Q1 and Q4 stay on and the stage passes Vin through.
 */
import type { Design } from '../engine/design.ts';
import { type FourSwitchDrops, L1, newDrops, readDrops } from './four-switch-parts.ts';

export type FourSwitchRegion = 'buck' | 'boost' | 'buck-boost';

/**
 * One operating point: its inputs, filled by the caller (input voltage, load current, and the period
 * over the inductance T/L in s/H; numbers travel in this object rather than as arguments, which V8 boxes
 * when a call stays out of line), and the CCM steady state: duties, inductor currents at the interval
 * edges (A) and interval voltages (V).
 */
export interface FourSwitchPoint {
  vinV: number;
  ioutA: number;
  tOverL: number;
  region: FourSwitchRegion;
  d1: number;
  d3: number;
  ilA: number;
  /** iL at the start of A (= end of C), end of A, end of B. */
  i0A: number;
  i1A: number;
  i2A: number;
  vAV: number;
  vBV: number;
  vCV: number;
  converged: boolean;
}

export function newPoint(): FourSwitchPoint {
  return {
    vinV: 0,
    ioutA: 0,
    tOverL: 0,
    region: 'buck',
    d1: 0,
    d3: 0,
    ilA: 0,
    i0A: 0,
    i1A: 0,
    i2A: 0,
    vAV: 0,
    vBV: 0,
    vCV: 0,
    converged: false,
  };
}

const MAX_ITER = 200;
/** Fixed-point tolerance on the duties and on IL relative to the load current. */
const TOL = 1e-14;
/** Fractions this far below zero mean the leg arrangement cannot regulate here. */
const FRACTION_SLACK = 1e-12;
/** Last-iteration change accepted when the iteration cycles at rounding level instead of settling. */
const ROUNDING_TOL = 1e-10;
/** A region test stops once the free duty is this many last changes past its limit (see the header). */
const EARLY_MARGIN = 100;

/** Outcomes of solveWithLegHeld. */
const FAILED = 0;
const SOLVED = 1;
/** Stopped early: the fixed point lies clearly past the caller's duty limit (a region test's "no"). */
const BEYOND = 2;

/** Whether the last solveWithLegHeld wrote `out` at least once (it returns before that on a bad start). */
let wroteOut = false;

/** The held leg's duty and the region test's limit for solveWithLegHeld (numbers in an array, not arguments). */
const leg = new Float64Array(2);
const LEG_HELD = 0;
const LEG_LIMIT = 1;

/**
 * Solve the three-interval averaged model with one leg's duty held at leg[LEG_HELD]: `fix = 'd3'` holds
 * the boost leg (solve D1), `fix = 'd1'` holds the buck leg (solve D3); the operating point (Vin, Iout,
 * T/L) comes from `out`. leg[LEG_LIMIT] (NaN: none) is the region test's bound on the free duty —
 * D1 ≤ limit, or D3 ≥ limit — and lets the iteration stop early with BEYOND when the fixed point clearly
 * misses it. Returns FAILED when the duty leaves [0, 1] or the iteration runs away (drops too large).
 */
function solveWithLegHeld(d: Design, r: FourSwitchDrops, fix: 'd1' | 'd3', out: FourSwitchPoint): number {
  const vin = out.vinV;
  const vout = Math.abs(d.voutV);
  const iout = out.ioutA;
  const tOverL = out.tOverL;
  const held = leg[LEG_HELD];
  const limit = leg[LEG_LIMIT];
  const rA = r.rq1Ohm + r.rlOhm + r.rq3Ohm;
  const rB = r.rq1Ohm + r.rlOhm + r.r4Ohm;
  const rC = r.r2Ohm + r.rlOhm + r.r4Ohm;
  const eA = vin;
  const eB = vin - vout - r.vf2V;
  const eC = -vout - r.vf2V - r.vf1V;
  let d1 = fix === 'd1' ? held : Math.min(1, (vout * (1 - held)) / vin);
  let d3 = fix === 'd3' ? held : Math.min(0.99, Math.max(0, 1 - (held * vin) / vout));
  let il = iout / (1 - d3);
  let dA = 0;
  let dB = 0;
  let dC = 0;
  const iScale = Math.max(Math.abs(iout), 1e-12);
  let change = Number.POSITIVE_INFINITY;
  // the last completed iterate's edge currents and interval voltages, written to `out` on the way out
  let i0 = 0;
  let dIA = 0;
  let dIB = 0;
  let vA = 0;
  let vB = 0;
  let vC = 0;
  let done = 0;
  let status = FAILED;
  for (; done < MAX_ITER; done++) {
    const nA = eA - rA * (il + dA);
    const nB = eB - rB * (il + dB);
    const nC = eC - rC * (il + dC);
    let n1 = d1;
    let n3 = d3;
    if (fix === 'd3') {
      const den = nB - nC;
      if (!(den > 0)) break;
      n1 = (d3 * (nB - nA) - nC) / den;
    } else {
      const den = nA - nB;
      if (!(den > 0)) break;
      n3 = -(d1 * nB + (1 - d1) * nC) / den;
    }
    const fA = n3;
    const fB = n1 - n3;
    const fC = 1 - n1;
    if (fA < -FRACTION_SLACK || fB < -FRACTION_SLACK || fC < -FRACTION_SLACK || !(fB + fC > 0)) break;
    // ripple shape from iL = 0 at the start of A; offset i0 from the output charge balance
    const nIA = nA * fA * tOverL;
    const nIB = nB * fB * tOverL;
    const muA = 0.5 * nIA;
    const muB = nIA + 0.5 * nIB;
    const muC = 0.5 * (nIA + nIB);
    const mu = fA * muA + fB * muB + fC * muC;
    const n0 = (iout - fB * muB - fC * muC) / (fB + fC);
    const ilNext = n0 + mu;
    if (!Number.isFinite(ilNext) || n3 >= 1) break;
    const last = change;
    change = Math.abs(n1 - d1) + Math.abs(n3 - d3) + Math.abs(ilNext - il) / iScale;
    d1 = n1;
    d3 = n3;
    il = ilNext;
    dA = muA - mu;
    dB = muB - mu;
    dC = muC - mu;
    i0 = n0;
    dIA = nIA;
    dIB = nIB;
    vA = nA;
    vB = nB;
    vC = nC;
    if (change < TOL) {
      status = SOLVED;
      done++;
      break;
    }
    if (change < 0.5 * last) {
      // contracting: the fixed point is within one last change of here (see the header)
      const margin = EARLY_MARGIN * change;
      if (fix === 'd3' ? d1 > limit + margin : d3 < limit - margin && d3 > margin && fB + fC > margin) {
        status = BEYOND;
        done++;
        break;
      }
    }
  }
  // a 2-cycle at rounding level still counts as converged
  if (done === MAX_ITER && change < ROUNDING_TOL) status = SOLVED;
  out.converged = status === SOLVED;
  wroteOut = done > 0;
  if (wroteOut) {
    out.d1 = d1;
    out.d3 = d3;
    out.ilA = il;
    out.i0A = i0;
    out.i1A = i0 + dIA;
    out.i2A = i0 + dIA + dIB;
    out.vAV = vA;
    out.vBV = vB;
    out.vCV = vC;
  }
  return status;
}

/**
 * Region and loss-inclusive duties at the operating point in `out` (vinV, ioutA, tOverL: switching
 * period over the inductance, s/H), CCM, in the order of the header comment.
 */
export function solveFourSwitch(d: Design, r: FourSwitchDrops, out: FourSwitchPoint): void {
  // The buck and boost regions have two intervals, where the fixed point has a closed form; the
  // iteration below serves the transition region (and anything the closed forms do not settle).
  const buck = solveBuckClosed(d, r, out);
  if (buck === IN_REGION) return;
  const boost = solveBoostClosed(d, r, out);
  if (boost === IN_REGION) return;
  // Both two-interval solutions exist and miss their regions: the transition region, as the iteration's
  // own region tests would conclude (same fixed points). Otherwise let the iteration sort it out.
  if (buck === OUTSIDE && boost === OUTSIDE && solveTransition(d, r, out, true, false)) return;
  solveFourSwitchByIteration(d, r, out);
}

/** Outcomes of the closed forms: the point is in the region (out written), has a solution outside it, or none. */
const IN_REGION = 0;
const OUTSIDE = 1;
const NO_SOLUTION = 2;

/** solveFourSwitch by the fixed-point iteration alone, every region (the tests' reference for the closed forms). */
export function solveFourSwitchByIteration(d: Design, r: FourSwitchDrops, out: FourSwitchPoint): void {
  // A test that stopped early leaves `out` short of its fixed point; that only shows when the solve
  // that follows fails before its first write. Then the region is found again without early stops.
  if (!solveRegion(d, r, out, true)) solveRegion(d, r, out, false);
}

/**
 * The buck region in closed form (D3 = 0, intervals B and C only). With two intervals the ripple's
 * segment means equal IL, and the output charge balance gives IL = Iout exactly, so the volt-second
 * balance D1·vB + (1 − D1)·vC = 0 is linear: D1 = −vC/(vB − vC) — the header's fixed point in one step.
 * Writes `out` only when the point is in the buck region (D1 < 1 and ≤ dutyMax).
 */
function solveBuckClosed(d: Design, r: FourSwitchDrops, out: FourSwitchPoint): number {
  const vin = out.vinV;
  const iout = out.ioutA;
  const tOverL = out.tOverL;
  const vout = Math.abs(d.voutV);
  const il = iout;
  const vB = vin - vout - r.vf2V - (r.rq1Ohm + r.rlOhm + r.r4Ohm) * il;
  const vC = -vout - r.vf2V - r.vf1V - (r.r2Ohm + r.rlOhm + r.r4Ohm) * il;
  const den = vB - vC;
  if (!(den > 0)) return NO_SOLUTION;
  const d1 = -vC / den;
  if (!(d1 >= 0)) return NO_SOLUTION;
  if (!(d1 < 1 && d1 <= d.dutyMax)) return OUTSIDE;
  const dIB = vB * d1 * tOverL;
  // the empty interval A would sit at the start of B, half a ripple below IL
  const vA = vin - (r.rq1Ohm + r.rlOhm + r.rq3Ohm) * (il - 0.5 * dIB);
  out.region = 'buck';
  out.d1 = d1;
  out.d3 = 0;
  out.ilA = il;
  out.i0A = il - 0.5 * dIB;
  out.i1A = out.i0A;
  out.i2A = out.i0A + dIB;
  out.vAV = vA;
  out.vBV = vB;
  out.vCV = vC;
  out.converged = true;
  return IN_REGION;
}

/**
 * The boost region in closed form (D1 = 1, intervals A and B only). Again the segment means equal IL,
 * now IL = Iout·u with u = 1/(1 − D3), and the balance D3·vA + (1 − D3)·vB = 0 becomes
 *   rA·Iout·u² − (Vin + (rA − rB)·Iout)·u + (Vout + Vf2) = 0
 * (vA = Vin − rA·IL, vB = Vin − Vout − Vf2 − rB·IL), whose smaller root is the one the iteration reaches
 * from the ideal duty (the larger lies past the loss-limited peak ratio); cancellation-free 2c/(q + √…).
 * Writes `out` only when the point is in the boost region (0 < D3, dutyMin ≤ D3).
 */
function solveBoostClosed(d: Design, r: FourSwitchDrops, out: FourSwitchPoint): number {
  const vin = out.vinV;
  const iout = out.ioutA;
  const tOverL = out.tOverL;
  const vout = Math.abs(d.voutV);
  const rA = r.rq1Ohm + r.rlOhm + r.rq3Ohm;
  const rB = r.rq1Ohm + r.rlOhm + r.r4Ohm;
  const rC = r.r2Ohm + r.rlOhm + r.r4Ohm;
  const b = rA * iout;
  const q = vin + (rA - rB) * iout;
  const c = vout + r.vf2V;
  const disc = q * q - 4 * b * c;
  if (!(q > 0) || !(disc >= 0)) return NO_SOLUTION;
  const u = (2 * c) / (q + Math.sqrt(disc));
  const d3 = 1 - 1 / u;
  if (!(d3 < 1)) return NO_SOLUTION;
  if (!(d3 > 0 && d3 >= d.dutyMin)) return OUTSIDE;
  const il = iout * u;
  const vA = vin - rA * il;
  const vB = vin - vout - r.vf2V - rB * il;
  const dIA = vA * d3 * tOverL;
  out.region = 'boost';
  out.d1 = 1;
  out.d3 = d3;
  out.ilA = il;
  out.i0A = il - 0.5 * dIA;
  out.i1A = out.i0A + dIA;
  out.i2A = out.i0A; // B returns the current to its start (balance)
  out.vAV = vA;
  out.vBV = vB;
  // the empty interval C would sit at the end of B, half a ripple below IL
  out.vCV = -vout - r.vf2V - r.vf1V - rC * (il - 0.5 * dIA);
  out.converged = true;
  return IN_REGION;
}

/** solveFourSwitch's region order; false when an early stop may have left its mark on `out`. */
function solveRegion(d: Design, r: FourSwitchDrops, out: FourSwitchPoint, early: boolean): boolean {
  const vin = out.vinV;
  const vout = Math.abs(d.voutV);
  leg[LEG_HELD] = 0;
  leg[LEG_LIMIT] = early ? d.dutyMax : Number.NaN;
  const buck = solveWithLegHeld(d, r, 'd3', out);
  if (buck === SOLVED && out.d1 < 1 && out.d1 <= d.dutyMax) {
    out.region = 'buck';
    return true;
  }
  let stopped = buck === BEYOND;
  leg[LEG_HELD] = 1;
  leg[LEG_LIMIT] = early ? d.dutyMin : Number.NaN;
  const boost = solveWithLegHeld(d, r, 'd1', out);
  if (boost === SOLVED && out.d3 > 0 && out.d3 >= d.dutyMin) {
    out.region = 'boost';
    return true;
  }
  if (boost === FAILED && vin < vout) {
    // the boost solution ran away: the drops eat the input; report it as such (not converged)
    out.region = 'boost';
    out.converged = false;
    return !stopped || wroteOut;
  }
  stopped ||= boost === BEYOND;
  return solveTransition(d, r, out, early, stopped);
}

/**
 * The transition region (both legs switch): the boost leg held at its minimum on-time while the buck
 * leg can regulate, else the buck leg held at its maximum. `stopped`: an earlier region test stopped
 * early (see solveFourSwitchByIteration); false when that may have left its mark on `out`.
 */
function solveTransition(
  d: Design,
  r: FourSwitchDrops,
  out: FourSwitchPoint,
  early: boolean,
  stoppedBefore: boolean,
): boolean {
  let stopped = stoppedBefore;
  out.region = 'buck-boost';
  leg[LEG_HELD] = d.dutyMin;
  leg[LEG_LIMIT] = early ? d.dutyMax : Number.NaN;
  const held = solveWithLegHeld(d, r, 'd3', out);
  if (held === SOLVED && out.d1 <= d.dutyMax) return true;
  const heldWrote = wroteOut;
  stopped ||= held === BEYOND;
  leg[LEG_HELD] = d.dutyMax;
  leg[LEG_LIMIT] = Number.NaN;
  solveWithLegHeld(d, r, 'd1', out);
  return !stopped || wroteOut || (heldWrote && held !== BEYOND);
}

/**
 * Input band (V) of the transition region at one load, found by bisection on the region boundaries:
 * loV = highest input still in the boost region, hiV = lowest input already in the buck region. For the
 * ideal technology both collapse onto Vout.
 */
export function transitionBandV(d: Design, iout: number, out: { loV: number; hiV: number }): void {
  const r = newDrops();
  readDrops(d, r);
  const pt = newPoint();
  const vout = Math.abs(d.voutV);
  const tOverL = 1 / (d.params.fswHz * d.parts[L1].value);
  pt.ioutA = iout;
  pt.tOverL = tOverL;
  const regionAt = (vin: number) => {
    pt.vinV = vin;
    solveFourSwitch(d, r, pt);
    return pt.region;
  };
  const span = Math.max(4 * vout, (2 * vout) / Math.max(d.dutyMax, 0.05));
  out.loV = bisect(1e-3 * vout, span, (v) => regionAt(v) !== 'boost');
  out.hiV = bisect(1e-3 * vout, span, (v) => regionAt(v) === 'buck');
}

/** Smallest x in [lo, hi] where a monotone predicate turns true (to 1e-9 relative). */
function bisect(lo: number, hi: number, turnsTrue: (x: number) => boolean): number {
  let a = lo;
  let b = hi;
  for (let i = 0; i < 200 && b - a > 1e-9 * b; i++) {
    const m = 0.5 * (a + b);
    if (turnsTrue(m)) b = m;
    else a = m;
  }
  return b;
}
