/**
 * Waveform engine benchmark: periodic steady state of a separate-inductor SEPIC (goal < 5 ms each),
 * in CCM and at light load (DCM, one diode event per period), each with a fresh circuit (no warm caches:
 * the duty changes every call, as in a sweep). Plain script: `npx tsx bench/waveform.bench.ts`.
 * Reports wall-clock and process CPU time per solve; on a shared machine the CPU figure is the steadier one.
 */
import type { Netlist } from '../src/waveform/netlist.ts';
import { solvePeriodicSteadyState } from '../src/waveform/steady-state.ts';

function sepic(rOhm: number, duty: number): Netlist {
  return {
    fswHz: 200e3,
    pwm: { q: { dutyFrom: 0, dutyTo: duty } },
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: 12 },
      { kind: 'L', name: 'L1', a: 'in', b: 'sw', henry: 22e-6, dcrOhm: 0.02 },
      { kind: 'S', name: 'S1', a: 'sw', b: '0', ronOhm: 0.02, roffOhm: 1e6, gate: 'q' },
      { kind: 'C', name: 'Cs', a: 'sw', b: 'x', farad: 4.7e-6, esrOhm: 0.005 },
      { kind: 'L', name: 'L2', a: 'x', b: '0', henry: 22e-6, dcrOhm: 0.02 },
      { kind: 'D', name: 'D1', a: 'x', b: 'out', vfV: 0.4, ronOhm: 0.02, roffOhm: 1e6 },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: 22e-6, esrOhm: 0.005 },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: rOhm },
    ],
  };
}

function time(label: string, rOhm: number, runs: number): string {
  for (let i = 0; i < 10; i++) solvePeriodicSteadyState(sepic(rOhm, 0.4 + i * 0.001)); // warm the JIT
  const wall: number[] = [];
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  let events = false;
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    const ss = solvePeriodicSteadyState(sepic(rOhm, 0.45 + (i % 100) * 0.001));
    wall.push(performance.now() - s);
    events ||= ss.hasDiodeEvents;
  }
  const totalMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  wall.sort((a, b) => a - b);
  const median = wall[Math.floor(runs / 2)];
  const cpuMs = (cpu.user + cpu.system) / 1000 / runs;
  return `${label}${events ? ' (DCM)' : ''}: median ${median.toFixed(2)} ms, mean ${(totalMs / runs).toFixed(2)} ms wall, ${cpuMs.toFixed(2)} ms CPU per solve (${runs} runs, goal < 5 ms)`;
}

export async function run(): Promise<string[]> {
  return [
    time('SEPIC steady state, CCM, R = 6 Ω', 6, 200),
    time('SEPIC steady state, light load, R = 200 Ω', 200, 200),
  ];
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const line of await run()) console.log(line);
}
