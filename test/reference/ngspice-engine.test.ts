/**
 * Reference: ngspice, via the eecircuit-engine WebAssembly build, npm (ngspice circuit simulator; the
 * package compiles it to WebAssembly). Every topology's analytic engine (src/topologies/) against a SPICE
 * transient of the same circuit: the topology's switched netlist (src/topologies/netlists/) exported by
 * src/report/spice.ts, run open loop at the engine's duty, periodic steady state by shooting
 * (test/support/ngspice.ts).
 *
 * Designs: the marine demo spec (data/specs/marine-lifepo4-12v.yaml, polarity relaxed so the inverting
 * stages are evaluated too) on the `ideal` technology at 400 kHz, with every L, C, DCR, on-resistance,
 * sense resistor and diode drop pinned (test/support/pinned-design.ts), so the engine's sizing cannot
 * move the circuit away from the netlist. The four-switch stage runs on the ideal preset plus 100 ns
 * minimum on/off times, so its transition region exists and each region gets a point.
 *
 * Duty check (open loop, so ngspice's output differs from the target by the engine's duty error): the
 * engine is asked which duty it would need to produce ngspice's average output at ngspice's load current
 * (the same design with Vout = ngspice's Vout, and for the cascades the bus at ngspice's bus); that
 * "equivalent duty" must equal the commanded duty within 1.5 %. Tolerances (relative, from the brief):
 * duty 1.5 %, inductor average 2 %, inductor ripple and switch/rectifier peaks 5 %, capacitor ripple 10 %.
 * Diodes run with CJO = 0 so ngspice's instantaneous peaks carry no junction-charge spike (the engine has
 * none); with gear integration every point ran.
 *
 * The same netlist also goes through the waveform engine's exact periodic steady state
 * (src/waveform/steady-state.ts), compared with ngspice at averages 2 %, ripple (currents and capacitor
 * voltages) and peaks 5 %.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cornersFor } from '../../src/engine/corners.ts';
import type { Design } from '../../src/engine/design.ts';
import { evaluateCorner } from '../../src/engine/evaluate.ts';
import type { CandidateParams, RectifierKind, TopologyId } from '../../src/engine/types.ts';
import { WaveSet } from '../../src/engine/wave.ts';
import type { Technology } from '../../src/parts/technology.ts';
import { loadSpecText, loadTechnology } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { buildNetlist, seedInitialState } from '../../src/topologies/netlists/index.ts';
import { getTopology } from '../../src/topologies/registry.ts';
import type { OperatingScalars } from '../../src/topologies/topology.ts';
import { solvePeriodicSteadyState } from '../../src/waveform/steady-state.ts';
import { expectClose } from '../support/expect-close.ts';
import { Ngspice, type PeriodicSteadyState, periodicSteadyState } from '../support/ngspice.ts';
import { pinnedDesign } from '../support/pinned-design.ts';

/** Tolerances of the cross-check (relative). */
const RTOL_DUTY = 0.015;
const RTOL_INDUCTOR_AVG = 0.02;
const RTOL_RIPPLE = 0.05;
const RTOL_PEAK = 0.05;
const RTOL_CAP_RIPPLE = 0.1;
const FSW_HZ = 400e3;
/** Source choke so Cin carries the input current's AC part, as the engine assumes (H). */
const SOURCE_CHOKE_H = 100e-6;

const ALL_IDS: TopologyId[] = [
  'sepic',
  'sepic-coupled',
  'sepic-damped',
  'inverting-buck-boost',
  'cuk',
  'zeta',
  'four-switch-buck-boost',
  'boost-then-buck',
  'buck-then-boost',
];

function marineSpec(): RailSpec {
  const r = loadSpecText(
    readFileSync(new URL('../../data/specs/marine-lifepo4-12v.yaml', import.meta.url), 'utf8'),
  );
  if (!r.ok) throw new Error('marine spec does not load');
  return { ...r.spec, output: { ...r.spec.output, polarity: 'either' } };
}

const ideal = loadTechnology('ideal');
/** Ideal preset with 100 ns minimum on/off times: the four-switch transition region then has width. */
const idealTimed: Technology = {
  ...ideal,
  controller: { ...ideal.controller, minOnS: 100e-9, minOffS: 100e-9 },
};
/** Ideal preset with the default preset's 0.98 coupling, where the engine's two-winding formula applies. */
const idealK98: Technology = { ...ideal, inductor: { ...ideal.inductor, coupling: 0.98 } };

