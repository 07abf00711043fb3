/**
 * The switched netlist of every topology: one element per power component under the component's own name,
 * values from the sized or pinned design, a connected circuit, gates that follow the commanded duty, and a
 * circuit that reproduces the analytic engine's output voltage when the waveform engine (src/waveform/)
 * solves its periodic steady state at the engine's duty. The comparison of every current and ripple
 * against an outside reference is test/reference/ngspice-engine.test.ts.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cornersFor } from '../../src/engine/corners.ts';
import { evaluateCorner } from '../../src/engine/evaluate.ts';
import type { RectifierKind, TopologyId } from '../../src/engine/types.ts';
import { loadSpecText, loadTechnology } from '../../src/spec/load.ts';
import { fourSwitchLegDuties } from '../../src/topologies/netlists/four-switch-buck-boost.ts';
import { buildNetlist, NETLIST_BUILDERS } from '../../src/topologies/netlists/index.ts';
import { CIN_ESR_FLOOR_OHM, K_MAX, RON_FLOOR_OHM } from '../../src/topologies/netlists/parts.ts';
import { getTopology } from '../../src/topologies/registry.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { solvePeriodicSteadyState } from '../../src/waveform/steady-state.ts';
import { expectClose } from '../support/expect-close.ts';
import { PINNED, pinnedDesign } from '../support/pinned-design.ts';

const IDS = Object.keys(NETLIST_BUILDERS) as TopologyId[];
const tech = loadTechnology('ideal');
const r = loadSpecText(
  readFileSync(new URL('../../data/specs/marine-lifepo4-12v.yaml', import.meta.url), 'utf8'),
);
if (!r.ok) throw new Error('marine spec does not load');
const spec = { ...r.spec, output: { ...r.spec.output, polarity: 'either' as const } };
/** Output average of the PWL steady state against the target |Vout|: the ripple's effect on averages
 * the small-ripple model neglects stays far below this (common practice). */
const RTOL_VOUT = 0.005;

function terminals(n: Netlist): Map<string, number> {
  const count = new Map<string, number>();
  for (const e of n.elements) {
    if (e.kind === 'K') continue;
    for (const node of [e.a, e.b]) count.set(node, (count.get(node) ?? 0) + 1);
  }
  return count;
}

function setup(id: TopologyId, rect: RectifierKind, label = 'vin-min') {
  const pd = pinnedDesign(spec, { topology: id, fswHz: 400e3, ripple: 0.3, rect }, tech);
  const corner = cornersFor(spec, pd.topology).find((c) => c.label === label)!;
  const e = evaluateCorner(pd.topology, pd.design, tech, corner);
  const netlist = buildNetlist(pd.design, corner.vinV, corner.ioutA, {
    duty: e.duty,
    duty2: e.duty2,
    mode: e.mode,
  });
  return { pd, corner, e, netlist };
}

