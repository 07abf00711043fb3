/**
 * The generic sizer: every topology's parts are chosen by the same rules from the topology's own
 * waveforms, so the comparison between topologies is fair.
 *
 * 1. Inductors from the ripple ratio r: with unit inductance the ripple is ΔI₁ (A·H), so
 *    L = max over full-load corners of ΔI₁ / (r · max |I_L,avg|) — r is relative to the inductor's
 *    largest full-load average current (common practice).
 * 2. Two passes: evaluate every full-load corner with the present parts, re-aim the inductors at the
 *    ripple ratio with the drops now known, then choose every part from the worst corner (voltage
 *    class from peak voltage, MOSFET die for least loss, capacitor banks from the ripple limits and
 *    RMS current, magnetics by area product). The second pass sees the drops of the first.
 * 3. A check with the final parts: an inductor that misses its ripple ratio by more than 1 % either way
 *    (a corner of a mode-changing stage that the final drops moved across a region edge) is re-aimed
 *    and the parts sized again, at most three times; the last check only raises an inductance, so a
 *    corner that keeps flipping between regions never leaves the ripple above its ratio.
 * Pinned values and parasitics are never overwritten.
 */
import { dcBiasFactor, pickCeramicClass, sizeCeramicBank } from '../parts/capacitor.ts';
import { designDampingLeg } from '../parts/damping.ts';
import { diodeVolumeMm3, pickDiodeClass } from '../parts/diode.ts';
import { areaProductM4, sizeInductorCore, windingDcr } from '../parts/inductor.ts';
import {
  chargeLossPerArea,
  hotRonFactor,
  mosfetVolumeMm3,
  optimalArea,
  pickMosfetClass,
} from '../parts/mosfet.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import type { OperatingScalars, Topology } from '../topologies/topology.ts';
import { type Design, type PartDesign, ROLE_CAPACITOR, ROLE_DAMPING_CAPACITOR } from './design.ts';
import type { Corner, Reason } from './types.ts';
import { WaveSet } from './wave.ts';

/** Allowed coupling-capacitor ripple as a fraction of its DC voltage (common practice: small at fsw). */
export const COUPLING_RIPPLE_FRACTION = 0.05;
/** Allowed bus-capacitor ripple of a cascade, fraction of the bus voltage (common practice). */
export const BUS_RIPPLE_FRACTION = 0.02;
/** Input ripple assumed when the spec gives none, fraction of the minimum input (common practice). */
export const DEFAULT_INPUT_RIPPLE_FRACTION = 0.02;
const ELECTROLYTIC_CLASSES_V = [16, 25, 35, 50, 63, 100, 160, 250, 400];

/**
 * Worst-case figures of each component over the full-load corners, plus what the die sizing needs per
 * corner (RMS current and switching edges). Buffers are reused between candidates: a study sizes
 * thousands of them.
 */
interface Envelope {
  iAvg: Float64Array;
  iRms: Float64Array;
  iPeak: Float64Array;
  iPp: Float64Array;
  vPeak: Float64Array;
  vDc: Float64Array;
  chargeC: Float64Array;
  /** Per full-load corner c and part k at c·n + k: RMS current, switched voltage, edge currents. */
  cRms: Float64Array;
  cVsw: Float64Array;
  cIon: Float64Array;
  cIoff: Float64Array;
  /** Input voltage of each full-load corner, and how many there are. */
  cVin: Float64Array;
  corners: number;
}

const MAX_CORNERS = 8;
const envelopes = new Map<number, Envelope>();
const waveSets = new Map<number, WaveSet>();

function scratch(n: number): { e: Envelope; w: WaveSet } {
  let e = envelopes.get(n);
  if (!e) {
    const m = n * MAX_CORNERS;
    e = {
      iAvg: new Float64Array(n),
      iRms: new Float64Array(n),
      iPeak: new Float64Array(n),
      iPp: new Float64Array(n),
      vPeak: new Float64Array(n),
      vDc: new Float64Array(n),
      chargeC: new Float64Array(n),
      cRms: new Float64Array(m),
      cVsw: new Float64Array(m),
      cIon: new Float64Array(m),
      cIoff: new Float64Array(m),
      cVin: new Float64Array(MAX_CORNERS),
      corners: 0,
    };
    envelopes.set(n, e);
    waveSets.set(n, new WaveSet(n));
  }
  return { e, w: waveSets.get(n)! };
}