function techFor(id: TopologyId): Technology {
  if (id === 'four-switch-buck-boost') return idealTimed;
  if (id === 'sepic-coupled') return idealK98;
  return ideal;
}

/** Corners simulated: input min and max; the four-switch adds nominal and Vin ≈ Vout (all three regions). */
function cornerLabels(id: TopologyId): string[] {
  return id === 'four-switch-buck-boost'
    ? ['vin-min', 'vin-nom', 'vin-near-vout', 'vin-max']
    : ['vin-min', 'vin-max'];
}

/** The duties the engine would need to produce ngspice's output (and bus) at ngspice's load current. */
function equivalentDuties(
  d: Design,
  id: TopologyId,
  vinV: number,
  rLoadOhm: number,
  ss: PeriodicSteadyState,
): OperatingScalars {
  const topology = getTopology(id)!;
  const vo = Math.abs(ss.nodes.out.avg);
  const copy: Design = {
    ...d,
    voutV: Math.sign(d.voutV) * vo,
    busV: ss.nodes.bus ? ss.nodes.bus.avg : d.busV,
  };
  const s: OperatingScalars = { duty: 0, duty2: 0, mode: 'ccm', iinA: 0, converged: true };
  topology.operate(copy, { vinV, ioutA: vo / rLoadOhm }, new WaveSet(d.parts.length), s);
  return s;
}

let ng: Ngspice;
beforeAll(async () => {
  ng = await Ngspice.start();
});
afterAll(async () => {
  await ng?.stop();
});

