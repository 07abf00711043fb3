/**
 * `npm run bench`: every benchmark, one after the other, on this machine. Speed is reported here and
 * never asserted in unit tests. Pass names to run a subset: `npm run bench -- engine study`.
 */
import { loadavg } from 'node:os';

const SUITES: Record<string, () => Promise<{ run: () => Promise<string[]> }>> = {
  engine: () => import('./engine.bench.ts'),
  study: () => import('./study.bench.ts'),
  pareto: () => import('./pareto.bench.ts'),
  waveform: () => import('./waveform.bench.ts'),
  simulate: () => import('./simulate.bench.ts'),
};

const wanted = process.argv.slice(2).filter((a) => a in SUITES);
const names = wanted.length ? wanted : Object.keys(SUITES);
console.log(
  `load average at start: ${loadavg()
    .map((x) => x.toFixed(2))
    .join(' ')} (figures are only comparable on a quiet machine)`,
);
for (const name of names) {
  const mod = await SUITES[name]();
  for (const line of await mod.run()) console.log(line);
  console.log('');
}
