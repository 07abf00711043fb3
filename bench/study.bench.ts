/**
 * Study benchmark: the default study (every topology × 32 frequencies × 4 ripple ratios × rectifiers,
 * objectives parts, loss, stress) of the demo spec data/specs/marine-lifepo4-12v.yaml.
 * Run directly: `npx tsx bench/study.bench.ts`, or import `run()` for the report lines.
 * Goal: under 100 ms on the 2-core machine. Reports the whole serial study, then its two halves (engine
 * evaluations vs the study's own ranking, verdicts, sweeps and summary), then the worker-thread path.
 */
import { loadavg } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { loadSpecFile, loadTechnology } from '../src/spec/load.ts';
import { assembleStudy } from '../src/study/assemble.ts';
import { planStudy } from '../src/study/enumerate.ts';
import { studyOptionsOrThrow } from '../src/study/options.ts';
import { runStudyParallel } from '../src/study/parallel.ts';
import { evaluateForStudy, runStudy } from '../src/study/run-study.ts';

const DEMO = fileURLToPath(new URL('../data/specs/marine-lifepo4-12v.yaml', import.meta.url));
const REPEATS = 5;

interface Timing {
  medianMs: number;
  minMs: number;
  cpuMs: number;
}

function time(fn: () => void, repeats = REPEATS): Timing {
  const runs: { ms: number; cpuMs: number }[] = [];
  for (let r = 0; r < repeats; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    const ms = performance.now() - t0;
    const c = process.cpuUsage(c0);
    runs.push({ ms, cpuMs: (c.user + c.system) / 1000 });
  }
  runs.sort((a, b) => a.ms - b.ms);
  const median = runs[Math.floor(runs.length / 2)];
  return { medianMs: median.ms, minMs: runs[0].ms, cpuMs: median.cpuMs };
}

const fmt = (t: Timing) =>
  `median ${t.medianMs.toFixed(0)} ms, min ${t.minMs.toFixed(0)} ms, cpu ${t.cpuMs.toFixed(0)} ms`;

export async function run(): Promise<string[]> {
  const loaded = loadSpecFile(DEMO);
  if (!loaded.ok) throw new Error('demo spec invalid');
  const spec = loaded.spec;
  const tech = loadTechnology(spec.technology);
  const options = studyOptionsOrThrow(spec);
  const plan = planStudy(spec, options);
  const n = plan.candidates.length;
  const lines = [
    `study: default study of the marine demo spec, ${n} candidates (load average ${loadavg()[0].toFixed(1)})`,
  ];

  const cold = time(() => runStudy(spec, tech), 1);
  lines.push(`  first run (cold JIT)        ${cold.medianMs.toFixed(0)} ms`);
  const whole = time(() => runStudy(spec, tech));
  lines.push(
    `  whole study, one thread     ${fmt(whole)}  (${((1000 * whole.medianMs) / n).toFixed(0)} µs per candidate; goal 100 ms)`,
  );

  let evaluations = plan.candidates.map((c) => evaluateForStudy(spec, c, tech));
  const engine = time(() => {
    evaluations = plan.candidates.map((c) => evaluateForStudy(spec, c, tech));
  });
  lines.push(`  engine evaluations          ${fmt(engine)}`);
  const assemble = time(() => assembleStudy(spec, options, plan, evaluations));
  lines.push(`  rank + verdicts + summary   ${fmt(assemble)}`);

  const t0 = performance.now();
  await runStudyParallel(spec, tech, {}, { threshold: 1, threads: 2 });
  lines.push(
    `  worker threads (2), forced  ${(performance.now() - t0).toFixed(0)} ms wall, including worker start-up`,
  );
  return lines;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const line of await run()) console.log(line);
}
