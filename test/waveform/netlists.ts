/**
 * Test netlists built by hand (the topology builders live elsewhere): a boost and a separate-inductor
 * SEPIC, each with a diode rectifier and one gate signal 'q' on during [0, duty).
 */
import type { Netlist } from '../../src/waveform/netlist.ts';

export interface BoostParams {
  vinV: number;
  duty: number;
  fswHz: number;
  lH: number;
  cF: number;
  rOhm: number;
  dcrOhm?: number;
  esrOhm?: number;
  ronOhm?: number;
  roffOhm?: number;
  vfV?: number;
  rdOhm?: number;
}

/** Vin —L1— sw; S1 sw→0; D1 sw→out; Cout, R out→0. */
export function boostNetlist(p: BoostParams): Netlist {
  return {
    fswHz: p.fswHz,
    pwm: { q: { dutyFrom: 0, dutyTo: p.duty } },
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: p.vinV },
      { kind: 'L', name: 'L1', a: 'in', b: 'sw', henry: p.lH, dcrOhm: p.dcrOhm ?? 0 },
      {
        kind: 'S',
        name: 'S1',
        a: 'sw',
        b: '0',
        ronOhm: p.ronOhm ?? 1e-6,
        roffOhm: p.roffOhm ?? 1e7,
        gate: 'q',
      },
      {
        kind: 'D',
        name: 'D1',
        a: 'sw',
        b: 'out',
        vfV: p.vfV ?? 0,
        ronOhm: p.rdOhm ?? 1e-6,
        roffOhm: p.roffOhm ?? 1e7,
      },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: p.cF, esrOhm: p.esrOhm ?? 0 },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: p.rOhm },
    ],
  };
}

export interface SepicParams {
  vinV: number;
  duty: number;
  fswHz: number;
  l1H: number;
  l2H: number;
  csF: number;
  coutF: number;
  rOhm: number;
  dcrOhm?: number;
  esrOhm?: number;
  ronOhm?: number;
  vfV?: number;
}

/** Vin —L1— sw; S1 sw→0; Cs sw→x; L2 x→0; D1 x→out; Cout, R out→0. */
export function sepicNetlist(p: SepicParams): Netlist {
  const dcr = p.dcrOhm ?? 0.02;
  const esr = p.esrOhm ?? 0.005;
  return {
    fswHz: p.fswHz,
    pwm: { q: { dutyFrom: 0, dutyTo: p.duty } },
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: p.vinV },
      { kind: 'L', name: 'L1', a: 'in', b: 'sw', henry: p.l1H, dcrOhm: dcr },
      { kind: 'S', name: 'S1', a: 'sw', b: '0', ronOhm: p.ronOhm ?? 0.02, roffOhm: 1e6, gate: 'q' },
      { kind: 'C', name: 'Cs', a: 'sw', b: 'x', farad: p.csF, esrOhm: esr },
      { kind: 'L', name: 'L2', a: 'x', b: '0', henry: p.l2H, dcrOhm: dcr },
      { kind: 'D', name: 'D1', a: 'x', b: 'out', vfV: p.vfV ?? 0.4, ronOhm: 0.02, roffOhm: 1e6 },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: p.coutF, esrOhm: esr },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: p.rOhm },
    ],
  };
}