describe('switched netlists', () => {
  it('has a builder for each of the nine topologies, each registered', () => {
    expect(IDS.sort()).toEqual([
      'boost-then-buck',
      'buck-then-boost',
      'cuk',
      'four-switch-buck-boost',
      'inverting-buck-boost',
      'sepic',
      'sepic-coupled',
      'sepic-damped',
      'zeta',
    ]);
    for (const id of IDS) expect(getTopology(id), id).toBeDefined();
  });

  for (const id of IDS) {
    for (const rect of ['sync', 'diode'] as RectifierKind[]) {
      describe(`${id}, ${rect}`, () => {
        it('names one element after each power component, with the design values', () => {
          const { pd, netlist } = setup(id, rect);
          const byName = new Map(netlist.elements.map((el) => [el.name, el]));
          for (const p of pd.design.parts) {
            if (p.role === 'controller') continue;
            const el = byName.get(p.name);
            expect(el, `${p.name} in the netlist`).toBeDefined();
            if (!el) continue;
            if (p.role === 'inductor' || p.role === 'coupled-inductor')
              expect(el).toMatchObject({ kind: 'L', henry: p.value, dcrOhm: PINNED.dcrOhm });
            if (p.role === 'capacitor' || p.role === 'damping-capacitor') {
              // an ESR-free Cin straight across the ideal source gets the floor (parts.ts)
              const esr = p.name === 'Cin' && p.esrOhm === 0 ? CIN_ESR_FLOOR_OHM : p.esrOhm;
              expect(el).toMatchObject({ kind: 'C', farad: p.value, esrOhm: esr });
            }
            if (p.role === 'switch') expect(el).toMatchObject({ kind: 'S', ronOhm: PINNED.switchRonOhm });
            if (p.role === 'sync') expect(el).toMatchObject({ kind: 'S', ronOhm: PINNED.syncRonOhm });
            if (p.role === 'diode')
              expect(el).toMatchObject({ kind: 'D', vfV: PINNED.diodeVfV, ronOhm: PINNED.diodeRdOhm });
            if (p.role === 'sense' || p.role === 'damping-resistor')
              expect(el).toMatchObject({ kind: 'R', ohm: p.value });
          }
        });

        it('is connected: every node joins two terminals or more, every gate has a signal', () => {
          const { netlist } = setup(id, rect);
          for (const [node, n] of terminals(netlist)) expect(n, `node ${node}`).toBeGreaterThanOrEqual(2);
          for (const el of netlist.elements)
            if (el.kind === 'S') expect(netlist.pwm[el.gate], `${el.name} gate`).toBeDefined();
        });

        it('loads the output with |Vout|/Iout and feeds it from Vin', () => {
          const { pd, corner, netlist } = setup(id, rect);
          expect(netlist.elements.find((el) => el.name === 'Rload')).toMatchObject({
            kind: 'R',
            ohm: Math.abs(pd.design.voutV) / corner.ioutA,
          });
          expect(netlist.elements.find((el) => el.name === 'Vin')).toMatchObject({
            kind: 'V',
            volt: corner.vinV,
          });
          expect(netlist.fswHz).toBe(400e3);
        });

        it("reproduces the engine's output voltage in the waveform engine at the engine's duty", () => {
          const { pd, netlist } = setup(id, rect);
          const ss = solvePeriodicSteadyState(netlist);
          expectClose(Math.abs(ss.metrics['node(out)'].avg), Math.abs(pd.design.voutV), {
            rtol: RTOL_VOUT,
            what: 'output average',
          });
        });
      });
    }
  }

  it('drives the synchronous rectifier with the complement of its switch', () => {
    const { netlist, e } = setup('sepic', 'sync');
    expect(netlist.pwm.q1).toEqual({ dutyFrom: 0, dutyTo: e.duty });
    expect(netlist.pwm.q1n).toEqual({ dutyFrom: e.duty, dutyTo: 1 });
    expect(netlist.elements.find((el) => el.name === 'Q2')).toMatchObject({ kind: 'S', gate: 'q1n' });
  });

  it('writes the coupled inductor with K at the design coupling, clamped below 1', () => {
    const { pd, netlist } = setup('sepic-coupled', 'sync');
    expect(netlist.elements.find((el) => el.kind === 'K')).toMatchObject({
      l1: 'L1',
      l2: 'L2',
      k: pd.design.coupling,
    });
    // the textbook idealisation, pinned: a perfect pair is singular, so the netlist stops just short of it
    const perfect = pinnedDesign(
      spec,
      { topology: 'sepic-coupled', fswHz: 400e3, ripple: 0.3, rect: 'sync' },
      tech,
      { 'L1.k': 1 },
    );
    expect(perfect.design.coupling).toBe(1);
    const n = buildNetlist(perfect.design, 10, 2, { duty: 0.5, duty2: 0, mode: 'ccm' });
    expect(n.elements.find((el) => el.kind === 'K')).toMatchObject({ k: K_MAX });
  });

  it('places the damping leg Cd–Rd across the coupling capacitor', () => {
    const { netlist } = setup('sepic-damped', 'sync');
    const cs = netlist.elements.find((el) => el.name === 'Cs')!;
    const cd = netlist.elements.find((el) => el.name === 'Cd')!;
    const rd = netlist.elements.find((el) => el.name === 'Rd')!;
    if (cs.kind === 'K' || cd.kind === 'K' || rd.kind === 'K') throw new Error('unexpected coupling element');
    expect(cd.a).toBe(cs.a);
    expect(rd.a).toBe(cd.b);
    expect(rd.b).toBe(cs.b);
  });

  it('floors a zero on-resistance (ideal preset) so the switch stays a resistance', () => {
    const pd = pinnedDesign(spec, { topology: 'sepic', fswHz: 400e3, ripple: 0.3, rect: 'sync' }, tech, {
      'Q1.ron': 0,
    });
    const n = buildNetlist(pd.design, 10, 2, { duty: 0.5, duty2: 0, mode: 'ccm' });
    expect(n.elements.find((el) => el.name === 'Q1')).toMatchObject({ ronOhm: RON_FLOOR_OHM });
  });

  it('leaves out a zero-ohm sense resistor and joins the switch to its node', () => {
    const pd = pinnedDesign(spec, { topology: 'sepic', fswHz: 400e3, ripple: 0.3, rect: 'sync' }, tech);
    pd.design.parts.find((p) => p.name === 'Rsense')!.value = 0;
    const n = buildNetlist(pd.design, 10, 2, { duty: 0.5, duty2: 0, mode: 'ccm' });
    expect(n.elements.some((el) => el.name === 'Rsense')).toBe(false);
    expect(n.elements.find((el) => el.name === 'Q1')).toMatchObject({ a: 'sw', b: '0' });
  });

  describe('four-switch gates by region (interval scheme of four-switch-solve.ts)', () => {
    it('buck: the buck leg switches at duty, the boost leg is parked (Q3 off, Q4 on)', () => {
      expect(fourSwitchLegDuties(14.6, 12, { duty: 0.83, duty2: 0, mode: 'buck' })).toEqual({
        d1: 0.83,
        d3: 0,
      });
    });
    it('boost: Q1 stays on, the boost leg switches at duty', () => {
      expect(fourSwitchLegDuties(10, 12, { duty: 0.18, duty2: 0, mode: 'boost' })).toEqual({
        d1: 1,
        d3: 0.18,
      });
    });
    it('transition: three intervals, boost leg at duty and buck leg at duty2', () => {
      expect(fourSwitchLegDuties(12, 12, { duty: 0.05, duty2: 0.96, mode: 'buck-boost' })).toEqual({
        d1: 0.96,
        d3: 0.05,
      });
    });
    it('writes the parked legs as always-on and always-off gates', () => {
      const { netlist } = setup('four-switch-buck-boost', 'sync', 'vin-max');
      expect(netlist.pwm.q3).toEqual({ dutyFrom: 0, dutyTo: 0 });
      expect(netlist.pwm.q4).toEqual({ dutyFrom: 0, dutyTo: 1 });
    });
  });
});
