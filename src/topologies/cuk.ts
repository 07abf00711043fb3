/**
 * Ćuk converter: negative output with continuous input and output current.
 *
 * Nodes: A = switch node (L1, Q1 drain, Cs), B = Cs / L2 / rectifier. L1 runs from the input to A; Q1
 * (low side, Rsense in its source) from A to ground; the coupling capacitor Cs from A to B, charged to
 * VCs = V(A) − V(B) ≈ Vin + |Vout|; the rectifier (D1 anode, or Q2, at B) from B to ground; L2 from B to
 * the negative output. iL1 flows from the input into A; iL2 flows from the output through L2 into B.
 * During D, A is grounded, B sits at −VCs and iL2 returns through Cs and Q1; during D′ the rectifier
 * carries iL1 + iL2 and V(B) = +Vd.
 *
 * Ideal CCM (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 2;
 * Rashid, Power Electronics, 4th ed., Pearson 2014, Ex. 5.8): Vout = −Vin·D/(1−D), IL2 = Iout,
 * IL1 = Iout·D/(1−D), switch and rectifier block VCs = Vin + |Vout|, ΔVcs = Iout·D/(Cs·fsw).
 * With drops (derived here): the on-state winding voltages are vL1 = Vin − R1·IL1 − Rq·Isw and
 * vL2 = VCs − |Vout| − Rq·Isw − R2·IL2; off-state vL1 = Vin − VCs − Vd − R1·IL1 and vL2 = −(|Vout| + Vd + R2·IL2).
 * Volt-second balance on L2 gives VCs = (|Vout| + R2·IL2 + (1−D)·Vd + D·Rq·Isw)/D; on L1, after
 * substituting VCs, D/(1−D) = (|Vout| + Vd + R2·IL2)/(Vin − R1·IL1 − Rq·Isw): the family equation of
 * coupling-network.ts.
 */
import type { Design } from '../engine/design.ts';
import type { Caution, RectifierKind } from '../engine/types.ts';
import { ALL_SEGMENTS, SEGMENT_0, type WaveSet } from '../engine/wave.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { couplingResonanceCaution, couplingRhpZeroCaution } from './coupling-cautions.ts';
import * as net from './coupling-network.ts';
import { newCouplingPoint, solveCouplingNetwork, writeCommonWaves } from './coupling-network.ts';
import type { ComponentSpec, OperatingPoint, OperatingScalars, Topology } from './topology.ts';

// Slot numbers read once (an imported binding compiled to CommonJS is a getter on every read).
const { CIN, CS, L1, L2, Q1, RS } = net;

function components(rect: RectifierKind): ComponentSpec[] {
  return [
    { name: 'Q1', role: 'switch', duty: 'main switch (low side)', sizing: { kind: 'switch' } },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'current-sense resistor in the switch source',
      sizing: { kind: 'sense', of: 'Q1' },
    },
    rect === 'diode'
      ? {
          name: 'D1',
          role: 'diode',
          duty: 'rectifier from the Cs–L2 node to ground',
          sizing: { kind: 'diode' },
        }
      : {
          name: 'Q2',
          role: 'sync',
          duty: 'synchronous rectifier from the Cs–L2 node to ground',
          sizing: { kind: 'sync' },
        },
    { name: 'L1', role: 'inductor', duty: 'input inductor', sizing: { kind: 'inductor' } },
    { name: 'L2', role: 'inductor', duty: 'output inductor', sizing: { kind: 'inductor' } },
    {
      name: 'Cs',
      role: 'capacitor',
      duty: 'coupling (energy-transfer) capacitor, charged to Vin + |Vout|',
      sizing: { kind: 'capacitor', ripple: 'coupling' },
    },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor',
      sizing: { kind: 'capacitor', ripple: 'input' },
    },
    {
      name: 'Cout',
      role: 'capacitor',
      duty: 'output capacitor',
      sizing: { kind: 'capacitor', ripple: 'output' },
    },
    {
      name: 'U1',
      role: 'controller',
      duty: 'current-mode controller (inverting feedback)',
      sizing: { kind: 'controller' },
    },
  ];
}

const pt = newCouplingPoint();

function operate(d: Design, at: OperatingPoint, w: WaveSet, s: OperatingScalars): void {
  const vin = at.vinV;
  const iout = at.ioutA;
  const p = d.parts;
  const vo = Math.abs(d.voutV);
  const rq = p[Q1].ronOhm + p[RS].value;
  pt.vinV = vin;
  pt.ioutA = iout;
  solveCouplingNetwork(d, pt);
  const dc = pt.dutyCcm;
  const vcs = (vo + p[L2].dcrOhm * pt.il2A + (1 - dc) * pt.vdV + dc * rq * pt.iswA) / dc;
  const vQ1 = vcs + pt.vdV;
  const vRect = vcs - rq * pt.iswA;

  pt.vQ1SwV = vQ1;
  pt.vRectSwV = vRect;
  pt.vcsV = vcs;
  pt.voV = vo;
  writeCommonWaves(pt, w);
  const iin = pt.il1AvgA;
  s.duty = pt.duty;
  s.duty2 = 0;
  s.mode = pt.mode;
  s.converged = pt.converged;
  s.iinA = iin;
  // Cs current from A to B: −iL2 while Q1 conducts, +iL1 otherwise; Cin takes iL1's ripple.
  w.combine(CS, L2, -1, SEGMENT_0, L1, 1, ALL_SEGMENTS & ~SEGMENT_0);
  w.copy(CIN, L1);
  w.shift(CIN, -iin);
}

function cautions(d: Design, spec: RailSpec, nominal: OperatingScalars): Caution[] {
  const out: Caution[] = [];
  const ring = couplingResonanceCaution(d, spec, 1, 'directly through L1');
  if (ring) out.push(ring);
  const rLoad = spec.output.voltageV / spec.load.maxA;
  out.push(couplingRhpZeroCaution(rLoad, nominal.duty, d.parts[L1].value, d.parts[CS].value));
  out.push({
    code: 'switching-loop',
    message:
      'Input and output currents are continuous; the pulsating current runs in the loop Q1 → Cs → rectifier → ground: keep that loop tight (common practice).',
  });
  return out;
}

export const cuk: Topology = {
  id: 'cuk',
  title: 'Ćuk converter',
  summary:
    'Low-side switch between an input inductor and a coupling capacitor that transfers energy to an output inductor: a negative output above or below the input, |Vout| = Vin·D/(1−D), with continuous input and output current (the quietest input and output of the family). The switch and rectifier block Vin + |Vout|; the L1–Cs–L2 network rings on input steps.',
  outputSign: -1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components,
  operate,
  cautions,
};
