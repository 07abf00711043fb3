/**
 * Four-switch (non-inverting) buck-boost: components, operating regions and the loss-inclusive duties.
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
 * weak (R·T/L ≪ 1, R·I ≪ V), so a few iterations reach 1e-13.
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
import type { RectifierKind } from '../engine/types.ts';
import type { ComponentSpec } from './topology.ts';

export type FourSwitchRegion = 'buck' | 'boost' | 'buck-boost';

export function fourSwitchComponents(rect: RectifierKind): ComponentSpec[] {
  return [
    {
      name: 'Q1',
      role: 'switch',
      duty: 'buck leg, high side (Vin to node A); on continuously in the boost region',
      sizing: { kind: 'switch' },
    },
    rect === 'diode'
      ? {
          name: 'D1',
          role: 'diode',
          duty: 'buck leg freewheeling diode (ground to node A)',
          sizing: { kind: 'diode' },
        }
      : { name: 'Q2', role: 'sync', duty: 'buck leg, low side (synchronous)', sizing: { kind: 'sync' } },
    {
      name: 'Q3',
      role: 'switch',
      duty: 'boost leg, low side (node B to ground); off in the buck region',
      sizing: { kind: 'switch' },
    },
    rect === 'diode'
      ? {
          name: 'D2',
          role: 'diode',
          duty: 'boost leg output diode (node B to Vout)',
          sizing: { kind: 'diode' },
        }
      : {
          name: 'Q4',
          role: 'sync',
          duty: 'boost leg, high side (synchronous); on continuously in the buck region',
          sizing: { kind: 'sync' },
        },
    {
      name: 'L1',
      role: 'inductor',
      duty: 'the one inductor, between the two legs',
      sizing: { kind: 'inductor' },
    },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'inductor current-sense resistor (carries iL all the time)',
      sizing: { kind: 'sense', of: 'L1' },
    },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor',
      sizing: { kind: 'capacitor', ripple: 'input' },
    },
    {
      name: 'Cout',
      role: 'capacitor',
      duty: 'output capacitor',
      sizing: { kind: 'capacitor', ripple: 'output' },
    },
    {
      name: 'U1',
      role: 'controller',
      duty: 'four-switch buck-boost controller (peak/valley current mode)',
      sizing: { kind: 'controller' },
    },
  ];
}

/** Fixed component slots (same order as fourSwitchComponents for either rectifier). */
export const Q1 = 0;
export const R2 = 1; // Q2 or D1
export const Q3 = 2;
export const R4 = 3; // Q4 or D2
export const L1 = 4;
export const RS = 5;
export const CIN = 6;
export const COUT = 7;
export const U1 = 8;

/** Series resistances (Ω) and diode knees (V) of the conduction paths, from the design's parasitics. */
export interface FourSwitchDrops {
  rq1Ohm: number;
  r2Ohm: number;
  rq3Ohm: number;
  r4Ohm: number;
  /** DCR + Rsense: in the inductor path in every interval. */
  rlOhm: number;
  vf1V: number;
  vf2V: number;
}

export function newDrops(): FourSwitchDrops {
  return { rq1Ohm: 0, r2Ohm: 0, rq3Ohm: 0, r4Ohm: 0, rlOhm: 0, vf1V: 0, vf2V: 0 };
}

export function readDrops(d: Design, out: FourSwitchDrops): void {
  const p = d.parts;
  const sync = d.params.rect === 'sync';
  out.rq1Ohm = p[Q1].ronOhm;
  out.r2Ohm = sync ? p[R2].ronOhm : p[R2].rdOhm;
  out.vf1V = sync ? 0 : p[R2].vfV;
  out.rq3Ohm = p[Q3].ronOhm;
  out.r4Ohm = sync ? p[R4].ronOhm : p[R4].rdOhm;
  out.vf2V = sync ? 0 : p[R4].vfV;
  out.rlOhm = p[L1].dcrOhm + p[RS].value;
}

