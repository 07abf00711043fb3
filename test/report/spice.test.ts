/**
 * SPICE export: the text is standard SPICE3 (one element per line, every node joined to two terminals or
 * more, models for every switch and diode, .tran and .end), the function is pure, and every topology's
 * netlist runs in ngspice without error (ngspice, via the eecircuit-engine WebAssembly build, npm).
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RectifierKind, TopologyId } from '../../src/engine/types.ts';
import { DIODE_IS_A, DIODE_N, spiceMap, THERMAL_VOLTAGE_V, toSpice } from '../../src/report/spice.ts';
import { loadSpecText, loadTechnology } from '../../src/spec/load.ts';
import { buildNetlist, NETLIST_BUILDERS, seedInitialState } from '../../src/topologies/netlists/index.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { expectClose } from '../support/expect-close.ts';
import { Ngspice } from '../support/ngspice.ts';
import { pinnedDesign } from '../support/pinned-design.ts';

const IDS = Object.keys(NETLIST_BUILDERS) as TopologyId[];
const tech = loadTechnology('ideal');
const r = loadSpecText(
  readFileSync(new URL('../../data/specs/marine-lifepo4-12v.yaml', import.meta.url), 'utf8'),
);
if (!r.ok) throw new Error('marine spec does not load');
const spec = { ...r.spec, output: { ...r.spec.output, polarity: 'either' as const } };
const T = 1 / 400e3;

function netlistOf(id: TopologyId, rect: RectifierKind): Netlist {
  const pd = pinnedDesign(spec, { topology: id, fswHz: 400e3, ripple: 0.3, rect }, tech);
  const c = pd.evaluation.corners[0];
  const n = buildNetlist(pd.design, c.vinV, c.ioutA, {
    duty: c.duty,
    duty2: (c as { duty2?: number }).duty2 ?? 0,
    mode: c.mode,
  });
  return seedInitialState(n, pd.topology, pd.design, c.vinV, c.ioutA);
}

/** Structural reading of SPICE text: element lines by name, node use, models, control lines. */
function parse(text: string) {
  const lines = text.trimEnd().split('\n');
  const elements = new Map<string, string[]>();
  const models = new Set<string>();
  const control: string[] = [];
  for (const line of lines.slice(1)) {
    const tok = line.trim().split(/\s+/);
    if (line.startsWith('.model')) models.add(tok[1].toLowerCase());
    else if (line.startsWith('.')) control.push(line);
    else {
      expect(elements.has(tok[0].toLowerCase()), `element ${tok[0]} written once`).toBe(false);
      elements.set(tok[0].toLowerCase(), tok);
    }
  }
  return { lines, elements, models, control };
}

/** The node tokens of an element line (by SPICE type letter). */
function nodesOf(tok: string[]): string[] {
  const kind = tok[0][0].toUpperCase();
  if (kind === 'K') return [];
  if (kind === 'S') return tok.slice(1, 5);
  return tok.slice(1, 3);
}