export function newScalars(): OperatingScalars {
  return { duty: 0, duty2: 0, mode: 'ccm', iinA: 0, converged: true };
}

const envelopeScalars = newScalars();
/** average, rms, max, min of one waveform (WaveSet.stats). */
const stats = new Float64Array(4);

function envelope(topology: Topology, d: Design, corners: Corner[], w: WaveSet, e: Envelope): Envelope {
  const n = d.parts.length;
  e.iAvg.fill(0);
  e.iRms.fill(0);
  e.iPeak.fill(0);
  e.iPp.fill(0);
  e.vPeak.fill(0);
  e.vDc.fill(0);
  e.chargeC.fill(0);
  const s = envelopeScalars;
  const T = 1 / d.params.fswHz;
  let ci = 0;
  for (const c of corners) {
    if (!c.fullLoad || ci >= MAX_CORNERS) continue;
    w.reset();
    topology.operate(d, c, w, s);
    e.cVin[ci] = c.vinV;
    for (let k = 0; k < n; k++) {
      w.stats(k, stats);
      const mx = stats[2];
      const mn = stats[3];
      const rms = stats[1];
      e.iAvg[k] = Math.max(e.iAvg[k], Math.abs(stats[0]));
      e.iRms[k] = Math.max(e.iRms[k], rms);
      e.iPeak[k] = Math.max(e.iPeak[k], Math.abs(mx), Math.abs(mn));
      e.iPp[k] = Math.max(e.iPp[k], mx - mn);
      e.vPeak[k] = Math.max(e.vPeak[k], w.vPeak(k));
      e.vDc[k] = Math.max(e.vDc[k], Math.abs(w.vDc(k)));
      const role = d.parts[k].roleCode;
      if (role === ROLE_CAPACITOR || role === ROLE_DAMPING_CAPACITOR)
        e.chargeC[k] = Math.max(e.chargeC[k], w.chargeSwing(k) * T);
      const at = ci * n + k;
      e.cRms[at] = rms;
      e.cVsw[at] = w.vSw(k);
      e.cIon[at] = w.iOn(k);
      e.cIoff[at] = w.iOff(k);
    }
    ci++;
  }
  e.corners = ci;
  return e;
}

const settable = (p: PartDesign, field: string) => !p.pinned.has(field);

