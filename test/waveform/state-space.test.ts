import { describe, expect, it } from 'vitest';
import { SimulationError } from '../../src/waveform/errors.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { compileCircuit, type StateSpace } from '../../src/waveform/state-space.ts';
import { expectClose } from './close.ts';
import { boostNetlist } from './netlists.ts';

/** Near-ideal parts: 1 nΩ on, 1 TΩ off, so the hand-derived ideal matrices hold to ~1e-9. */
const NEAR_IDEAL_RTOL = 1e-7;

function expectMatrix(actual: Float64Array, expected: number[], what: string): void {
  const scale = Math.max(...expected.map(Math.abs));
  expected.forEach((e, i) => {
    expectClose(actual[i], e, { atol: NEAR_IDEAL_RTOL * scale }, `${what}[${i}]`);
  });
}

describe('state-space per configuration', () => {
  const L = 10e-6;
  const C = 20e-6;
  const R = 5;
  const net = boostNetlist({
    vinV: 10,
    duty: 0.5,
    fswHz: 1e5,
    lH: L,
    cF: C,
    rOhm: R,
    ronOhm: 1e-9,
    roffOhm: 1e12,
    rdOhm: 1e-9,
  });
  const circuit = compileCircuit(net);
  // Masks: bit 0 = S1, bit 1 = D1. States [i(L1), v(Cout)]; inputs [Vin, D1.vf].
  // Boost state equations (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., 2001, §2.3 / §7.3):
  //   switch on:  L di/dt = vg,            C dv/dt = −v/R
  //   diode on:   L di/dt = vg − vf − v,   C dv/dt = i − v/R
  it('names states, inputs and outputs', () => {
    expect(circuit.stateNames).toEqual(['L1', 'Cout']);
    expect(circuit.inputNames).toEqual(['Vin', 'D1.vf']);
    expect(circuit.outputNames).toContain('i(D1)');
    expect(circuit.outputNames).toContain('node(out)');
  });

  it('derives the boost switch-on configuration', () => {
    const ss: StateSpace = circuit.configuration(0b01);
    expectMatrix(ss.a, [0, 0, 0, -1 / (R * C)], 'A');
    expectMatrix(ss.b, [1 / L, 0, 0, 0], 'B');
  });

  it('derives the boost diode-on configuration, with the forward drop as an input', () => {
    const ss = circuit.configuration(0b10);
    expectMatrix(ss.a, [0, -1 / L, 1 / C, -1 / (R * C)], 'A');
    expectMatrix(ss.b, [1 / L, -1 / L, 0, 0], 'B');
    const k = circuit.outputIndex('i(Cout)');
    expectMatrix(ss.c.subarray(k * 2, k * 2 + 2), [1, -1 / R], 'C of i(Cout)');
  });

  it('mixes coupled windings through the inverse inductance matrix', () => {
    // L1 across a source, L2 loaded by R2: [L1 M; M L2]·d/dt[i1; i2] = [vg; −R2·i2], M = k·√(L1·L2).
    const [l1, l2, k, r2] = [4e-6, 9e-6, 0.8, 2];
    const coupled: Netlist = {
      fswHz: 1e5,
      pwm: {},
      elements: [
        { kind: 'V', name: 'Vg', a: 'in', b: '0', volt: 1 },
        { kind: 'L', name: 'L1', a: 'in', b: '0', henry: l1 },
        { kind: 'L', name: 'L2', a: 'y', b: '0', henry: l2 },
        { kind: 'K', name: 'K1', l1: 'L1', l2: 'L2', k },
        { kind: 'R', name: 'R2', a: 'y', b: '0', ohm: r2 },
      ],
    };
    const ss = compileCircuit(coupled).configuration(0);
    const mut = k * Math.sqrt(l1 * l2);
    const det = l1 * l2 - mut * mut;
    const inv = [l2 / det, -mut / det, -mut / det, l1 / det];
    expectMatrix(ss.a, [0, -inv[1] * r2, 0, -inv[3] * r2], 'A');
    expectMatrix(ss.b, [inv[0], inv[2]], 'B');
  });
});

describe('netlist faults are typed errors naming the cause', () => {
  const base = (extra: Netlist['elements']): Netlist => ({
    fswHz: 1e5,
    pwm: { q: { dutyFrom: 0, dutyTo: 0.5 } },
    elements: [{ kind: 'V', name: 'Vin', a: 'in', b: '0', volt: 5 }, ...extra],
  });
  const codeOf = (net: Netlist) => {
    try {
      compileCircuit(net);
    } catch (e) {
      expect(e).toBeInstanceOf(SimulationError);
      return { code: (e as SimulationError).code, message: (e as Error).message };
    }
    return undefined;
  };

  it('rejects a node reached only through inductors', () => {
    const r = codeOf(
      base([
        { kind: 'L', name: 'L1', a: 'in', b: 'mid', henry: 1e-6 },
        { kind: 'L', name: 'L2', a: 'mid', b: '0', henry: 1e-6 },
      ]),
    );
    expect(r?.code).toBe('singular-configuration');
    expect(r?.message).toContain("'mid'");
  });

  it('rejects a loop of voltage sources and ESR-free capacitors', () => {
    expect(codeOf(base([{ kind: 'C', name: 'C1', a: 'in', b: '0', farad: 1e-6 }]))?.code).toBe(
      'invalid-netlist',
    );
  });

  it('rejects a coupling of 1, an unknown gate and a zero on-resistance', () => {
    const l = (name: string) => ({ kind: 'L' as const, name, a: 'in', b: '0', henry: 1e-6 });
    expect(codeOf(base([l('L1'), l('L2'), { kind: 'K', name: 'K', l1: 'L1', l2: 'L2', k: 1 }]))?.code).toBe(
      'invalid-netlist',
    );
    expect(
      codeOf(base([{ kind: 'S', name: 'S1', a: 'in', b: '0', ronOhm: 1, roffOhm: 1e6, gate: 'nope' }]))
        ?.message,
    ).toContain("'nope'");
    expect(
      codeOf(base([{ kind: 'D', name: 'D1', a: 'in', b: '0', vfV: 0.5, ronOhm: 0, roffOhm: 1e6 }]))?.code,
    ).toBe('invalid-netlist');
  });
});
