/**
 * Evaluate one candidate: size (or take pinned) parts at the worst corner, then report every corner,
 * the feasibility reasons, cautions and objectives.
 */
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { getTopology } from '../topologies/registry.ts';
import type { OperatingScalars, Topology } from '../topologies/topology.ts';
import { generalCautions } from './cautions.ts';
import { cornersFor, nominalCorner } from './corners.ts';
import { blankPart, type Design } from './design.ts';
import { computeLosses, LOSS_KINDS } from './losses.ts';
import { summarizeParts } from './part-summary.ts';
import { applyPins } from './pins.ts';
import { newScalars, sizeDesign } from './size.ts';
import type {
  CandidateParams,
  ComponentStress,
  Corner,
  CornerResult,
  Evaluation,
  Pins,
  Reason,
} from './types.ts';
import { WaveSet } from './wave.ts';

export class EngineError extends Error {
  constructor(
    message: string,
    readonly parameter: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'EngineError';
  }
}

export interface CornerDetail extends CornerResult {
  iinA: number;
  duty2: number;
  lossByKind: Record<string, number>;
}

export function createDesign(
  topology: Topology,
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
): Design {
  const comps = topology.components(params.rect);
  const fsw = params.fswHz;
  const d: Design = {
    params,
    voutV: topology.outputSign * spec.output.voltageV,
    components: comps,
    parts: comps.map(blankPart),
    coupling: comps.some((c) => c.role === 'coupled-inductor') ? tech.inductor.coupling : 0,
    busV: 0,
    busMargin: tech.busMargin,
    ideal: tech.ideal,
    dutyMin: tech.controller.minOnS * fsw,
    dutyMax: Math.min(tech.controller.maxDuty, 1 - tech.controller.minOffS * fsw),
  };
  applyPins(d, pins);
  topology.prepare?.(d, spec);
  return d;
}

export interface SizedCandidate {
  topology: Topology;
  design: Design;
  corners: Corner[];
  /** Reasons found while sizing (polarity, voltage classes, ripple reach, topology-level limits). */
  reasons: Reason[];
}

/** Size (or take pinned) every part of a candidate: the design the reports, netlists and simulations use. */
export function designCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
): SizedCandidate {
  const topology = getTopology(params.topology);
  if (!topology) throw new EngineError(`unknown topology ${params.topology}`, 'topology');
  if (!topology.rectifiers.includes(params.rect)) {
    throw new EngineError(`${params.topology} has no ${params.rect} rectifier variant`, 'rect');
  }
  const corners = cornersFor(spec, topology);
  const design = createDesign(topology, spec, params, tech, pins);
  const reasons: Reason[] = [];
  if (
    spec.output.polarity !== 'either' &&
    (spec.output.polarity === 'positive') !== topology.outputSign > 0
  ) {
    reasons.push({
      code: 'polarity-mismatch',
      message: `${topology.title} gives a ${topology.outputSign > 0 ? 'positive' : 'negative'} output; the spec asks for ${spec.output.polarity}`,
    });
  }
  reasons.push(...sizeDesign(topology, design, spec, tech, corners));
  reasons.push(...(topology.reasons?.(design, spec) ?? []));
  return { topology, design, corners, reasons };
}

export interface EvaluateOptions {
  /** Build the human-readable part list (default true; a sweep that discards it skips the formatting). */
  partList?: boolean;
}

export function evaluateCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
  options: EvaluateOptions = {},
): Evaluation {
  const { topology, design: d, corners, reasons } = designCandidate(spec, params, tech, pins);
  const results = corners.map((c) => evaluateCorner(topology, d, tech, c));
  reasons.push(...cornerReasons(topology, d, spec, corners, results));
  if (d.coupling > 0) {
    const l1 = d.parts.find((p) => p.name === 'L1')!;
    const l2 = d.parts.find((p) => p.name === 'L2')!;
    if (Math.abs(l1.value - l2.value) > 1e-6 * Math.max(l1.value, l2.value)) {
      reasons.push({
        code: 'coupled-inductances-unequal',
        value: l2.value,
        limit: l1.value,
        message: `coupled windings must be equal: L1 = ${l1.value} H, L2 = ${l2.value} H`,
      });
    }
  }

  const full = results.filter((_, i) => corners[i].fullLoad);
  const nom = results[corners.indexOf(nominalCorner(corners))];
  const pout = spec.output.voltageV * spec.load.maxA;
  const semis = d.parts.filter((p) => p.role === 'switch' || p.role === 'sync' || p.role === 'diode');
  let stress = 0;
  for (const p of semis) {
    const vPk = Math.max(...full.map((r) => r.components[p.name].vPeakV));
    const iPk = Math.max(...full.map((r) => r.components[p.name].iPeakA));
    stress += (vPk * iPk) / pout;
  }
  const partsByRole: Record<string, number> = {};
  for (const p of d.parts) partsByRole[p.role] = (partsByRole[p.role] ?? 0) + p.units;
  const parts = Object.values(partsByRole).reduce((a, b) => a + b, 0);
  const volumeMm3 = d.parts.reduce((a, p) => a + p.volumeMm3, 0);
  const scal = newScalars();
  scal.duty = nom.duty;
  const cautions = [
    ...(topology.cautions?.(d, spec, scal) ?? []),
    ...generalCautions(topology, d, corners, results),
  ];

  return {
    topology: params.topology,
    fswHz: params.fswHz,
    ripple: params.ripple,
    rect: params.rect,
    feasible: reasons.length === 0,
    reasons,
    cautions,
    objectives: { parts, lossW: Math.max(...full.map((r) => r.lossW)), stress, volumeMm3 },
    partsByRole,
    busV: d.busV > 0 ? d.busV : undefined,
    efficiencyNom: nom.efficiency,
    corners: results,
    parts: options.partList === false ? [] : summarizeParts(d, tech, results),
  };
}