export function sizeDesign(
  topology: Topology,
  d: Design,
  spec: RailSpec,
  tech: Technology,
  corners: Corner[],
): Reason[] {
  const { e: buffers, w } = scratch(d.parts.length);
  const comps = d.components;
  const reasons: Reason[] = [];

  // placeholders so the first evaluation is well defined
  for (let k = 0; k < d.parts.length; k++) {
    const p = d.parts[k];
    const rule = comps[k].sizing;
    if ((rule.kind === 'inductor' || rule.kind === 'winding') && settable(p, 'value')) p.value = 1;
    if ((rule.kind === 'capacitor' || rule.kind === 'damping-capacitor') && settable(p, 'value'))
      p.value = 1e-3;
  }
  // pass 0: inductors from the ripple ratio (ripple at 1 H scales as 1/L)
  const e0 = envelope(topology, d, corners, w, buffers);
  for (let k = 0; k < d.parts.length; k++) {
    const p = d.parts[k];
    if (comps[k].sizing.kind === 'inductor' && settable(p, 'value')) {
      const iRef = Math.max(e0.iAvg[k], 1e-9);
      p.value = e0.iPp[k] / (d.params.ripple * iRef);
    }
  }
  for (let k = 0; k < d.parts.length; k++) {
    const rule = comps[k].sizing;
    if (rule.kind === 'winding' && settable(d.parts[k], 'value'))
      d.parts[k].value = partByName(d, rule.of).value;
  }

  for (let pass = 0; pass < 2; pass++) {
    const e = envelope(topology, d, corners, w, buffers);
    // Re-aim the inductors at the operating points the drops actually give (pass 0 saw lossless
    // parts, which can even put a mode-changing stage in another region): ripple scales as 1/L, so
    // L·ΔI/(r·I) hits the ripple ratio exactly at the present voltages.
    for (let k = 0; k < d.parts.length; k++) {
      const p = d.parts[k];
      if (comps[k].sizing.kind === 'inductor' && settable(p, 'value') && e.iPp[k] > 0) {
        p.value = (p.value * e.iPp[k]) / (d.params.ripple * Math.max(e.iAvg[k], 1e-9));
      }
    }
    sizeParts(d, spec, tech, e, reasons);
  }

  // The last pass set new drops, which can move a corner of a mode-changing stage across a region
  // edge (a four-switch stage at a leg's duty limit): its ripple then follows another law and the
  // ratio is missed. Check with the final parts; while an inductor misses its ratio by more than
  // RIPPLE_MISS either way, re-aim it and size again. Should the corner keep flipping between regions,
  // the last check keeps the larger inductance, so the design never exceeds its ripple ratio.
  for (let extra = 0; extra <= EXTRA_PASSES; extra++) {
    const last = extra === EXTRA_PASSES;
    const e = envelope(topology, d, corners, w, buffers);
    let moved = false;
    for (let k = 0; k < d.parts.length; k++) {
      const p = d.parts[k];
      if (comps[k].sizing.kind === 'inductor' && settable(p, 'value') && e.iPp[k] > 0) {
        const aimed = (p.value * e.iPp[k]) / (d.params.ripple * Math.max(e.iAvg[k], 1e-9));
        const miss = aimed / p.value - 1;
        if (miss > RIPPLE_MISS || (!last && miss < -RIPPLE_MISS)) {
          p.value = aimed;
          moved = true;
        }
      }
    }
    if (!moved) break;
    sizeParts(d, spec, tech, e, reasons);
  }
  return reasons;
}

/** Ripple-ratio miss (relative) that triggers a re-aim after the sizing passes, and how many re-aims. */
const RIPPLE_MISS = 0.01;
const EXTRA_PASSES = 3;

/**
 * Every part from the envelope: coupled windings follow their first winding's inductance, then each
 * part by its rule (reasons replaced by this sizing's).
 */
function sizeParts(d: Design, spec: RailSpec, tech: Technology, e: Envelope, reasons: Reason[]): void {
  const comps = d.components;
  for (let k = 0; k < d.parts.length; k++) {
    const rule = comps[k].sizing;
    if (rule.kind === 'winding' && settable(d.parts[k], 'value'))
      d.parts[k].value = partByName(d, rule.of).value;
  }
  reasons.length = 0;
  for (let k = 0; k < d.parts.length; k++) sizePart(d, spec, tech, comps[k].sizing, k, e, reasons);
}

function partByName(d: Design, name: string): PartDesign {
  const p = d.parts.find((x) => x.name === name);
  if (!p) throw new Error(`sizing rule names unknown component ${name}`);
  return p;
}

