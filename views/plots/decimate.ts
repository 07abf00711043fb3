/**
 * Fewer points for an SVG trace without losing what an engineer looks for: per pixel column keep the
 * first, the smallest, the largest and the last sample (in time order), so peaks, edges and ringing
 * envelopes survive and a 20 000-sample start-up becomes a path of a few thousand points.
 */

/** Indices of the samples to draw; all of them when there are fewer than about 4 per column. */
export function decimateMinMax(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  columns: number,
): number[] {
  const n = Math.min(timeS.length, values.length);
  if (n === 0) return [];
  const all = () => Array.from({ length: n }, (_, i) => i);
  if (n <= 4 * columns || columns < 1) return all();
  const t0 = timeS[0];
  const span = timeS[n - 1] - t0;
  if (!(span > 0)) return all();
  const keep: number[] = [];
  let i = 0;
  while (i < n) {
    const column = Math.min(columns - 1, Math.floor(((timeS[i] - t0) / span) * columns));
    const first = i;
    let lo = i;
    let hi = i;
    while (i < n && Math.min(columns - 1, Math.floor(((timeS[i] - t0) / span) * columns)) === column) {
      if (values[i] < values[lo]) lo = i;
      if (values[i] > values[hi]) hi = i;
      i++;
    }
    const last = i - 1;
    for (const k of [...new Set([first, lo, hi, last])].sort((a, b) => a - b)) keep.push(k);
  }
  return keep;
}
