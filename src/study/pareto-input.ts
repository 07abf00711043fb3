/**
 * Input checking and normalisation shared by the Pareto sorters.
 *
 * Every sorter works on one flat, row-major Float64Array of n × m objective values. Callers may hand
 * either an array of vectors (m taken from the vectors) or such a flat array with m given. A non-finite
 * objective is a programming error upstream (an evaluation that produced NaN, an unset field), not data,
 * so it is thrown as a typed error naming the point and the objective instead of being ranked.
 */

/** Points as an array of objective vectors, or a flat row-major Float64Array of n × m values. */
export type PointsInput = ArrayLike<number>[] | Float64Array;

/** A NaN or ±Infinity objective value reached the sorter. */
export class ParetoInputError extends Error {
  /** Index of the offending point. */
  readonly index: number;
  /** Index of the offending objective within the point's vector. */
  readonly objective: number;
  readonly value: number;

  constructor(index: number, objective: number, value: number) {
    super(
      `Pareto sort: point ${index}, objective ${objective} is ${value}; objectives must be finite numbers`,
    );
    this.name = 'ParetoInputError';
    this.index = index;
    this.objective = objective;
    this.value = value;
  }
}

/** A flat, checked copy (or view) of the points. */
export interface FlatPoints {
  /** Row-major: objective k of point i is `values[i * m + k]`. */
  values: Float64Array;
  n: number;
  m: number;
}

/**
 * Checks the shape and finiteness of the points and returns them flat.
 * A Float64Array input is used as is (not copied); an array of vectors is copied once.
 */
export function flattenPoints(points: PointsInput, m?: number): FlatPoints {
  if (points instanceof Float64Array) {
    if (m === undefined || !Number.isInteger(m) || m < 1) {
      throw new RangeError(
        `Pareto sort: a flat Float64Array needs the objective count m (an integer >= 1), got ${m}`,
      );
    }
    if (points.length % m !== 0) {
      throw new RangeError(`Pareto sort: flat array length ${points.length} is not a multiple of m = ${m}`);
    }
    const n = points.length / m;
    checkFinite(points, n, m);
    return { values: points, n, m };
  }
  const n = points.length;
  const width = n > 0 ? points[0].length : (m ?? 1);
  if (m !== undefined && m !== width) {
    throw new RangeError(`Pareto sort: m = ${m} but the first vector has ${width} objectives`);
  }
  if (width < 1) throw new RangeError('Pareto sort: points need at least one objective');
  const values = new Float64Array(n * width);
  for (let i = 0; i < n; i++) {
    const p = points[i];
    if (p.length !== width) {
      throw new RangeError(`Pareto sort: point ${i} has ${p.length} objectives, expected ${width}`);
    }
    for (let k = 0; k < width; k++) values[i * width + k] = p[k];
  }
  checkFinite(values, n, width);
  return { values, n, m: width };
}

function checkFinite(values: Float64Array, n: number, m: number): void {
  for (let i = 0; i < n * m; i++) {
    const v = values[i];
    // v - v is 0 for finite v and NaN for NaN and ±Infinity: one test for both.
    if (v - v !== 0) throw new ParetoInputError(Math.floor(i / m), i % m, v);
  }
}
