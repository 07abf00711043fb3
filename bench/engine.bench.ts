/**
 * Analytic corner evaluations per second on one core: steady state + every component's losses of a
 * sized design, through the inner loop (operateWithLosses). Sizing happens once per candidate and is
 * timed separately. The timed rounds go round-robin over the topologies (ROUNDS each); every topology
 * reports the median and the fastest of its rounds, and the bytes the loop allocates per corner, read
 * from the young generation over a stretch without garbage collection (0 = allocation-free).
 *
 * The fastest round is the code's own speed on an undisturbed core: other load only ever slows a round
 * down (the reasoning behind taking the minimum time of repeated runs, as Python's timeit documents).
 * The median is what a user of a busy machine sees. How much a shared machine moves is printed first:
 * the spread of a fixed arithmetic loop timed the same number of times.
 */

import { fileURLToPath } from 'node:url';
import { getHeapSpaceStatistics } from 'node:v8';
import { cornersFor } from '../src/engine/corners.ts';
import { createDesign, evaluateCandidate, operateWithLosses } from '../src/engine/evaluate.ts';
import { LOSS_SLOTS, LOSS_TOTAL } from '../src/engine/losses.ts';
import { newScalars, sizeDesign } from '../src/engine/size.ts';
import { WaveSet } from '../src/engine/wave.ts';
import { loadSpecFile, loadTechnology } from '../src/spec/load.ts';
import { TOPOLOGIES } from '../src/topologies/registry.ts';

const DEMO = fileURLToPath(new URL('../data/specs/marine-lifepo4-12v.yaml', import.meta.url));

const ROUNDS = 15;
/** Corners per allocation window: long enough that reading the heap statistics (~2 kB) is noise. */
const ALLOC_WINDOW = 20_000;
/** Five operating points across the demo's input range (10–14.6 V) at full load (2 A). */
const POINTS = [0, 1, 2, 3, 4].map((k) => ({ vinV: 10 + 1.15 * k, ioutA: 2 }));
const PER_ROUND = 50_000;

/** Bytes in use in the young generation (it only grows between collections). */
function youngBytes(): number {
  const space = getHeapSpaceStatistics().find((x) => x.space_name === 'new_space');
  return space ? space.space_used_size : 0;
}

/** Spread of a fixed arithmetic loop over ROUNDS runs: fastest and slowest (ms). */
function steadiness(): { fastMs: number; slowMs: number } {
  const a = new Float64Array(4096);
  for (let i = 0; i < a.length; i++) a[i] = (i % 97) / 97;
  const pass = (): number => {
    let s = 0;
    for (let i = 0; i < 4096; i++) s += a[i] * a[(i * 7) & 4095];
    return s;
  };
  let sink = 0;
  // warm-up for the JIT
  for (let r = 0; r < 5000; r++) sink += pass();
  const times: number[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    const t0 = process.hrtime.bigint();
    for (let r = 0; r < 5000; r++) sink += pass();
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  if (sink === 0) throw new Error('steadiness loop optimised away');
  return { fastMs: Math.min(...times), slowMs: Math.max(...times) };
}

export async function run(): Promise<string[]> {
  const loaded = loadSpecFile(DEMO);
  if (!loaded.ok) throw new Error('demo spec invalid');
  const spec = loaded.spec;
  const tech = loadTechnology('default');
  const steady = steadiness();
  const lines: string[] = [
    `engine: analytic corner evaluations per second (one core, sized design, demo spec, ${ROUNDS} rounds each)`,
    `  machine steadiness: a fixed arithmetic loop took ${steady.fastMs.toFixed(0)}–${steady.slowMs.toFixed(0)} ms ` +
      `over ${ROUNDS} runs (${((steady.slowMs / steady.fastMs - 1) * 100).toFixed(0)} % spread; figures below move as much)`,
    `  ${'topology'.padEnd(24)} median    fastest round`,
  ];
  // Every topology is set up first and the timed rounds go round-robin over them: a slow spell of a
  // shared machine then falls on all topologies alike instead of on whichever ran during it, and the
  // shared hot functions see every topology, as they do in a study.
  const benches = [...TOPOLOGIES.values()].map((topology) => {
    const rect = topology.rectifiers[0];
    const params = { topology: topology.id, fswHz: 400e3, ripple: 0.3, rect };
    const d = createDesign(topology, spec, params, tech);
    const corners = cornersFor(spec, topology);
    sizeDesign(topology, d, spec, tech, corners);
    const w = new WaveSet(d.parts.length);
    const s = newScalars();
    const per = new Float64Array(d.parts.length);
    const kinds = new Float64Array(LOSS_SLOTS);
    // `count` corners, their total loss summed so the work cannot be dropped (a plain loop: a closure
    // returning each corner's loss would box that number whenever the JIT keeps it out of line)
    const runCorners = (count: number): number => {
      let total = 0;
      for (let i = 0; i < count; i++) {
        operateWithLosses(topology, d, tech, POINTS[i % POINTS.length], w, s, per, kinds);
        total += kinds[LOSS_TOTAL];
      }
      return total;
    };
    return { id: topology.id, runCorners, rates: [] as number[] };
  });
  let sink = 0;
  // warm-up for the JIT, every topology before any timing
  for (const b of benches) sink += b.runCorners(50_000);
  for (let round = 0; round < ROUNDS; round++) {
    for (const b of benches) {
      const t0 = process.hrtime.bigint();
      sink += b.runCorners(PER_ROUND);
      b.rates.push(PER_ROUND / (Number(process.hrtime.bigint() - t0) / 1e9));
    }
  }
  let total = 0;
  let totalBest = 0;
  for (const b of benches) {
    b.rates.sort((x, y) => x - y);
    const rate = b.rates[Math.floor(ROUNDS / 2)];
    const best = b.rates[ROUNDS - 1];
    total += rate;
    totalBest += best;
    let bytes = Number.POSITIVE_INFINITY;
    for (let t = 0; t < 20; t++) {
      const before = youngBytes();
      sink += b.runCorners(ALLOC_WINDOW);
      const after = youngBytes();
      // a collection in between shows as a drop: skip that window
      if (after >= before) bytes = Math.min(bytes, (after - before) / ALLOC_WINDOW);
    }
    lines.push(
      `  ${b.id.padEnd(24)} ${(rate / 1e6).toFixed(2)} M/s    ${(best / 1e6).toFixed(2)} M/s ` +
        `(${(1e9 / best).toFixed(0)} ns each), ${bytes.toFixed(1)} B allocated per corner${sink === 0 ? ' !' : ''}`,
    );
  }
  const count = benches.length;
  lines.push(
    `  ${'mean over topologies'.padEnd(24)} ${(total / count / 1e6).toFixed(2)} M/s    ${(totalBest / count / 1e6).toFixed(2)} M/s`,
  );
  // whole-candidate evaluation (sizing + all corners + report objects)
  const m = 2000;
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < m; i++)
    evaluateCandidate(spec, { topology: 'sepic', fswHz: 200e3 + i, ripple: 0.3, rect: 'diode' }, tech);
  const dt = Number(process.hrtime.bigint() - t0) / 1e9;
  lines.push(`  full candidate (size + report), sepic: ${((dt / m) * 1e6).toFixed(0)} µs each`);
  return lines;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  for (const line of await run()) console.log(line);
}
