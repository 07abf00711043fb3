/**
 * Evaluate one candidate: size (or take pinned) parts at the worst corner, then report every corner,
 * the feasibility reasons, cautions and objectives.
 */
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { getTopology } from '../topologies/registry.ts';
import type { ComponentSpec, Topology } from '../topologies/topology.ts';
import { generalCautions } from './cautions.ts';
import {
  type CornerDetail,
  cornerDetail,
  operateWithLosses,
  resetScalars,
  scratchFor,
} from './corner-evaluate.ts';
import { type CornerFigures, cornerReasons, nominalFigures } from './corner-figures.ts';
import { cornersFor } from './corners.ts';
import { blankPart, type Design, ROLE_DIODE, ROLE_SWITCH, ROLE_SYNC, resetPart } from './design.ts';
import { LOSS_TOTAL } from './losses.ts';
import { summarizeParts } from './part-summary.ts';
import { applyPins } from './pins.ts';
import { newScalars, sizeDesign } from './size.ts';
import type { CandidateParams, Corner, Evaluation, Pins, Reason, RectifierKind } from './types.ts';

// the corner loop and its record live in corner-evaluate.ts; importers reach them through here too
export { type CornerDetail, evaluateCorner, operateWithLosses } from './corner-evaluate.ts';

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

/**
 * A topology's component list for a rectifier choice, built once per topology and rectifier (it is
 * fixed data; a study would otherwise rebuild it for every candidate). Designs share it read-only.
 */
const componentLists = new WeakMap<Topology, Map<RectifierKind, ComponentSpec[]>>();

function componentsOf(topology: Topology, rect: RectifierKind): ComponentSpec[] {
  let byRect = componentLists.get(topology);
  if (!byRect) {
    byRect = new Map();
    componentLists.set(topology, byRect);
  }
  let list = byRect.get(rect);
  if (!list) {
    list = topology.components(rect);
    byRect.set(rect, list);
  }
  return list;
}

export function createDesign(
  topology: Topology,
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
): Design {
  return buildDesign(topology, spec, params, tech, pins, undefined);
}

/** createDesign, optionally into a design built earlier for the same component list (reset in place). */
function buildDesign(
  topology: Topology,
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  reuse: Design | undefined,
): Design {
  const comps = componentsOf(topology, params.rect);
  const fsw = params.fswHz;
  const voutV = topology.outputSign * spec.output.voltageV;
  const coupling = comps.some((c) => c.role === 'coupled-inductor') ? tech.inductor.coupling : 0;
  const dutyMin = tech.controller.minOnS * fsw;
  const dutyMax = Math.min(tech.controller.maxDuty, 1 - tech.controller.minOffS * fsw);
  let d: Design;
  if (reuse && reuse.components === comps) {
    d = reuse;
    d.params = params;
    d.voutV = voutV;
    for (const p of d.parts) resetPart(p);
    d.coupling = coupling;
    d.busV = 0;
    d.busMargin = tech.busMargin;
    d.ideal = tech.ideal;
    d.dutyMin = dutyMin;
    d.dutyMax = dutyMax;
  } else {
    d = {
      params,
      voutV,
      components: comps,
      parts: comps.map(blankPart),
      coupling,
      busV: 0,
      busMargin: tech.busMargin,
      ideal: tech.ideal,
      dutyMin,
      dutyMax,
    };
  }
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
  return sizeCandidate(spec, params, tech, pins, false);
}

/**
 * One reusable design per component list for the summary path: its result holds no reference to the
 * design, so the next candidate of the same topology and rectifier may overwrite it.
 */
const scratchDesigns = new WeakMap<ComponentSpec[], Design>();

function sizeCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  reuseScratch: boolean,
): SizedCandidate {
  const topology = getTopology(params.topology);
  if (!topology) throw new EngineError(`unknown topology ${params.topology}`, 'topology');
  if (!topology.rectifiers.includes(params.rect)) {
    throw new EngineError(`${params.topology} has no ${params.rect} rectifier variant`, 'rect');
  }
  const corners = cornersFor(spec, topology);
  const reuse = reuseScratch ? scratchDesigns.get(componentsOf(topology, params.rect)) : undefined;
  const design = buildDesign(topology, spec, params, tech, pins, reuse);
  if (reuseScratch) scratchDesigns.set(design.components, design);
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

/** An evaluation without its per-corner records and part list: what a study keeps of each candidate. */
export type EvaluationSummary = Omit<Evaluation, 'corners' | 'parts'>;

export function evaluateCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
  options: EvaluateOptions = {},
): Evaluation {
  const sized = designCandidate(spec, params, tech, pins);
  const corners: CornerDetail[] = [];
  const summary = summarizeCandidate(spec, sized, tech, corners);
  return {
    ...summary,
    corners,
    parts: options.partList === false ? [] : summarizeParts(sized.design, tech, corners),
  };
}