/** CCM steady state: duties, inductor currents at the interval edges (A) and interval voltages (V). */
export interface FourSwitchPoint {
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

/**
 * Solve the three-interval averaged model with one leg's duty held: `fix = 'd3'` holds the boost leg
 * (solve D1), `fix = 'd1'` holds the buck leg (solve D3). kPerH = T (s) per henry of L1, i.e. T/L (s/H).
 * Returns false when the duty leaves [0, 1] or the iteration runs away (drops too large).
 */
export function solveWithLegHeld(
  vin: number,
  vout: number,
  iout: number,
  tOverL: number,
  r: FourSwitchDrops,
  fix: 'd1' | 'd3',
  held: number,
  out: FourSwitchPoint,
): boolean {
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
  out.converged = false;
  for (let it = 0; it < MAX_ITER; it++) {
    const vA = eA - rA * (il + dA);
    const vB = eB - rB * (il + dB);
    const vC = eC - rC * (il + dC);
    let n1 = d1;
    let n3 = d3;
    if (fix === 'd3') {
      const den = vB - vC;
      if (!(den > 0)) return false;
      n1 = (d3 * (vB - vA) - vC) / den;
    } else {
      const den = vA - vB;
      if (!(den > 0)) return false;
      n3 = -(d1 * vB + (1 - d1) * vC) / den;
    }
    const fA = n3;
    const fB = n1 - n3;
    const fC = 1 - n1;
    if (fA < -FRACTION_SLACK || fB < -FRACTION_SLACK || fC < -FRACTION_SLACK || !(fB + fC > 0)) return false;
    // ripple shape from iL = 0 at the start of A; offset i0 from the output charge balance
    const dIA = vA * fA * tOverL;
    const dIB = vB * fB * tOverL;
    const muA = 0.5 * dIA;
    const muB = dIA + 0.5 * dIB;
    const muC = 0.5 * (dIA + dIB);
    const mu = fA * muA + fB * muB + fC * muC;
    const i0 = (iout - fB * muB - fC * muC) / (fB + fC);
    const ilNext = i0 + mu;
    if (!Number.isFinite(ilNext) || n3 >= 1) return false;
    change = Math.abs(n1 - d1) + Math.abs(n3 - d3) + Math.abs(ilNext - il) / iScale;
    d1 = n1;
    d3 = n3;
    il = ilNext;
    dA = muA - mu;
    dB = muB - mu;
    dC = muC - mu;
    out.d1 = d1;
    out.d3 = d3;
    out.ilA = il;
    out.i0A = i0;
    out.i1A = i0 + dIA;
    out.i2A = i0 + dIA + dIB;
    out.vAV = vA;
    out.vBV = vB;
    out.vCV = vC;
    if (change < TOL) {
      out.converged = true;
      return true;
    }
  }
  // a 2-cycle at rounding level still counts as converged
  out.converged = change < ROUNDING_TOL;
  return out.converged;
}

/**
 * Region and loss-inclusive duties at one operating point (CCM), in the order of the header comment.
 * tOverL: switching period over the inductance (s/H).
 */
export function solveFourSwitch(
  d: Design,
  r: FourSwitchDrops,
  vin: number,
  iout: number,
  tOverL: number,
  out: FourSwitchPoint,
): void {
  const vout = Math.abs(d.voutV);
  if (solveWithLegHeld(vin, vout, iout, tOverL, r, 'd3', 0, out) && out.d1 < 1 && out.d1 <= d.dutyMax) {
    out.region = 'buck';
    return;
  }
  const boostOk = solveWithLegHeld(vin, vout, iout, tOverL, r, 'd1', 1, out);
  if (boostOk && out.d3 > 0 && out.d3 >= d.dutyMin) {
    out.region = 'boost';
    return;
  }
  if (!boostOk && vin < vout) {
    // the boost solution ran away: the drops eat the input; report it as such (not converged)
    out.region = 'boost';
    out.converged = false;
    return;
  }
  out.region = 'buck-boost';
  if (solveWithLegHeld(vin, vout, iout, tOverL, r, 'd3', d.dutyMin, out) && out.d1 <= d.dutyMax) return;
  solveWithLegHeld(vin, vout, iout, tOverL, r, 'd1', d.dutyMax, out);
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
  const regionAt = (vin: number) => {
    solveFourSwitch(d, r, vin, iout, tOverL, pt);
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
