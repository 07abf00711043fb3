/**
 * Candidate enumeration: every applicable topology of the registry × switching frequency on a log grid over
 * the band × ripple ratio × rectifier the topology offers. Topologies whose output sign the spec's polarity
 * does not allow are listed as excluded with the reason, never silently dropped.
 */
import type { CandidateParams, RectifierKind, TopologyId } from '../engine/types.ts';
import type { Polarity, RailSpec } from '../spec/rail-spec.ts';
import { TOPOLOGIES } from '../topologies/registry.ts';
import type { Topology } from '../topologies/topology.ts';
import type { Exclusion, StudyOptions } from './types.ts';

export interface PlannedCandidate extends CandidateParams {
  id: string;
}

export interface StudyPlan {
  candidates: PlannedCandidate[];
  excluded: Exclusion[];
}

/**
 * n frequencies spaced evenly in log(f) from minHz to maxHz inclusive: f_i = minHz · (maxHz/minHz)^(i/(n−1)).
 * The endpoints are returned exactly (no rounding through exp/log).
 */
export function logGrid(minHz: number, maxHz: number, n: number): number[] {
  if (!(n >= 2) || !Number.isInteger(n)) throw new RangeError(`logGrid: n must be an integer >= 2, got ${n}`);
  if (!(minHz > 0 && maxHz > minHz))
    throw new RangeError(`logGrid: need 0 < minHz < maxHz, got ${minHz}, ${maxHz}`);
  const ratio = maxHz / minHz;
  const out: number[] = [];
  for (let i = 0; i < n; i++)
    out.push(i === 0 ? minHz : i === n - 1 ? maxHz : minHz * ratio ** (i / (n - 1)));
  return out;
}

/** Compact frequency label with `digits` significant digits: 400000 → '400k', 1.29e6 → '1.29M'. */
export function frequencyLabel(fswHz: number, digits = 3): string {
  const [scale, suffix] = fswHz >= 1e6 ? [1e6, 'M'] : fswHz >= 1e3 ? [1e3, 'k'] : [1, ''];
  const text = Number((fswHz / scale).toPrecision(digits)).toString();
  return `${text}${suffix}`;
}

/**
 * Labels for a grid: 3 significant digits, more only where needed to keep every label distinct
 * (a fine grid), so ids stay short and stay unique.
 */
export function frequencyLabels(grid: readonly number[]): string[] {
  for (let digits = 3; digits < 12; digits++) {
    const labels = grid.map((f) => frequencyLabel(f, digits));
    if (new Set(labels).size === labels.length) return labels;
  }
  return grid.map((f) => String(f));
}

/** Stable, readable candidate id: `sepic-coupled@400k/r0.3/sync`. */
export function candidateId(
  topology: TopologyId,
  frequency: string,
  ripple: number,
  rect: RectifierKind,
): string {
  return `${topology}@${frequency}/r${ripple}/${rect}`;
}

/** Why a topology cannot serve a polarity, or undefined when it can. */
export function polarityExclusion(topology: Topology, polarity: Polarity): string | undefined {
  const negative = topology.outputSign < 0;
  if (negative && polarity === 'positive') {
    return `${topology.title} inverts (negative output); the spec's output polarity is positive only`;
  }
  if (!negative && polarity === 'negative') {
    return `${topology.title} gives a positive output; the spec's output polarity is negative only`;
  }
  return undefined;
}

/** Topologies of the registry split into applicable ones and exclusions, in registry order. */
export function applicableTopologies(spec: RailSpec): { topologies: Topology[]; excluded: Exclusion[] } {
  const topologies: Topology[] = [];
  const excluded: Exclusion[] = [];
  for (const topology of TOPOLOGIES.values()) {
    const reason = polarityExclusion(topology, spec.output.polarity);
    if (reason === undefined) topologies.push(topology);
    else excluded.push({ topology: topology.id, reason });
  }
  return { topologies, excluded };
}

/** How many candidates a study with these options enumerates, without building them. */
export function countCandidates(
  spec: RailSpec,
  options: Pick<StudyOptions, 'frequencyPoints' | 'ripples'>,
): number {
  const { topologies } = applicableTopologies(spec);
  const variants = topologies.reduce((sum, t) => sum + t.rectifiers.length, 0);
  return variants * options.frequencyPoints * options.ripples.length;
}

/** The candidates in a fixed order: topology (registry order), frequency ascending, ripple as given, rectifier. */
export function planStudy(spec: RailSpec, options: StudyOptions): StudyPlan {
  const { topologies, excluded } = applicableTopologies(spec);
  const grid = logGrid(options.band.minHz, options.band.maxHz, options.frequencyPoints);
  const labels = frequencyLabels(grid);
  const candidates: PlannedCandidate[] = [];
  for (const topology of topologies) {
    grid.forEach((fswHz, i) => {
      for (const ripple of options.ripples) {
        for (const rect of topology.rectifiers) {
          candidates.push({
            id: candidateId(topology.id, labels[i], ripple, rect),
            topology: topology.id,
            fswHz,
            ripple,
            rect,
          });
        }
      }
    });
  }
  return { candidates, excluded };
}
