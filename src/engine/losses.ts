/**
 * Loss of every component at one operating point, from its waveform and its sized parameters.
 * Writes per-component loss and per-kind totals into caller-owned arrays: no allocation.
 */

import { igseLossDensity } from '../parts/inductor.ts';
import { type MosfetLoss, switchLoss, syncLoss } from '../parts/mosfet.ts';
import type { Technology } from '../parts/technology.ts';
import type { Design } from './design.ts';
import { MAX_SEGMENTS, type WaveSet } from './wave.ts';

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

const mos: MosfetLoss = { conductionW: 0, switchingW: 0, gateW: 0 };
const fr = new Float64Array(MAX_SEGMENTS);
const db = new Float64Array(MAX_SEGMENTS);

/**
 * Fill `perPart[k]` (W) and `byKind[kind]` (W); returns the total loss (W).
 * Conduction loss counts I²R and Vf·I terms, which the duty solution already includes as drops.
 */
export function computeLosses(
  d: Design,
  tech: Technology,
  vinV: number,
  w: WaveSet,
  perPart: Float64Array,
  byKind: Float64Array,
): number {
  byKind.fill(0);
  const fsw = d.params.fswHz;
  const parts = d.parts;
  let total = 0;
  for (let k = 0; k < parts.length; k++) {
    const p = parts[k];
    let loss = 0;
    switch (p.role) {
      case 'switch': {
        switchLoss(
          p.ronOhm,
          p.qgC,
          p.qswC,
          p.qossC,
          p.ratedV,
          tech.mosfet.gateCurrentA,
          fsw,
          vinV,
          w.rms(k),
          w.iOn(k),
          w.iOff(k),
          w.vSw(k),
          mos,
        );
        splitResistive(w, k, p.ronOhm, mos.conductionW, byKind);
        byKind[K_SW] += mos.switchingW;
        byKind[K_GATE] += mos.gateW;
        loss = mos.conductionW + mos.switchingW + mos.gateW;
        break;
      }
      case 'sync': {
        const iR = w.rms(k);
        syncLoss(
          p.ronOhm,
          p.qgC,
          p.qossC,
          p.ratedV,
          d.ideal ? 0 : tech.mosfet.bodyDiodeVfV,
          tech.mosfet.deadTimeS,
          fsw,
          vinV,
          iR,
          w.iOn(k),
          w.iOff(k),
          w.vSw(k),
          mos,
        );
        // only the I²R part is inside the averaged duty model; dead-time diode loss is drawn extra
        const i2r = iR * iR * p.ronOhm;
        splitResistive(w, k, p.ronOhm, i2r, byKind);
        byKind[K_OTHER] += mos.conductionW - i2r;
        byKind[K_SW] += mos.switchingW;
        byKind[K_GATE] += mos.gateW;
        loss = mos.conductionW + mos.switchingW + mos.gateW;
        break;
      }
      case 'diode': {
        const iR = w.rms(k);
        const cond = p.vfV * Math.abs(w.average(k)) + p.rdOhm * iR * iR;
        const v = w.vSw(k);
        const cap = 0.5 * p.cjF * v * v * fsw;
        byKind[K_COND] += p.vfV * Math.abs(w.average(k));
        splitResistive(w, k, p.rdOhm, p.rdOhm * iR * iR, byKind);
        byKind[K_SW] += cap;
        loss = cond + cap;
        break;
      }
      case 'inductor':
      case 'coupled-inductor': {
        const iR = w.rms(k);
        const cu = iR * iR * p.dcrOhm;
        splitResistive(w, k, p.dcrOhm, cu, byKind);
        const core = p.coreM3 > 0 ? p.coreM3 * coreLossDensity(d, tech, w, k) : 0;
        byKind[K_CORE] += core;
        loss = cu + core;
        break;
      }
      case 'capacitor':
      case 'damping-capacitor': {
        const iR = w.rms(k);
        loss = iR * iR * p.esrOhm;
        byKind[K_CAP] += loss;
        break;
      }
      case 'sense': {
        const iR = w.rms(k);
        loss = iR * iR * p.value;
        splitResistive(w, k, p.value, loss, byKind);
        break;
      }
      case 'damping-resistor': {
        const iR = w.rms(k);
        loss = iR * iR * p.value;
        byKind[K_CAP] += loss;
        break;
      }
      case 'controller': {
        loss = d.ideal ? 0 : tech.controller.quiescentA * vinV;
        byKind[K_OTHER] += loss;
        break;
      }
    }
    perPart[k] = loss;
    total += loss;
  }
  return total;
}

/** Book an I²R loss: the segment-mean part as conduction, the ripple part as drawn extra. */
function splitResistive(w: WaveSet, k: number, r: number, total: number, byKind: Float64Array): void {
  const mean = r * w.meanSquareOfMeans(k);
  byKind[K_COND] += mean;
  byKind[K_OTHER] += total - mean;
}

/**
 * Core loss density (W/m³) of the magnetic part whose first winding is component k. The flux follows
 * the winding's linkage λ = L·i (separate) or L1·i1 + M·i2 (coupled, with the other winding k+1).
 */
function coreLossDensity(d: Design, tech: Technology, w: WaveSet, k: number): number {
  const p = d.parts[k];
  const n = w.segments(k);
  const coupled =
    p.role === 'coupled-inductor' && k + 1 < d.parts.length && d.parts[k + 1].role === 'coupled-inductor';
  const m = coupled ? d.coupling * Math.sqrt(p.value * d.parts[k + 1].value) : 0;
  let b = 0;
  let bMax = 0;
  let bMin = 0;
  for (let j = 0; j < n; j++) {
    fr[j] = w.fraction(k, j);
    let dl = p.value * (w.end(k, j) - w.start(k, j));
    if (coupled) dl += m * (w.end(k + 1, j) - w.start(k + 1, j));
    db[j] = dl * p.bPerWb;
    b += db[j];
    if (b > bMax) bMax = b;
    if (b < bMin) bMin = b;
  }
  return igseLossDensity(tech.inductor.material, d.params.fswHz, bMax - bMin, n, fr, db);
}
