/**
 * Pareto sorter benchmark: sortNonDominated (ranks + crowding + fronts) on random point sets.
 * Run directly: `npx tsx bench/pareto.bench.ts`, or import `run()` for the report lines.
 *
 * Sets (deterministic, mulberry32 generator, seed fixed):
 *  - uniform: objectives independent and uniform in [0, 1) — many fronts of moderate size;
 *  - shell: directions uniform on the positive octant of the unit sphere, radius 1 … 1.02 — a thin
 *    curved band, so few, large fronts (closer to a converter sweep where most designs trade off);
 * The growth exponent between sizes n₁ < n₂ is log(t₂ / t₁) / log(n₂ / n₁): 1 for linear, 2 for quadratic.
 * Goal: 10⁶ points × 3 objectives in under 1 s on the 2-core machine.
 */
import { loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import { sortNonDominated, sortNonDominatedBrute } from '../src/study/pareto.ts';

type Kind = 'uniform' | 'shell';

function mulberry32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) | 0;
    let t = Math.imul(s ^ (s >>> 15), 1 | s);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function makePoints(kind: Kind, n: number, m: number, seed: number): Float64Array {
  const rnd = mulberry32(seed);
  const out = new Float64Array(n * m);
  const w = new Float64Array(m);
  for (let i = 0; i < n; i++) {
    if (kind === 'uniform') {
      for (let k = 0; k < m; k++) out[i * m + k] = rnd();
      continue;
    }
    let norm = 0;
    for (let k = 0; k < m; k++) {
      w[k] = Math.abs(gaussian(rnd));
      norm += w[k] * w[k];
    }
    const radius = (1 + 0.02 * rnd()) / Math.sqrt(norm);
    for (let k = 0; k < m; k++) out[i * m + k] = w[k] * radius;
  }
  return out;
}

function gaussian(rnd: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
}

interface Timing {
  medianMs: number;
  minMs: number;
  /** Process CPU time (user + system) of the median run: less sensitive than wall time to other load. */
  cpuMs: number;
  fronts: number;
}

function timeSort(points: Float64Array, m: number, repeats: number): Timing {
  const runs: { ms: number; cpuMs: number }[] = [];
  let fronts = 0;
  for (let r = 0; r < repeats; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const result = sortNonDominated(points, m);
    const ms = performance.now() - t0;
    const c = process.cpuUsage(c0);
    runs.push({ ms, cpuMs: (c.user + c.system) / 1000 });
    fronts = result.fronts.length;
  }
  runs.sort((a, b) => a.ms - b.ms);
  const median = runs[Math.floor(runs.length / 2)];
  return { medianMs: median.ms, minMs: runs[0].ms, cpuMs: median.cpuMs, fronts };
}

function fmt(ms: number): string {
  return ms < 10 ? ms.toFixed(2) : ms.toFixed(0);
}

export async function run(): Promise<string[]> {
  const lines: string[] = [];
  lines.push('pareto: sortNonDominated (ranks + crowding + fronts), median of repeats after one warm-up');
  lines.push(
    `  machine load average at start: ${loadavg()
      .map((x) => x.toFixed(2))
      .join(' ')} (wall times grow with it)`,
  );
  // warm the JIT on every code path once
  for (const m of [2, 3, 4]) sortNonDominated(makePoints('uniform', 20_000, m, 99), m);

  const cases: { kind: Kind; m: number; sizes: number[] }[] = [
    { kind: 'uniform', m: 3, sizes: [1e4, 1e5, 1e6] },
    { kind: 'shell', m: 3, sizes: [1e4, 1e5, 1e6] },
    { kind: 'uniform', m: 2, sizes: [1e4, 1e5, 1e6] },
    { kind: 'shell', m: 2, sizes: [1e4, 1e5, 1e6] },
    { kind: 'uniform', m: 4, sizes: [1e4, 1e5] },
    { kind: 'shell', m: 4, sizes: [1e4, 1e5] },
  ];
  for (const c of cases) {
    let previous: { n: number; ms: number } | undefined;
    for (const n of c.sizes) {
      const points = makePoints(c.kind, n, c.m, 12345 + n);
      const repeats = n >= 1e6 ? 3 : n >= 1e5 ? 5 : 9;
      const t = timeSort(points, c.m, repeats);
      const growth = previous
        ? (Math.log(t.medianMs / previous.ms) / Math.log(n / previous.n)).toFixed(2)
        : '-';
      lines.push(
        `  ${c.kind.padEnd(7)} m=${c.m} n=${n.toExponential(0).padEnd(4)} median ${fmt(t.medianMs).padStart(6)} ms` +
          `  min ${fmt(t.minMs).padStart(6)} ms  cpu ${fmt(t.cpuMs).padStart(6)} ms  fronts ${String(t.fronts).padStart(5)}  growth exponent ${growth}`,
      );
      previous = { n, ms: t.medianMs };
    }
  }

  // the O(n² m) reference at a size it can still do, to show what the fast sorter saves
  const n = 2000;
  const points = makePoints('uniform', n, 3, 7);
  const t0 = performance.now();
  const slow = sortNonDominatedBrute(points, 3);
  const t1 = performance.now();
  const fast = sortNonDominated(points, 3);
  const t2 = performance.now();
  const same = slow.rank.every((r, i) => r === fast.rank[i]);
  lines.push(
    `  reference O(n² m) at n=${n}, m=3: ${fmt(t1 - t0)} ms vs fast ${fmt(t2 - t1)} ms; ranks equal: ${same}`,
  );
  return lines;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const line of await run()) console.log(line);
}