describe('toSpice', () => {
  for (const id of IDS) {
    for (const rect of ['sync', 'diode'] as RectifierKind[]) {
      it(`writes well-formed SPICE for ${id} (${rect})`, () => {
        const text = toSpice(netlistOf(id, rect), {
          title: `${id} ${rect}`,
          tStopS: 3 * T,
          tStepS: T / 200,
          initialConditions: true,
        });
        const { lines, elements, models, control } = parse(text);
        expect(lines[0].startsWith('*')).toBe(true);
        expect(lines.at(-1)).toBe('.end');
        expect(control.some((l) => /^\.tran \S+ \S+ \S+ \S+ uic$/.test(l))).toBe(true);
        const use = new Map<string, number>();
        for (const tok of elements.values()) for (const n of nodesOf(tok)) use.set(n, (use.get(n) ?? 0) + 1);
        for (const [node, n] of use) expect(n, `node ${node}`).toBeGreaterThanOrEqual(2);
        for (const tok of elements.values()) {
          const kind = tok[0][0].toUpperCase();
          if (kind === 'S') expect(models.has(tok[5].toLowerCase()), `model of ${tok[0]}`).toBe(true);
          if (kind === 'D') expect(models.has(tok[3].toLowerCase()), `model of ${tok[0]}`).toBe(true);
          if (kind === 'L' || kind === 'C')
            expect(tok.at(-1), `${tok[0]} initial condition`).toMatch(/^IC=-?[0-9.e+-]+$/);
          if (kind === 'R' || kind === 'L' || kind === 'C')
            expect(Number.isFinite(Number(tok[3])) && Number(tok[3]) > 0).toBe(true);
        }
      });
    }
  }

  it('maps design names onto SPICE names and current vectors', () => {
    const map = spiceMap(netlistOf('sepic', 'diode'));
    expect(map.names).toMatchObject({
      Q1: 'S_Q1',
      D1: 'D1',
      L1: 'L1',
      Cs: 'Cs',
      Rsense: 'Rsense',
      Vin: 'Vin',
    });
    expect(map.elements.Q1.current).toBe('i(v_s_q1_i)');
    expect(map.elements.D1.current).toBe('i(v_d1_vf)');
    expect(map.elements.L1.current).toBe('i(l1)');
  });

  it('writes gates as PULSE sources, a window past the period end as an inverted pulse', () => {
    const gates = ['a', 'w', 'on', 'off'];
    const n: Netlist = {
      fswHz: 1e5,
      pwm: {
        a: { dutyFrom: 0, dutyTo: 0.25 },
        w: { dutyFrom: 0.75, dutyTo: 0.25 },
        on: { dutyFrom: 0, dutyTo: 1 },
        off: { dutyFrom: 0, dutyTo: 0 },
      },
      elements: [
        { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: 1 },
        ...gates.map((g) => ({
          kind: 'S' as const,
          name: `S${g}`,
          a: 'in',
          b: '0',
          ronOhm: 1,
          roffOhm: 1e6,
          gate: g,
        })),
      ],
    };
    const text = toSpice(n, { title: 'gates', tStopS: 1e-5, tStepS: 1e-8 });
    const pulse = (g: string) =>
      /PULSE\(([^)]*)\)/
        .exec(text.split('\n').find((l) => l.startsWith(`V_gate_${g} `)) ?? '')?.[1]
        .split(' ')
        .map(Number);
    // period 10 µs, edge 10 ns (a thousandth of the period): [0, 2.5 µs) on; the window [7.5 µs, 2.5 µs)
    // wraps, so it is written as off during [2.5 µs, 7.5 µs); each width loses one edge time
    const a = pulse('a')!;
    const w = pulse('w')!;
    for (const [got, want] of [
      [a, [0, 1, 0, 1e-8, 1e-8, 2.49e-6, 1e-5]],
      [w, [1, 0, 2.5e-6, 1e-8, 1e-8, 4.99e-6, 1e-5]],
    ]) {
      for (let i = 0; i < want.length; i++) {
        expectClose(got[i], want[i], { rtol: 1e-12, atol: 1e-18, what: `PULSE argument ${i}` });
      }
    }
    expect(text).toContain('V_gate_on g_on 0 DC 1');
    expect(text).toContain('V_gate_off g_off 0 DC 0');
  });

  it("gives the diode stand-in the netlist's drop vf + rd·i at 1 A (Shockley diode law, ngspice manual diode model)", () => {
    const n: Netlist = {
      fswHz: 1e5,
      pwm: {},
      elements: [{ kind: 'D', name: 'D1', a: 'x', b: 'y', vfV: 0.35, ronOhm: 0.02, roffOhm: 1e6 }],
    };
    const text = toSpice(n, { title: 'diode', tStopS: 1e-5, tStepS: 1e-8 });
    const src = Number(/V_d1_vf x_d1_k n_y DC (\S+)/.exec(text)?.[1]);
    // v(1 A) = N·Vt·ln(1 + 1 A/IS) + RS·1 A + Vsrc (Shockley: I = IS·(exp(V/(N·Vt)) − 1))
    const v = DIODE_N * THERMAL_VOLTAGE_V * Math.log(1 + 1 / DIODE_IS_A) + 0.02 + src;
    expectClose(v, 0.35 + 0.02, { atol: 1e-6, what: 'drop at 1 A' });
    expect(text).toContain(`.model DM_d1 D(IS=${DIODE_IS_A} N=${DIODE_N} RS=0.02 CJO=1e-10)`);
  });

  it('is pure: same text twice, netlist untouched', () => {
    const n = netlistOf('cuk', 'sync');
    const before = JSON.stringify(n);
    const opts = { title: 'cuk', tStopS: T, tStepS: T / 100 };
    expect(toSpice(n, opts)).toBe(toSpice(n, opts));
    expect(JSON.stringify(n)).toBe(before);
  });

  it('refuses non-finite values with the element named', () => {
    const n: Netlist = {
      fswHz: 1e5,
      pwm: {},
      elements: [{ kind: 'R', name: 'R1', a: 'a', b: '0', ohm: Number.NaN }],
    };
    expect(() => toSpice(n, { title: 'bad', tStopS: 1e-5, tStepS: 1e-8 })).toThrow(/R1 resistance/);
  });
});

describe('toSpice output runs in ngspice', () => {
  let ng: Ngspice;
  beforeAll(async () => {
    ng = await Ngspice.start();
  });
  afterAll(async () => {
    await ng?.stop();
  });

  for (const id of IDS) {
    it(`runs ${id} (diode with the default 100 pF junction, and sync) for three periods without error`, async () => {
      for (const rect of ['diode', 'sync'] as RectifierKind[]) {
        const n = netlistOf(id, rect);
        const text = toSpice(n, {
          title: `${id} ${rect}`,
          tStopS: 3 * T,
          tStepS: T / 200,
          initialConditions: true,
        });
        const run = await ng.run(text, 3 * T);
        const out = run.vectors['v(n_out)'];
        expect(out, 'v(n_out) saved').toBeDefined();
        expect(out.every(Number.isFinite)).toBe(true);
      }
    });
  }

  it('turns an ngspice failure into a thrown error', async () => {
    const text = '* broken\nR1 a 0 1\nX9 a 0 nosuchsubckt\n.tran 1e-9 1e-6\n.end\n';
    await expect(ng.run(text, 1e-6)).rejects.toThrow(/ngspice/);
  });
});
