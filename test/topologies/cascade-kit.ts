/**
 * Test helpers shared by the two cascade suites: demo specs, a design with chosen parts, one operating
 * point, and slow obvious references (sampling a waveform, bisection) to check the fast closed forms.
 */
import { fileURLToPath } from 'node:url';
import type { Design } from '../../src/engine/design.ts';
import { createDesign } from '../../src/engine/evaluate.ts';
import { newScalars } from '../../src/engine/size.ts';
import type { CandidateParams, Pins } from '../../src/engine/types.ts';
import { WaveSet } from '../../src/engine/wave.ts';
import type { Technology } from '../../src/parts/technology.ts';
import { loadSpecFile } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import type { OperatingScalars, Topology } from '../../src/topologies/topology.ts';

/** A demo rail spec from data/specs/. */
export function demoSpec(name: string): RailSpec {
  const r = loadSpecFile(fileURLToPath(new URL(`../../data/specs/${name}.yaml`, import.meta.url)));
  if (!r.ok) throw new Error(`${name}: ${r.issues.map((i) => i.message).join('; ')}`);
  return r.spec;
}

/** A design with only the pinned values and parasitics (everything else zero), bus set by hand. */
export function pinnedDesign(
  t: Topology,
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  busV: number,
): Design {
  const d = createDesign(t, spec, params, tech, pins);
  d.busV = busV;
  return d;
}

export function operateAt(
  t: Topology,
  d: Design,
  vinV: number,
  ioutA: number,
): { w: WaveSet; s: OperatingScalars } {
  const w = new WaveSet(d.parts.length);
  const s = newScalars();
  t.operate(d, { vinV, ioutA }, w, s);
  return { w, s };
}

/** Value of stored waveform k at time t (fraction of the period), by walking its segments. */
export function sampleWave(w: WaveSet, k: number, t: number): number {
  let start = 0;
  const n = w.segments(k);
  for (let j = 0; j < n; j++) {
    const f = w.fraction(k, j);
    if (f > 0 && (t < start + f || j === n - 1))
      return w.start(k, j) + ((w.end(k, j) - w.start(k, j)) * (t - start)) / f;
    start += f;
  }
  return 0;
}

/** Average, RMS and charge swing (fraction of a period, like WaveSet.chargeSwing) of i(t) by sampling. */
export function sampledStats(
  i: (t: number) => number,
  samples = 200_000,
): { avg: number; rms: number; swing: number } {
  let sum = 0;
  let sq = 0;
  for (let n = 0; n < samples; n++) {
    const v = i((n + 0.5) / samples);
    sum += v;
    sq += v * v;
  }
  const avg = sum / samples;
  let q = 0;
  let qMax = 0;
  let qMin = 0;
  for (let n = 0; n < samples; n++) {
    q += (i((n + 0.5) / samples) - avg) / samples;
    qMax = Math.max(qMax, q);
    qMin = Math.min(qMin, q);
  }
  return { avg, rms: Math.sqrt(sq / samples), swing: qMax - qMin };
}

/** Root of f on [lo, hi] by bisection (f(lo) and f(hi) of opposite sign). */
export function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  const fa = f(a);
  if (fa * f(b) > 0) throw new Error(`no sign change of f on [${lo}, ${hi}]`);
  for (let it = 0; it < 200; it++) {
    const m = 0.5 * (a + b);
    if (f(m) > 0 === fa > 0) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}
