/**
 * Loss of every component at one operating point, from its waveform and its sized parameters.
 * Writes per-component loss and per-kind totals into caller-owned arrays: no allocation.
 */

import * as inductor from '../parts/inductor.ts';
import { igseInto, igseTriangleInto } from '../parts/inductor.ts';
import { type MosfetLoss, switchLoss, syncLoss } from '../parts/mosfet.ts';
import type { Technology } from '../parts/technology.ts';
import type { OperatingPoint } from '../topologies/topology.ts';
import type { Design } from './design.ts';
import * as roles from './design.ts';
import type { WaveSet } from './wave.ts';
import * as wave from './wave.ts';

/**
 * Loss kinds. `conduction` is exactly what the averaged duty solution carries as drops (segment-mean
 * currents through resistances, Vf·Iavg); everything else, including the ripple part of I²R, is drawn
 * from the input on top of it. The split lets the contract test check the duty solutions exactly.
 */
export const LOSS_KINDS = ['conduction', 'switching', 'gate', 'core', 'capacitor', 'other'] as const;
export type LossKind = (typeof LOSS_KINDS)[number];
export const K_COND = 0;
export const K_SW = 1;
export const K_GATE = 2;
export const K_CORE = 3;
export const K_CAP = 4;
export const K_OTHER = 5;
/** Slot after the kinds where computeLosses writes the total (W); size byKind arrays LOSS_SLOTS. */
export const LOSS_TOTAL = LOSS_KINDS.length;
export const LOSS_SLOTS = LOSS_KINDS.length + 1;

// Imported constants copied into module constants, read once at load: when the modules are compiled
// to CommonJS (tsx does) every read of an imported binding is a property getter, and the loop below
// would pay one per part and per case label.
const ROLE_SWITCH = roles.ROLE_SWITCH;
const ROLE_SYNC = roles.ROLE_SYNC;
const ROLE_DIODE = roles.ROLE_DIODE;
const ROLE_INDUCTOR = roles.ROLE_INDUCTOR;
const ROLE_COUPLED_INDUCTOR = roles.ROLE_COUPLED_INDUCTOR;
const ROLE_CAPACITOR = roles.ROLE_CAPACITOR;
const ROLE_DAMPING_CAPACITOR = roles.ROLE_DAMPING_CAPACITOR;
const ROLE_SENSE = roles.ROLE_SENSE;
const ROLE_DAMPING_RESISTOR = roles.ROLE_DAMPING_RESISTOR;
const ROLE_CONTROLLER = roles.ROLE_CONTROLLER;
const IGSE_FSW = inductor.IGSE_FSW;
const IGSE_DB = inductor.IGSE_DB;
const IGSE_F0 = inductor.IGSE_F0;
const IGSE_F1 = inductor.IGSE_F1;
const IGSE_PV = inductor.IGSE_PV;
const MAX_SEGMENTS = wave.MAX_SEGMENTS;
const WAVE_STRIDE = wave.WAVE_STRIDE;

const mos: MosfetLoss = { conductionW: 0, switchingW: 0, gateW: 0 };
const fr = new Float64Array(MAX_SEGMENTS);
/** Numbers in and out of the iGSE functions (see inductor.ts: no floating-point arguments, no boxing). */
const igse = new Float64Array(inductor.IGSE_SLOTS);
const db = new Float64Array(MAX_SEGMENTS);

// Offsets inside one component's slot block, as documented in wave.ts: [n, f0..f3, a0..a3, b0..b3, w0..w3].
const F = 1;
const A = 1 + MAX_SEGMENTS;
const B = 1 + 2 * MAX_SEGMENTS;
const W = 1 + 3 * MAX_SEGMENTS;
/** A segment's mean square uses these (multiplications, not divisions: the same sums as WaveSet.rms). */
const THIRD = 1 / 3;
const EIGHT_FIFTEENTHS = 8 / 15;