/**
 * The same evaluation without the per-corner component records and the part list (a study's path):
 * every field equals evaluateCandidate's, it only skips building what it would drop.
 */
export function evaluateCandidateSummary(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins = {},
): EvaluationSummary {
  return summarizeCandidate(spec, sizeCandidate(spec, params, tech, pins, true), tech, undefined);
}

const cornerScalars = newScalars();
/** average, rms, max, min of one waveform (WaveSet.stats). */
const stats = new Float64Array(4);

/**
 * Every corner of a sized candidate, then its reasons, cautions and objectives. With `details` each
 * corner's full record is pushed there as well (the candidate sheet); without, none is built.
 */
function summarizeCandidate(
  spec: RailSpec,
  sized: SizedCandidate,
  tech: Technology,
  details: CornerDetail[] | undefined,
): EvaluationSummary {
  const { topology, design: d, corners, reasons } = sized;
  const params = d.params;
  const parts = d.parts;
  const n = parts.length;
  const sc = scratchFor(n);
  const { w, per, kinds, vPk, iPk } = sc;
  vPk.fill(Number.NEGATIVE_INFINITY);
  iPk.fill(Number.NEGATIVE_INFINITY);
  let cin = -1;
  for (let k = 0; k < n; k++) if (parts[k].name === 'Cin') cin = k;
  const s = cornerScalars;
  const vout = Math.abs(d.voutV);
  const figures: CornerFigures[] = [];
  let lossW = Number.NEGATIVE_INFINITY;
  for (const c of corners) {
    resetScalars(s);
    operateWithLosses(topology, d, tech, c, w, s, per, kinds);
    const loss = kinds[LOSS_TOTAL];
    if (details) details.push(cornerDetail(d, c, w, s, per, kinds, loss));
    const poutW = vout * c.ioutA;
    figures.push({
      label: c.label,
      vinV: c.vinV,
      ioutA: c.ioutA,
      fullLoad: c.fullLoad,
      duty: s.duty,
      duty2: s.duty2,
      mode: s.mode,
      converged: s.converged,
      lossW: loss,
      poutW,
      pinW: poutW + loss,
      efficiency: poutW / (poutW + loss),
      cinRmsA: cin >= 0 ? w.rms(cin) : undefined,
    });
    if (!c.fullLoad) continue;
    lossW = Math.max(lossW, loss);
    for (let k = 0; k < n; k++) {
      const code = parts[k].roleCode;
      if (code !== ROLE_SWITCH && code !== ROLE_SYNC && code !== ROLE_DIODE) continue;
      w.stats(k, stats);
      vPk[k] = Math.max(vPk[k], w.vPeak(k));
      iPk[k] = Math.max(iPk[k], Math.max(Math.abs(stats[2]), Math.abs(stats[3])));
    }
  }
  reasons.push(...cornerReasons(d, spec.load.ccmRequired, figures));
  if (d.coupling > 0) {
    const l1 = parts.find((p) => p.name === 'L1')!;
    const l2 = parts.find((p) => p.name === 'L2')!;
    if (Math.abs(l1.value - l2.value) > 1e-6 * Math.max(l1.value, l2.value)) {
      reasons.push({
        code: 'coupled-inductances-unequal',
        value: l2.value,
        limit: l1.value,
        message: `coupled windings must be equal: L1 = ${l1.value} H, L2 = ${l2.value} H`,
      });
    }
  }

  const nom = nominalFigures(corners, figures);
  const pout = spec.output.voltageV * spec.load.maxA;
  // stress: Σ over switches and rectifiers of (worst full-load peak V × peak I) / Pout
  let stress = 0;
  for (let k = 0; k < n; k++) {
    const code = parts[k].roleCode;
    if (code === ROLE_SWITCH || code === ROLE_SYNC || code === ROLE_DIODE) stress += (vPk[k] * iPk[k]) / pout;
  }
  const partsByRole: Record<string, number> = {};
  let count = 0;
  let volumeMm3 = 0;
  for (const p of parts) {
    partsByRole[p.role] = (partsByRole[p.role] ?? 0) + p.units;
    volumeMm3 += p.volumeMm3;
  }
  for (const role in partsByRole) count += partsByRole[role];
  const scal = newScalars();
  scal.duty = nom.duty;
  const cautions = [...(topology.cautions?.(d, spec, scal) ?? []), ...generalCautions(topology, d, figures)];

  return {
    topology: params.topology,
    fswHz: params.fswHz,
    ripple: params.ripple,
    rect: params.rect,
    feasible: reasons.length === 0,
    reasons,
    cautions,
    objectives: { parts: count, lossW, stress, volumeMm3 },
    partsByRole,
    busV: d.busV > 0 ? d.busV : undefined,
    efficiencyNom: nom.efficiency,
  };
}
