/**
 * The reasoning attached to every candidate, generated from the numbers:
 *  - front: the objectives where it is the front's best (with the value), or where it sits on each
 *    objective among the front; and what it gives up, and gains, against its two nearest front neighbours
 *    (Euclidean distance in objective space normalised over the front, src/study/normalise.ts);
 *  - dominated: the front member that dominates it at the smallest normalised distance, and by how much
 *    on each chosen objective;
 *  - infeasible: every broken limit, as the engine reported it (value and limit included).
 */
import type { Objectives, Reason } from '../engine/types.ts';
import { type FrontScale, normalisedDistance } from './normalise.ts';
import {
  describeDelta,
  formatObjective,
  OBJECTIVE_WORDS,
  objectiveDelta,
  PRACTICAL_TIE,
} from './objectives.ts';
import type { FrontTrade, ObjectiveDelta, ObjectiveKey, Verdict } from './types.ts';

/** How many nearest front neighbours a front member is compared with. */
export const FRONT_NEIGHBOURS = 2;

export interface VerdictInput {
  ids: readonly string[];
  objectives: readonly Objectives[];
  keys: readonly ObjectiveKey[];
  /** Candidate indices of the front (rank 1). */
  front: readonly number[];
  scale: FrontScale;
  /** Chosen objectives of every candidate, row-major n × keys.length (same order as `keys`). */
  flat: Float64Array;
}

export function ordinal(n: number): string {
  const tens = n % 100;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th');
  return `${n}${suffix}`;
}

export function infeasibleVerdict(reasons: readonly Reason[]): Verdict {
  const text = `infeasible: ${reasons.map((r) => r.message).join('; ')}`;
  return { kind: 'infeasible', reasons: [...reasons], text };
}

export function frontVerdict(i: number, input: VerdictInput): Verdict {
  const { ids, objectives, keys, front, scale } = input;
  const mine = objectives[i];
  const others = front.filter((j) => j !== i);
  const bestAt = keys.filter((k) => front.every((j) => objectives[j][k] >= mine[k]));
  const ties = others.filter((j) => keys.every((k) => objectives[j][k] === mine[k]));
  const neighbours = others
    .filter((j) => !ties.includes(j))
    .map((j) => ({ j, d: normalisedDistance(mine, objectives[j], scale) }))
    .sort((a, b) => a.d - b.d || a.j - b.j)
    .slice(0, FRONT_NEIGHBOURS)
    .map((x) => x.j);
  const trades: FrontTrade[] = neighbours.map((j) => {
    const deltas = keys.map((k) => objectiveDelta(k, mine, objectives[j]));
    return {
      neighbour: ids[j],
      givesUp: deltas.filter((d) => d.delta > 0),
      gains: deltas.filter((d) => d.delta < 0),
    };
  });

  const parts: string[] = [];
  if (front.length === 1) {
    parts.push(
      `the only non-dominated candidate: ${keys.map((k) => `${OBJECTIVE_WORDS[k].noun} ${formatObjective(k, mine[k])}`).join(', ')}`,
    );
  } else if (bestAt.length > 0) {
    parts.push(
      `${bestAt.map((k) => `${OBJECTIVE_WORDS[k].superlative} (${formatObjective(k, mine[k])})`).join(' and ')} of the front`,
    );
  } else {
    const places = keys.map((k) => {
      const place = 1 + front.filter((j) => objectives[j][k] < mine[k]).length;
      return `${OBJECTIVE_WORDS[k].noun} ${formatObjective(k, mine[k])} (${ordinal(place)} of ${front.length})`;
    });
    parts.push(`not best on any single objective: ${places.join(', ')} on the front`);
  }
  if (ties.length > 0) {
    parts.push(`equal on every chosen objective to ${ties.map((j) => ids[j]).join(', ')}`);
  }
  for (const t of trades) {
    // differences under PRACTICAL_TIE are neither given up nor gained: they are named last, as ties
    const real = (d: ObjectiveDelta) => d.objective === 'parts' || Math.abs(d.relative) >= PRACTICAL_TIE;
    const gives = t.givesUp.filter(real).map(describeDelta).join(', ');
    const gains = t.gains.filter(real).map(describeDelta).join(', ');
    const even = [...t.givesUp, ...t.gains]
      .filter((d) => !real(d))
      .map(describeDelta)
      .join(', ');
    const trade = gives && gains ? `${gives}, in exchange for ${gains}` : gives || gains;
    parts.push(`against ${t.neighbour}: ${[trade, even].filter(Boolean).join('; ')}`);
  }
  return { kind: 'front', bestAt, trades, text: `on the front: ${parts.join('; ')}` };
}

export function dominatedVerdict(i: number, rank: number, input: VerdictInput): Verdict {
  const { ids, objectives, keys, front, scale } = input;
  const mine = objectives[i];
  // Hot loop (every dominated candidate × the front): flat rows of the chosen objectives, no object lookups.
  const { flat } = input;
  const m = keys.length;
  let by = -1;
  let best = Number.POSITIVE_INFINITY;
  let dominatorCount = 0;
  for (const j of front) {
    let strict = false;
    let worse = false;
    let d2 = 0;
    for (let k = 0; k < m; k++) {
      const a = flat[j * m + k];
      const b = flat[i * m + k];
      if (a > b) {
        worse = true;
        break;
      }
      if (a < b) strict = true;
      const d = (b - a) / scale.scale[k];
      d2 += d * d;
    }
    if (worse || !strict) continue;
    dominatorCount++;
    if (d2 < best) {
      best = d2;
      by = j;
    }
  }
  if (by < 0) {
    // Cannot happen for a correct sorter: every dominated point is dominated by some rank-1 point.
    throw new Error(`study: ${ids[i]} has rank ${rank} but no front member dominates it`);
  }
  const margins = keys.map((k) => objectiveDelta(k, mine, objectives[by]));
  const fromBy = keys.map((k) => describeDelta(objectiveDelta(k, objectives[by], mine)));
  const more =
    dominatorCount > 1
      ? ` (and by ${dominatorCount - 1} other front member${dominatorCount > 2 ? 's' : ''})`
      : '';
  const text = `dominated (rank ${rank}) by ${ids[by]}${more}, which has ${fromBy.join(', ')}`;
  return { kind: 'dominated', rank, by: ids[by], margins, dominatorCount, text };
}
