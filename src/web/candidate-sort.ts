/**
 * Order and filter the study's candidates for the table. Pure; the table view renders the result.
 */
import type { StudyCandidate } from '../study/types.ts';
import type { SortKey, VerdictFilter } from './view-state.ts';

/** Verdict order: front first, then dominated by rank, infeasible last. */
function verdictRank(c: StudyCandidate): number {
  return c.rank ?? Number.POSITIVE_INFINITY;
}

const KEY: Record<SortKey, (c: StudyCandidate) => number | string> = {
  id: (c) => c.id,
  topology: (c) => c.topology,
  fsw: (c) => c.fswHz,
  ripple: (c) => c.ripple,
  rect: (c) => c.rect,
  parts: (c) => c.objectives.parts,
  lossW: (c) => c.objectives.lossW,
  efficiency: (c) => c.efficiencyNom,
  stress: (c) => c.objectives.stress,
  volumeMm3: (c) => c.objectives.volumeMm3,
  verdict: verdictRank,
};

/**
 * Candidates passing the filter, sorted by `key` (stable: ties keep the study's candidate order).
 * Infeasible candidates sort after feasible ones on objective columns in either direction, since their
 * figures are not comparable.
 */
export function sortCandidates(
  candidates: readonly StudyCandidate[],
  key: SortKey,
  dir: 'asc' | 'desc',
  filter: { topology: string; verdict: VerdictFilter },
): StudyCandidate[] {
  const get = KEY[key];
  const sign = dir === 'asc' ? 1 : -1;
  const objectiveColumn = !['id', 'topology', 'fsw', 'ripple', 'rect', 'verdict'].includes(key);
  return candidates
    .map((c, i) => ({ c, i }))
    .filter(({ c }) => filter.topology === 'all' || c.topology === filter.topology)
    .filter(({ c }) => filter.verdict === 'all' || c.verdict.kind === filter.verdict)
    .sort((a, b) => {
      if (objectiveColumn && a.c.feasible !== b.c.feasible) return a.c.feasible ? -1 : 1;
      const va = get(a.c);
      const vb = get(b.c);
      const cmp =
        typeof va === 'number' && typeof vb === 'number'
          ? va === vb
            ? 0
            : va < vb
              ? -1
              : 1
          : String(va).localeCompare(String(vb));
      return sign * cmp || a.i - b.i;
    })
    .map(({ c }) => c);
}