const scratch = new Map<number, { w: WaveSet; per: Float64Array; kinds: Float64Array }>();

function scratchFor(n: number) {
  let s = scratch.get(n);
  if (!s) {
    s = { w: new WaveSet(n), per: new Float64Array(n), kinds: new Float64Array(LOSS_KINDS.length) };
    scratch.set(n, s);
  }
  return s;
}

/**
 * The allocation-free inner loop: steady state and losses of a sized design at one operating point,
 * into caller-owned buffers. Returns the total loss (W). This is what the benchmark counts.
 */
export function operateWithLosses(
  topology: Topology,
  d: Design,
  tech: Technology,
  vinV: number,
  ioutA: number,
  w: WaveSet,
  s: OperatingScalars,
  perPart: Float64Array,
  byKind: Float64Array,
): number {
  w.data.fill(0);
  topology.operate(d, vinV, ioutA, w, s);
  return computeLosses(d, tech, vinV, w, perPart, byKind);
}

export function evaluateCorner(topology: Topology, d: Design, tech: Technology, c: Corner): CornerDetail {
  const n = d.parts.length;
  const { w, per, kinds } = scratchFor(n);
  const s: OperatingScalars = newScalars();
  const lossW = operateWithLosses(topology, d, tech, c.vinV, c.ioutA, w, s, per, kinds);
  const T = 1 / d.params.fswHz;
  const components: Record<string, ComponentStress> = {};
  for (let k = 0; k < n; k++) {
    const p = d.parts[k];
    const mx = w.max(k);
    const mn = w.min(k);
    const isCap = p.role === 'capacitor' || p.role === 'damping-capacitor';
    components[p.name] = {
      value: p.value,
      iAvgA: w.average(k),
      iRmsA: w.rms(k),
      iPeakA: Math.max(Math.abs(mx), Math.abs(mn)),
      iPpA: mx - mn,
      vPeakV: w.vPeak(k),
      vPpV: isCap && p.value > 0 ? (w.chargeSwing(k) * T) / p.value + p.esrOhm * (mx - mn) : 0,
      lossW: per[k],
    };
  }
  const poutW = Math.abs(d.voutV) * c.ioutA;
  const lossByKind: Record<string, number> = {};
  LOSS_KINDS.forEach((kind, i) => {
    lossByKind[kind] = kinds[i];
  });
  return {
    label: c.label,
    vinV: c.vinV,
    ioutA: c.ioutA,
    voutV: d.voutV,
    duty: s.duty,
    duty2: s.duty2,
    mode: s.mode,
    efficiency: poutW / (poutW + lossW),
    lossW,
    pinW: poutW + lossW,
    poutW,
    iinA: s.iinA,
    lossByKind,
    components,
    ...(s.converged ? {} : { notConverged: true }),
  };
}

function cornerReasons(
  topology: Topology,
  d: Design,
  spec: RailSpec,
  corners: Corner[],
  results: CornerDetail[],
): Reason[] {
  const out: Reason[] = [];
  const fsw = d.params.fswHz;
  results.forEach((r, i) => {
    const c = corners[i];
    const s = r as CornerDetail & { notConverged?: boolean };
    if (s.notConverged && c.fullLoad) {
      out.push({
        code: 'not-converged',
        corner: c.label,
        message: `${c.label}: no steady state with these drops (the stage cannot reach ${Math.abs(d.voutV)} V from ${c.vinV} V)`,
      });
      return;
    }
    if (!c.fullLoad) {
      if (r.mode === 'dcm' && spec.load.ccmRequired) {
        out.push({
          code: 'dcm-light-load',
          corner: c.label,
          value: c.ioutA,
          message: `${c.label}: discontinuous conduction at ${c.ioutA} A while the spec requires CCM`,
        });
      }
      return;
    }
    const duties = dutiesOf(topology, r);
    for (const duty of duties) {
      if (duty > d.dutyMax + 1e-12) {
        out.push({
          code: 'duty-above-max',
          corner: c.label,
          value: duty,
          limit: d.dutyMax,
          message: `${c.label}: duty ${(duty * 100).toFixed(1)} % above the ${(d.dutyMax * 100).toFixed(1)} % allowed at ${(fsw / 1e3).toFixed(0)} kHz (min off-time, controller ceiling)`,
        });
      }
      if (duty > 0 && duty < d.dutyMin - 1e-12) {
        out.push({
          code: 'duty-below-min-on-time',
          corner: c.label,
          value: duty,
          limit: d.dutyMin,
          message: `${c.label}: duty ${(duty * 100).toFixed(1)} % below the ${(d.dutyMin * 100).toFixed(1)} % that the minimum on-time allows at ${(fsw / 1e3).toFixed(0)} kHz`,
        });
      }
    }
  });
  return out;
}

/** The commanded duties at a corner that must respect min on/off time. */
function dutiesOf(_t: Topology, r: CornerDetail): number[] {
  return r.duty2 > 0 ? [r.duty, r.duty2] : [r.duty];
}