describe('analytic engine against ngspice (pinned designs, ideal technology, marine demo spec)', () => {
  const spec = marineSpec();

  it('covers all nine topologies, every one registered', () => {
    for (const id of ALL_IDS) expect(getTopology(id), `${id} is registered`).toBeDefined();
  });

  for (const id of ALL_IDS) {
    for (const rect of ['sync', 'diode'] as RectifierKind[]) {
      describe(`${id}, ${rect} rectifier`, () => {
        for (const label of cornerLabels(id)) {
          it(`matches ngspice at ${label}`, async () => {
            const tech = techFor(id);
            const params: CandidateParams = { topology: id, fswHz: FSW_HZ, ripple: 0.3, rect };
            const pd = pinnedDesign(spec, params, tech);
            const corner = cornersFor(spec, pd.topology).find((c) => c.label === label)!;
            const engine = evaluateCorner(pd.topology, pd.design, tech, corner);
            // the Design built here is the one evaluateCandidate sized (same pins): same duty
            const cli = pd.evaluation.corners.find((c) => c.label === label)!;
            expectClose(engine.duty, cli.duty, { rtol: 1e-12, what: 'duty of the rebuilt design' });

            const cmd = { duty: engine.duty, duty2: engine.duty2, mode: engine.mode };
            const built = buildNetlist(pd.design, corner.vinV, corner.ioutA, cmd, {
              sourceInductanceH: SOURCE_CHOKE_H,
            });
            const netlist = seedInitialState(built, pd.topology, pd.design, corner.vinV, corner.ioutA);
            const ss = await periodicSteadyState(ng, netlist, {
              title: `${id} ${rect} ${label}`,
              spice: { diodeCjoF: 0 },
            });
            expect(ss.residual, 'shooting converged').toBeLessThan(1e-4);

            const rLoad = Math.abs(pd.design.voutV) / corner.ioutA;
            const eq = equivalentDuties(pd.design, id, corner.vinV, rLoad, ss);
            expectClose(eq.duty, engine.duty, { rtol: RTOL_DUTY, what: `${label} equivalent duty` });
            if (engine.duty2 > 0)
              expectClose(eq.duty2, engine.duty2, { rtol: RTOL_DUTY, what: `${label} equivalent duty2` });

            const scaleA = Math.max(...pd.design.parts.map((p) => Math.abs(engine.components[p.name].iAvgA)));
            for (const p of pd.design.parts) {
              const a = engine.components[p.name];
              const what = `${label} ${p.name}`;
              if (p.role === 'inductor' || p.role === 'coupled-inductor') {
                expectClose(ss.currents[p.name].avg, a.iAvgA, {
                  rtol: RTOL_INDUCTOR_AVG,
                  what: `${what} average current`,
                });
                expectClose(ss.currents[p.name].pp, a.iPpA, { rtol: RTOL_RIPPLE, what: `${what} ripple` });
              } else if (p.role === 'switch' || p.role === 'sync' || p.role === 'diode') {
                // a parked switch (four-switch buck or boost region) carries nothing in either model
                expectClose(ss.currents[p.name].peakAbs, a.iPeakA, {
                  rtol: RTOL_PEAK,
                  atol: 1e-3 * scaleA,
                  what: `${what} peak current`,
                });
              } else if (p.role === 'capacitor' || p.role === 'damping-capacitor') {
                const rtol = RTOL_CAP_RIPPLE;
                expectClose(ss.voltages[p.name].pp, a.vPpV, { rtol, what: `${what} voltage ripple` });
              }
            }

            // The waveform engine's exact periodic steady state of the same netlist against ngspice:
            // the same circuit in both, so averages within 2 %, ripple and peaks within 5 %.
            const wf = solvePeriodicSteadyState(netlist);
            for (const p of pd.design.parts) {
              const i = wf.metrics[`i(${p.name})`];
              const v = wf.metrics[`v(${p.name})`];
              if (!i || !v || !ss.currents[p.name]) continue;
              const what = `${label} ${p.name} (waveform engine vs ngspice)`;
              if (p.role === 'inductor' || p.role === 'coupled-inductor') {
                expectClose(i.avg, ss.currents[p.name].avg, {
                  rtol: RTOL_INDUCTOR_AVG,
                  what: `${what} average`,
                });
                expectClose(i.max - i.min, ss.currents[p.name].pp, {
                  rtol: RTOL_RIPPLE,
                  what: `${what} ripple`,
                });
              } else if (p.role === 'switch' || p.role === 'sync' || p.role === 'diode') {
                const peak = Math.max(Math.abs(i.max), Math.abs(i.min));
                expectClose(peak, ss.currents[p.name].peakAbs, {
                  rtol: RTOL_PEAK,
                  atol: 1e-3 * scaleA,
                  what: `${what} peak`,
                });
              } else if (p.role === 'capacitor' || p.role === 'damping-capacitor') {
                expectClose(v.max - v.min, ss.voltages[p.name].pp, {
                  rtol: RTOL_RIPPLE,
                  what: `${what} voltage ripple`,
                });
              }
            }
          });
        }
      });
    }
  }

  it('coupled SEPIC on the ideal preset (k = 1, written as 0.999): duty and average currents still agree', async () => {
    const params: CandidateParams = { topology: 'sepic-coupled', fswHz: FSW_HZ, ripple: 0.3, rect: 'sync' };
    const pd = pinnedDesign(spec, params, ideal);
    const corner = cornersFor(spec, pd.topology).find((c) => c.label === 'vin-min')!;
    const engine = evaluateCorner(pd.topology, pd.design, ideal, corner);
    const cmd = { duty: engine.duty, duty2: engine.duty2, mode: engine.mode };
    const built = buildNetlist(pd.design, corner.vinV, corner.ioutA, cmd, {
      sourceInductanceH: SOURCE_CHOKE_H,
    });
    const ss = await periodicSteadyState(
      ng,
      seedInitialState(built, pd.topology, pd.design, corner.vinV, corner.ioutA),
    );
    const rLoad = Math.abs(pd.design.voutV) / corner.ioutA;
    expectClose(equivalentDuties(pd.design, 'sepic-coupled', corner.vinV, rLoad, ss).duty, engine.duty, {
      rtol: RTOL_DUTY,
      what: 'equivalent duty',
    });
    for (const name of ['L1', 'L2']) {
      expectClose(ss.currents[name].avg, engine.components[name].iAvgA, {
        rtol: RTOL_INDUCTOR_AVG,
        what: `${name} average`,
      });
    }
    // Not asserted, reported: at k = 0.999 the 44 nH of leakage lets the coupling capacitor's ripple drive
    // a differential current several times the engine's k = 1 winding ripple (see the lead's report).
  });
});