function sizePart(
  d: Design,
  spec: RailSpec,
  tech: Technology,
  rule: ReturnType<Topology['components']>[number]['sizing'],
  k: number,
  e: Envelope,
  reasons: Reason[],
): void {
  const p = d.parts[k];
  const fsw = d.params.fswHz;
  switch (rule.kind) {
    case 'switch':
    case 'sync': {
      const cls = pickMosfetClass(tech, e.vPeak[k]);
      if (!cls) {
        reasons.push(noClass(p.name, e.vPeak[k], tech.mosfet.classes.at(-1)?.vdsV ?? 0));
        return;
      }
      p.ratedV = cls.vdsV;
      // die for least loss at the corner where the optimum loss 2√(ab) is largest
      const hot = hotRonFactor(tech, spec.ambientC);
      let best = -1;
      let area = tech.mosfet.minAreaMm2;
      const n = d.parts.length;
      for (let ci = 0; ci < e.corners; ci++) {
        const at = ci * n + k;
        const iR = e.cRms[at];
        const vSw = e.cVsw[at];
        const a = iR * iR * cls.ronSpecOhmMm2 * hot;
        let b = chargeLossPerArea(
          tech,
          cls,
          fsw,
          e.cVin[ci],
          vSw,
          e.cIon[at],
          e.cIoff[at],
          rule.kind === 'switch',
        );
        if (rule.kind === 'sync' && vSw > 0)
          b += 0.5 * cls.qossSpecCPerMm2 * Math.sqrt(vSw / cls.vdsV) * vSw * fsw;
        const cost = a > 0 && b > 0 ? 2 * Math.sqrt(a * b) : a + b;
        if (cost > best) {
          best = cost;
          area = optimalArea(tech, a, b);
        }
      }
      p.areaMm2 = area;
      if (settable(p, 'ronOhm')) p.ronOhm = (cls.ronSpecOhmMm2 * hot) / area;
      if (settable(p, 'qgC')) p.qgC = cls.qgSpecCPerMm2 * area;
      if (settable(p, 'qswC')) p.qswC = cls.qswSpecCPerMm2 * area;
      if (settable(p, 'qossC')) p.qossC = cls.qossSpecCPerMm2 * area;
      p.value = p.ronOhm;
      p.units = 1;
      p.volumeMm3 = mosfetVolumeMm3(area);
      return;
    }
    case 'diode': {
      const cls = pickDiodeClass(tech, e.vPeak[k]);
      if (!cls) {
        reasons.push(noClass(p.name, e.vPeak[k], tech.diode.classes.at(-1)?.vrV ?? 0));
        return;
      }
      p.ratedV = cls.vrV;
      p.ratedA = Math.max(0.5, tech.diode.currentMargin * e.iAvg[k]);
      if (settable(p, 'vfV')) p.vfV = cls.vfV;
      if (settable(p, 'rdOhm')) p.rdOhm = cls.rdOhmA / p.ratedA;
      if (settable(p, 'cjF')) p.cjF = cls.cjFPerA * p.ratedA;
      p.value = p.vfV;
      p.units = 1;
      p.volumeMm3 = diodeVolumeMm3(p.ratedA);
      return;
    }
    case 'inductor': {
      const next = d.parts[k + 1];
      const coupled = p.role === 'coupled-inductor' && next?.role === 'coupled-inductor';
      const m = coupled ? d.coupling * Math.sqrt(p.value * next.value) : 0;
      const linkage = p.value * e.iPeak[k] + (coupled ? m * e.iPeak[k + 1] : 0);
      const iRmsSum = e.iRms[k] + (coupled ? e.iRms[k + 1] : 0);
      const size = sizeInductorCore(tech, areaProductM4(tech, linkage, iRmsSum));
      p.volumeMm3 = size.volumeM3 * 1e9;
      p.coreM3 = size.coreM3;
      p.bPerWb = linkage > 0 ? tech.inductor.material.bMaxT / linkage : 0;
      p.units = 1;
      const share = iRmsSum > 0 ? e.iRms[k] / iRmsSum : 1;
      if (settable(p, 'dcrOhm')) p.dcrOhm = windingDcr(tech, size.copperM3 * share, e.iRms[k]);
      if (coupled) {
        next.units = 0; // same part
        next.volumeMm3 = 0;
        next.coreM3 = 0;
        if (settable(next, 'dcrOhm'))
          next.dcrOhm = windingDcr(tech, size.copperM3 * (1 - share), e.iRms[k + 1]);
      }
      return;
    }
    case 'winding':
      return; // sized with its first winding
    case 'capacitor': {
      const cls = pickCeramicClass(tech, e.vPeak[k]);
      if (!cls) {
        reasons.push(noClass(p.name, e.vPeak[k], tech.capacitor.ceramic.at(-1)?.ratedV ?? 0));
        return;
      }
      const limit = rippleLimit(rule.ripple, spec, e.vDc[k]);
      p.ratedV = cls.ratedV;
      if (settable(p, 'value')) {
        const bank = sizeCeramicBank(tech, cls, e.vDc[k], e.chargeC[k], e.iPp[k], e.iRms[k], limit);
        p.value = bank.effectiveF;
        p.nominalF = bank.nominalF;
        p.units = bank.units;
        if (settable(p, 'esrOhm')) p.esrOhm = bank.esrOhm;
        if (bank.units > tech.capacitor.maxUnits) {
          reasons.push({
            code: 'ripple-unreachable',
            component: p.name,
            value: bank.units,
            limit: tech.capacitor.maxUnits,
            message: `${p.name}: meeting ${(limit * 1e3).toFixed(1)} mV peak-to-peak needs ${bank.units} capacitors of ${(cls.unitF * 1e6).toPrecision(2)} µF, more than the ${tech.capacitor.maxUnits} allowed`,
          });
        }
      } else {
        const cu = cls.unitF * dcBiasFactor(tech, cls, e.vDc[k]);
        p.units = Math.max(1, Math.ceil(p.value / cu - 1e-9));
        p.nominalF = p.units * cls.unitF;
        if (settable(p, 'esrOhm')) p.esrOhm = cls.esrOhm / p.units;
      }
      p.volumeMm3 = p.units * cls.volumeMm3;
      return;
    }
    case 'damping-capacitor':
    case 'damping-resistor': {
      const cs = partByName(d, rule.of);
      const l1 = d.parts.find((x) => x.name === 'L1')?.value ?? 0;
      const l2 = d.parts.find((x) => x.name === 'L2')?.value ?? 0;
      const leg = designDampingLeg(l1 + l2, cs.value);
      p.units = 1;
      if (rule.kind === 'damping-capacitor') {
        if (settable(p, 'value')) p.value = leg.cdF;
        p.nominalF = p.value;
        p.ratedV =
          ELECTROLYTIC_CLASSES_V.find((v) => v * 0.8 >= e.vPeak[k]) ?? ELECTROLYTIC_CLASSES_V.at(-1)!;
        if (settable(p, 'esrOhm')) p.esrOhm = d.ideal ? 0 : tech.capacitor.electrolyticEsrOhm;
        p.volumeMm3 = Math.max(
          tech.capacitor.electrolyticMinMm3,
          tech.capacitor.electrolyticMm3PerUfV * p.value * 1e6 * p.ratedV,
        );
      } else {
        if (settable(p, 'value')) p.value = leg.rdOhm;
        p.volumeMm3 = 10;
      }
      return;
    }
    case 'sense': {
      const of = d.parts.findIndex((x) => x.name === rule.of);
      const ipk = e.iPeak[of];
      if (settable(p, 'value'))
        p.value =
          tech.sense.thresholdV > 0 && ipk > 0 ? tech.sense.thresholdV / (tech.sense.limitMargin * ipk) : 0;
      p.units = p.value > 0 ? 1 : 0;
      p.volumeMm3 = p.units * tech.sense.volumeMm3;
      return;
    }
    case 'controller': {
      p.units = 1;
      p.volumeMm3 = tech.controller.volumeMm3;
      return;
    }
  }
}

function rippleLimit(kind: 'output' | 'input' | 'coupling' | 'bus', spec: RailSpec, vDc: number): number {
  switch (kind) {
    case 'output':
      return spec.ripple.outputVpp;
    case 'input':
      return spec.ripple.inputVpp ?? DEFAULT_INPUT_RIPPLE_FRACTION * spec.input.minV;
    case 'coupling':
      return COUPLING_RIPPLE_FRACTION * vDc;
    case 'bus':
      return BUS_RIPPLE_FRACTION * vDc;
  }
}

function noClass(name: string, vPeak: number, top: number): Reason {
  return {
    code: 'no-voltage-class',
    component: name,
    value: vPeak,
    limit: top,
    message: `${name}: peak voltage ${vPeak.toFixed(1)} V needs a part above the largest class in the technology (${top} V)`,
  };
}
