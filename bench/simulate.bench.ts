/**
 * Candidate simulation benchmark: the exact periodic steady state of a sized SEPIC candidate (marine demo
 * rail, default technology, 400 kHz, diode rectifier, nominal input, full load; goal < 5 ms per solve,
 * each on a freshly compiled circuit), and ngspice (eecircuit-engine, the package the reference tests
 * use; started outside the timed region) reaching the same steady state on the exported netlist.
 *
 * ngspice starts from the analytic engine's initial conditions (seedInitialState: inductor averages and
 * capacitor DC voltages, `uic`, default SPICE export) and runs twice as many periods as the waveform
 * engine's own transient needs from the same start; the period from which ngspice's state stays within
 * SETTLE_RTOL (0.2 % of the largest state of each kind) of the exact steady state is read off its
 * waveforms, and ngspice is charged that share of its run time. The lightly damped coupling network
 * (Q ≈ 30) is what makes that take thousands of periods.
 * Plain script: `npx tsx bench/simulate.bench.ts`.
 */
import { readFileSync } from 'node:fs';
import { Simulation } from 'eecircuit-engine';
import { spiceMap, toSpice } from '../src/report/spice.ts';
import { candidateCircuit } from '../src/simulate/operating-point.ts';
import { runUntilSettled, SETTLE_RTOL } from '../src/simulate/transient-run.ts';
import { loadSpecText, loadTechnology } from '../src/spec/load.ts';
import { seedInitialState } from '../src/topologies/netlists/index.ts';
import { compileCircuit } from '../src/waveform/state-space.ts';
import { solvePeriodicSteadyState } from '../src/waveform/steady-state.ts';

function setup() {
  const r = loadSpecText(
    readFileSync(new URL('../data/specs/marine-lifepo4-12v.yaml', import.meta.url), 'utf8'),
  );
  if (!r.ok) throw new Error('marine spec does not load');
  const params = { topology: 'sepic' as const, fswHz: 400e3, ripple: 0.3, rect: 'diode' as const };
  return candidateCircuit(r.spec, params, loadTechnology('default'), {});
}

function timeSteady(runs: number): { medianMs: number; cpuMs: number } {
  const cc = setup();
  for (let i = 0; i < 10; i++) solvePeriodicSteadyState(cc.netlist); // warm the JIT
  const wall: number[] = [];
  const cpu0 = process.cpuUsage();
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    solvePeriodicSteadyState(cc.netlist, {}, { circuit: compileCircuit(cc.netlist), samples: 200 });
    wall.push(performance.now() - s);
  }
  const cpu = process.cpuUsage(cpu0);
  wall.sort((a, b) => a - b);
  return { medianMs: wall[Math.floor(runs / 2)], cpuMs: (cpu.user + cpu.system) / 1000 / runs };
}

async function timeNgspice(): Promise<{
  ms: number;
  periods: number;
  totalPeriods: number;
  residual: number;
  enginePeriods: number;
}> {
  const cc = setup();
  const circuit = compileCircuit(cc.netlist);
  const exact = solvePeriodicSteadyState(cc.netlist, {}, { circuit });
  const seeded = seedInitialState(cc.netlist, cc.topology, cc.design, cc.vinV, cc.ioutA);
  const seed = Float64Array.from(circuit.stateNames, (name) => {
    const e = seeded.elements.find((x) => x.name === name)!;
    return e.kind === 'L' ? (e.i0 ?? 0) : e.kind === 'C' ? (e.v0 ?? 0) : 0;
  });
  const own = runUntilSettled(cc.netlist, circuit, {
    x0: seed,
    inputs: {},
    target: exact.x0,
    maxPeriods: 50_000,
    samplesPerPeriod: 2,
  });
  const T = 1 / cc.netlist.fswHz;
  // ngspice gets twice the periods the exact transient needed; the time it needed itself is read off after
  const total = 2 * own.periods;
  const text = toSpice(seeded, {
    title: 'bench sepic from analytic ICs',
    tStopS: total * T,
    tStepS: T / 100,
  });
  const console0 = { ...console };
  // ngspice prints its whole log through the console: keep the bench output readable
  console.log = console.info = console.warn = console.error = () => {};
  const sim = new Simulation();
  await sim.start();
  sim.setNetList(text);
  const t0 = performance.now();
  const result = await sim.runSim();
  const ms = performance.now() - t0;
  Object.assign(console, console0);
  const vec = (name: string) =>
    Float64Array.from(result.data.find((d: { name: string }) => d.name === name)!.values as number[]);
  const time = vec('time');
  const map = spiceMap(cc.netlist);
  const nodes = new Map<string, Float64Array>();
  const node = (n: string) => {
    if (n === '0') return new Float64Array(time.length);
    if (!nodes.has(n)) nodes.set(n, vec(`v(${n})`));
    return nodes.get(n)!;
  };
  const nl = circuit.inductors.length;
  const traces = circuit.stateNames.map((name, i) => {
    const p = map.elements[name];
    if (i < nl) return vec(p.current!);
    const a = node(p.stateA!);
    const b = node(p.stateB!);
    return a.map((v, k) => v - b[k]);
  });
  let iMax = 0;
  let vMax = 0;
  exact.x0.forEach((v, i) => {
    if (i < nl) iMax = Math.max(iMax, Math.abs(v));
    else vMax = Math.max(vMax, Math.abs(v));
  });
  // state at each period boundary (linear interpolation), its distance to the exact periodic state
  let j = 0;
  let lastOutside = 0;
  let residual = 0;
  for (let k = 1; k <= total; k++) {
    const t = k * T;
    while (j < time.length - 2 && time[j + 1] < t) j++;
    const f = Math.min(1, Math.max(0, (t - time[j]) / (time[j + 1] - time[j])));
    residual = 0;
    traces.forEach((y, i) => {
      const v = y[j] + f * (y[j + 1] - y[j]);
      residual = Math.max(residual, Math.abs(v - exact.x0[i]) / (i < nl ? iMax : vMax));
    });
    if (residual > SETTLE_RTOL) lastOutside = k;
  }
  const periods = lastOutside + 1;
  // ngspice's cost grows with simulated time: charge it the share of the run it needed
  return {
    ms: (ms * Math.min(periods, total)) / total,
    periods,
    totalPeriods: total,
    residual,
    enginePeriods: own.periods,
  };
}

export async function run(): Promise<string[]> {
  const steady = timeSteady(200);
  const ng = await timeNgspice();
  return [
    `SEPIC candidate periodic steady state: median ${steady.medianMs.toFixed(2)} ms wall, ${steady.cpuMs.toFixed(2)} ms CPU per solve (goal < 5 ms)`,
    `ngspice from the analytic initial conditions: within ${(100 * SETTLE_RTOL).toFixed(1)} % of the exact steady state from period ${ng.periods} on (waveform engine's own transient: ${ng.enginePeriods}); ${ng.totalPeriods} periods simulated, final distance ${(100 * ng.residual).toFixed(3)} %; time charged ${(ng.ms / 1000).toFixed(2)} s`,
    `ratio ngspice / exact steady state: ${(ng.ms / steady.medianMs).toFixed(0)}× (goal ≥ 100×)`,
  ];
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const line of await run()) console.log(line);
}
