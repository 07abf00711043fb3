/**
 * The study as plain data: what was swept, every candidate with its rank and verdict, the front, the
 * recommendation and the per-topology frequency sweeps. Produced by runStudy (src/study/run-study.ts),
 * rendered by src/report/study-*.ts. SI units; the unit is in each field name.
 */
import type { Caution, Evaluation, Objectives, Reason, RectifierKind, TopologyId } from '../engine/types.ts';
import type { RailSpec } from '../spec/rail-spec.ts';

export type ObjectiveKey = keyof Objectives;

/** Options after defaults and validation (src/study/options.ts). */
export interface StudyOptions {
  /** Objectives the front is sorted on (minimised), in the user's order. */
  objectives: ObjectiveKey[];
  /** Number of switching frequencies on the log grid over the band (≥ 2). */
  frequencyPoints: number;
  /** Switching-frequency band swept (Hz); the spec's band unless overridden. */
  band: { minHz: number; maxHz: number };
  /** Inductor ripple ratios swept. */
  ripples: number[];
  /** Weight of each objective in the recommendation, same order as `objectives`. */
  weights: number[];
  /** Relative tolerance of ε-grouping for the plot (0 = off). */
  epsilon: number;
  /** Largest number of candidates a study may enumerate. */
  maxCandidates: number;
}

/** What a study needs of an engine Evaluation: the corners and part list stay out (they are big). */
export type CandidateEvaluation = Omit<Evaluation, 'corners' | 'parts'>;

/** One objective compared between two candidates: subject minus other. */
export interface ObjectiveDelta {
  objective: ObjectiveKey;
  value: number;
  other: number;
  /** value − other (negative: the subject is better, objectives are minimised). */
  delta: number;
  /** delta / |other| (0 when other is 0 and the values are equal). */
  relative: number;
}

/** Trade-off of a front member against one of its neighbours on the front. */
export interface FrontTrade {
  neighbour: string;
  /** Objectives where the subject is worse than the neighbour (what it gives up). */
  givesUp: ObjectiveDelta[];
  /** Objectives where the subject is better (what it gains in exchange). */
  gains: ObjectiveDelta[];
}

export type Verdict =
  | {
      kind: 'front';
      /** Objectives on which it has the front's lowest value (ties included). */
      bestAt: ObjectiveKey[];
      trades: FrontTrade[];
      text: string;
    }
  | {
      kind: 'dominated';
      rank: number;
      /** The front member chosen to explain it: the nearest dominator in normalised objective space. */
      by: string;
      /** How much better `by` is on each chosen objective (subject − by ≥ 0). */
      margins: ObjectiveDelta[];
      /** How many front members dominate it. */
      dominatorCount: number;
      text: string;
    }
  | { kind: 'infeasible'; reasons: Reason[]; text: string };

export interface StudyCandidate {
  id: string;
  topology: TopologyId;
  fswHz: number;
  ripple: number;
  rect: RectifierKind;
  feasible: boolean;
  objectives: Objectives;
  /** Efficiency at the nominal-input full-load corner. */
  efficiencyNom: number;
  /** Pareto rank over the feasible candidates (1 = front); null when infeasible. */
  rank: number | null;
  /** Crowding distance within its rank (Infinity at a rank's extremes); null when infeasible. */
  crowding: number | null;
  /** Id of its ε-group representative (itself when it represents); null when grouping is off or infeasible. */
  representative: string | null;
  verdict: Verdict;
  reasons: Reason[];
  cautions: Caution[];
}

export interface SweepPoint {
  fswHz: number;
  /** Best nominal efficiency among the feasible variants (ripple × rectifier) at this frequency. */
  efficiency: number;
  /** Smallest volume among the feasible variants at this frequency (mm³). */
  volumeMm3: number;
  efficiencyId: string;
  volumeId: string;
}

export interface SweepHighlights {
  bestEfficiency: { fswHz: number; efficiency: number; id: string };
  smallestVolume: { fswHz: number; volumeMm3: number; id: string };
  /** Knee of the efficiency–volume curve between the two (definition in src/study/sweeps.ts). */
  knee: { fswHz: number; efficiency: number; volumeMm3: number; distance: number };
}

export interface Exclusion {
  topology: TopologyId;
  reason: string;
}

export interface TopologyComparison {
  topology: TopologyId;
  /** Its best candidate by the recommendation score. */
  id: string;
  score: number;
  deltas: ObjectiveDelta[];
  text: string;
}

export interface InfeasibleTopology {
  topology: TopologyId;
  candidates: number;
  /** Reason codes by how many candidates broke them, most frequent first, with one example message. */
  reasons: { code: string; candidates: number; example: string }[];
  text: string;
}

export interface StudySummary {
  recommended: string | null;
  score: number | null;
  /** Next best candidate overall by the same score. */
  runnerUp: string | null;
  comparisons: TopologyComparison[];
  infeasibleTopologies: InfeasibleTopology[];
  /** The recommendation in one sentence (or why there is none). */
  headline: string;
  /** Why it beats the best of each other topology (or the runner-up), one sentence each. */
  details: string[];
  /** headline and details as one paragraph, all from the numbers. */
  text: string;
}

export interface Study {
  spec: RailSpec;
  options: StudyOptions;
  candidates: StudyCandidate[];
  /** Ids of rank-1 candidates, in candidate order. */
  front: string[];
  summary: StudySummary;
  /** Feasible-only series per topology, ascending frequency. */
  sweeps: Partial<Record<TopologyId, SweepPoint[]>>;
  highlights: Partial<Record<TopologyId, SweepHighlights>>;
  excluded: Exclusion[];
}
