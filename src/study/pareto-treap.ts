/**
 * Three-objective rank kernel, guaranteed variant: the staircase sweep of pareto-staircase.ts with each
 * front's staircase in a treap (randomised balanced binary search tree; Seidel & Aragon, "Randomized
 * search trees", Algorithmica, 1996) stored in typed arrays shared by all fronts. Insertion and eviction
 * by split/merge. O(n · log R · log n) expected after sorting, memory O(n), recursion depth O(log n)
 * expected. Slower than the flat arrays of pareto-staircase.ts on ordinary data (pointer chasing), so it
 * is the fallback when those arrays would shift too much.
 */

/** Typed-array treap pool; node j is distinct point j. */
interface Pool {
  key: Int32Array; // objective 2 (search key)
  val: Int32Array; // objective 3
  left: Int32Array;
  right: Int32Array;
  prio: Int32Array;
}

const EMPTY: Pool = {
  key: new Int32Array(0),
  val: new Int32Array(0),
  left: new Int32Array(0),
  right: new Int32Array(0),
  prio: new Int32Array(0),
};
let pool: Pool = EMPTY;
// split results, kept in module variables so the recursion allocates nothing
let splitLeft = -1;
let splitRight = -1;

export function rankSorted3Treap(cols: Int32Array[], u: number): Int32Array {
  const f2 = cols[1];
  const f3 = cols[2];
  pool = {
    key: f2,
    val: f3,
    left: new Int32Array(u).fill(-1),
    right: new Int32Array(u).fill(-1),
    prio: new Int32Array(u),
  };
  // deterministic priorities (xorshift32): same input, same tree shapes, same timings
  let seed = 0x2545f491;
  for (let j = 0; j < u; j++) {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    pool.prio[j] = seed;
  }
  const rank = new Int32Array(u);
  const roots = new Int32Array(u);
  let fronts = 0;
  for (let j = 0; j < u; j++) {
    const x = f2[j];
    const y = f3[j];
    let lo = 0;
    let hi = fronts;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (staircaseCovers(roots[mid], x, y)) lo = mid + 1;
      else hi = mid;
    }
    rank[j] = lo;
    if (lo === fronts) {
      roots[lo] = j;
      fronts++;
    } else {
      roots[lo] = insertEvicting(roots[lo], j, x, y);
    }
  }
  pool = EMPTY; // let the caller's columns be collected
  return rank;
}

/** True iff the staircase rooted at t has an entry with key ≤ x and val ≤ y. */
function staircaseCovers(t: number, x: number, y: number): boolean {
  const { key, val, left, right } = pool;
  let best = -1;
  while (t >= 0) {
    if (key[t] <= x) {
      best = t;
      t = right[t];
    } else {
      t = left[t];
    }
  }
  return best >= 0 && val[best] <= y;
}

/** Inserts node j (key x, val y) and drops the entries it weakly dominates. Returns the new root. */
function insertEvicting(root: number, j: number, x: number, y: number): number {
  splitByKey(root, x); // left: key < x; right: key ≥ x
  const before = splitLeft;
  splitByVal(splitRight, y); // left: val ≥ y (dominated by j, evicted); right: val < y
  const after = splitRight;
  pool.left[j] = -1;
  pool.right[j] = -1;
  return merge(merge(before, j), after);
}

function splitByKey(t: number, x: number): void {
  if (t < 0) {
    splitLeft = -1;
    splitRight = -1;
    return;
  }
  if (pool.key[t] < x) {
    splitByKey(pool.right[t], x);
    pool.right[t] = splitLeft;
    splitLeft = t;
  } else {
    splitByKey(pool.left[t], x);
    pool.left[t] = splitRight;
    splitRight = t;
  }
}

/** Splits off the prefix whose val ≥ y (val descends along the staircase, so it is a prefix). */
function splitByVal(t: number, y: number): void {
  if (t < 0) {
    splitLeft = -1;
    splitRight = -1;
    return;
  }
  if (pool.val[t] >= y) {
    splitByVal(pool.right[t], y);
    pool.right[t] = splitLeft;
    splitLeft = t;
  } else {
    splitByVal(pool.left[t], y);
    pool.left[t] = splitRight;
    splitRight = t;
  }
}

/** Joins two treaps, every key of a before every key of b. */
function merge(a: number, b: number): number {
  if (a < 0) return b;
  if (b < 0) return a;
  if (pool.prio[a] > pool.prio[b]) {
    pool.right[a] = merge(pool.right[a], b);
    return a;
  }
  pool.left[b] = merge(a, pool.left[b]);
  return b;
}