/**
 * Fill `perPart[k]` (W), `byKind[kind]` (W) and the total `byKind[LOSS_TOTAL]` (W). The total is not
 * returned: a returned number is boxed on the heap whenever the call stays out of line (V8).
 * Conduction loss counts I²R and Vf·I terms, which the duty solution already includes as drops.
 *
 * This is the hot loop of every study, so it reads the flat wave buffer directly and takes each part's
 * average, mean square and mean square of segment means in one pass over its segments (the same sums,
 * in the same order, as WaveSet.average, rms and meanSquareOfMeans: the numbers are identical).
 */
export function computeLosses(
  d: Design,
  tech: Technology,
  at: OperatingPoint,
  w: WaveSet,
  perPart: Float64Array,
  byKind: Float64Array,
): void {
  const vinV = at.vinV;
  const fsw = d.params.fswHz;
  const parts = d.parts;
  const data = w.data;
  const iOn = w.iOnA;
  const iOff = w.iOffA;
  const vSw = w.vSwV;
  let cond = 0;
  let sw = 0;
  let gate = 0;
  let core = 0;
  let cap = 0;
  let other = 0;
  let total = 0;
  for (let k = 0; k < parts.length; k++) {
    const p = parts[k];
    const code = p.roleCode;
    let loss = 0;
    if (code === ROLE_CONTROLLER) {
      loss = d.ideal ? 0 : tech.controller.quiescentA * vinV;
      other += loss;
      perPart[k] = loss;
      total += loss;
      continue;
    }
    // one pass: average Σ f·m, mean square Σ f·ms, mean square of the segment means Σ f·m²
    const o = k * WAVE_STRIDE;
    const n = data[o];
    let avg = 0;
    let ms = 0;
    let msm = 0;
    for (let j = 0; j < n; j++) {
      const f = data[o + F + j];
      const a = data[o + A + j];
      const b = data[o + B + j];
      const bw = data[o + W + j];
      const m = 0.5 * (a + b) + (2 / 3) * bw;
      avg += f * m;
      ms += f * ((a * a + a * b + b * b + 2 * bw * (a + b)) * THIRD + bw * bw * EIGHT_FIFTEENTHS);
      msm += f * m * m;
    }
    // mean square current (A²): every loss here is linear in it, so no RMS (square root) is taken
    const i2 = ms;
    switch (code) {
      case ROLE_SWITCH: {
        switchLoss(
          p.ronOhm,
          p.qgC,
          p.qswC,
          p.qossC,
          p.ratedV,
          tech.mosfet.gateCurrentA,
          fsw,
          vinV,
          i2,
          iOn[k],
          iOff[k],
          vSw[k],
          mos,
        );
        // resistive split: the segment-mean part is conduction, the ripple part is drawn extra
        const mean = p.ronOhm * msm;
        cond += mean;
        other += mos.conductionW - mean;
        sw += mos.switchingW;
        gate += mos.gateW;
        loss = mos.conductionW + mos.switchingW + mos.gateW;
        break;
      }
      case ROLE_SYNC: {
        syncLoss(
          p.ronOhm,
          p.qgC,
          p.qossC,
          p.ratedV,
          d.ideal ? 0 : tech.mosfet.bodyDiodeVfV,
          tech.mosfet.deadTimeS,
          fsw,
          vinV,
          i2,
          iOn[k],
          iOff[k],
          vSw[k],
          mos,
        );
        // only the I²R part is inside the averaged duty model; dead-time diode loss is drawn extra
        const i2r = i2 * p.ronOhm;
        const mean = p.ronOhm * msm;
        cond += mean;
        other += i2r - mean;
        other += mos.conductionW - i2r;
        sw += mos.switchingW;
        gate += mos.gateW;
        loss = mos.conductionW + mos.switchingW + mos.gateW;
        break;
      }
      case ROLE_DIODE: {
        const vfI = p.vfV * Math.abs(avg);
        const rdI2 = p.rdOhm * i2;
        const v = vSw[k];
        const cj = 0.5 * p.cjF * v * v * fsw;
        cond += vfI;
        const mean = p.rdOhm * msm;
        cond += mean;
        other += rdI2 - mean;
        sw += cj;
        loss = vfI + rdI2 + cj;
        break;
      }
      case ROLE_INDUCTOR:
      case ROLE_COUPLED_INDUCTOR: {
        const cu = i2 * p.dcrOhm;
        const mean = p.dcrOhm * msm;
        cond += mean;
        other += cu - mean;
        let c = 0;
        if (p.coreM3 > 0) {
          coreLossDensity(d, tech, data, k);
          c = p.coreM3 * igse[IGSE_PV];
        }
        core += c;
        loss = cu + c;
        break;
      }
      case ROLE_CAPACITOR:
      case ROLE_DAMPING_CAPACITOR: {
        loss = i2 * p.esrOhm;
        cap += loss;
        break;
      }
      case ROLE_SENSE: {
        loss = i2 * p.value;
        const mean = p.value * msm;
        cond += mean;
        other += loss - mean;
        break;
      }
      case ROLE_DAMPING_RESISTOR: {
        loss = i2 * p.value;
        cap += loss;
        break;
      }
    }
    perPart[k] = loss;
    total += loss;
  }
  byKind[K_COND] = cond;
  byKind[K_SW] = sw;
  byKind[K_GATE] = gate;
  byKind[K_CORE] = core;
  byKind[K_CAP] = cap;
  byKind[K_OTHER] = other;
  byKind[LOSS_TOTAL] = total;
}

/**
 * Core loss density (W/m³, into igse[IGSE_PV]) of the magnetic part whose first winding is component k.
 * The flux follows the winding's linkage λ = L·i (separate) or L1·i1 + M·i2 (coupled, with winding k+1).
 */
function coreLossDensity(d: Design, tech: Technology, data: Float64Array, k: number): void {
  const p = d.parts[k];
  const o = k * WAVE_STRIDE;
  const o2 = o + WAVE_STRIDE;
  const n = data[o] | 0; // an integer (a Smi when passed on: no boxing)
  const coupled =
    p.roleCode === ROLE_COUPLED_INDUCTOR &&
    k + 1 < d.parts.length &&
    d.parts[k + 1].roleCode === ROLE_COUPLED_INDUCTOR;
  const m = coupled ? d.coupling * Math.sqrt(p.value * d.parts[k + 1].value) : 0;
  if (n === 2) {
    // the usual triangle: two segments whose flux changes cancel exactly (setTriangle writes a→b, b→a)
    let dl0 = p.value * (data[o + B] - data[o + A]);
    let dl1 = p.value * (data[o + B + 1] - data[o + A + 1]);
    if (coupled) {
      dl0 += m * (data[o2 + B] - data[o2 + A]);
      dl1 += m * (data[o2 + B + 1] - data[o2 + A + 1]);
    }
    const db0 = dl0 * p.bPerWb;
    const db1 = dl1 * p.bPerWb;
    const f0 = data[o + F];
    const f1 = data[o + F + 1];
    if (db0 === -db1 && f0 > 0 && f1 > 0) {
      igse[IGSE_FSW] = d.params.fswHz;
      igse[IGSE_DB] = Math.abs(db0);
      igse[IGSE_F0] = f0;
      igse[IGSE_F1] = f1;
      igseTriangleInto(tech.inductor.material, igse);
      return;
    }
  }
  let b = 0;
  let bMax = 0;
  let bMin = 0;
  for (let j = 0; j < n; j++) {
    fr[j] = data[o + F + j];
    let dl = p.value * (data[o + B + j] - data[o + A + j]);
    if (coupled) dl += m * (data[o2 + B + j] - data[o2 + A + j]);
    db[j] = dl * p.bPerWb;
    b += db[j];
    if (b > bMax) bMax = b;
    if (b < bMin) bMin = b;
  }
  igse[IGSE_FSW] = d.params.fswHz;
  igse[IGSE_DB] = bMax - bMin;
  igseInto(tech.inductor.material, n, fr, db, igse);
}
