/**
 * Zeta converter: positive output above or below the input, pulsating input and continuous output current.
 *
 * Nodes: A = switch node (Q1 source, L1, Cs), B = Cs / L2 / rectifier cathode. Q1 is a high-side
 * N-channel MOSFET from the input to A (Rsense in series with it); its gate drive floats on A, which swings
 * from Vin down to −(Vout + Vd), so a bootstrap supply must be clamped (a P-channel with an input-referenced
 * drive avoids that at about two to three times the on-resistance per die area: common practice). L1 runs
 * from A to ground; Cs from A to B, charged to VCs = V(B) − V(A) ≈ Vout; the rectifier (D1 anode, or Q2, at
 * ground) from ground to B; L2 from B to the output. iL1 flows from A to ground, iL2 from B to the output.
 * During D, A = Vin and B = Vin + VCs; during D′ the rectifier carries iL1 + iL2, V(B) = −Vd and
 * V(A) = −Vd − VCs.
 *
 * Ideal CCM (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 6
 * (the Zeta as the dual of the SEPIC); worked-example notes in test/reference/WORKED-EXAMPLES.md):
 * Vout = Vin·D/(1−D), IL2 = Iout, IL1 = Iout·D/(1−D), Iin = D·(IL1 + IL2) = IL1, ΔIk = Vin·D/(Lk·fsw),
 * switch and rectifier block Vin + Vout, ΔVcs = Iout·D/(Cs·fsw).
 * With drops (derived here): on-state vL1 = Vin − Rq·Isw − R1·IL1, vL2 = Vin − Rq·Isw + VCs − Vout − R2·IL2;
 * off-state vL1 = −(Vd + VCs + R1·IL1), vL2 = −(Vout + Vd + R2·IL2). Balance on L1 gives
 * VCs = [D·(Vin − Rq·Isw) − (1−D)·Vd − R1·IL1]/(1−D); on L2, after substituting VCs,
 * D/(1−D) = (Vout + Vd + R2·IL2)/(Vin − R1·IL1 − Rq·Isw): the family equation of coupling-network.ts.
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
    {
      name: 'Q1',
      role: 'switch',
      duty: 'main switch, high side (N-channel, floating bootstrapped gate drive, clamped: the source swings below ground)',
      sizing: { kind: 'switch' },
    },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'current-sense resistor in series with Q1',
      sizing: { kind: 'sense', of: 'Q1' },
    },
    rect === 'diode'
      ? {
          name: 'D1',
          role: 'diode',
          duty: 'rectifier from ground to the Cs–L2 node',
          sizing: { kind: 'diode' },
        }
      : {
          name: 'Q2',
          role: 'sync',
          duty: 'synchronous rectifier from ground to the Cs–L2 node',
          sizing: { kind: 'sync' },
        },
    {
      name: 'L1',
      role: 'inductor',
      duty: 'inductor from the switch node to ground',
      sizing: { kind: 'inductor' },
    },
    { name: 'L2', role: 'inductor', duty: 'output inductor', sizing: { kind: 'inductor' } },
    {
      name: 'Cs',
      role: 'capacitor',
      duty: 'coupling capacitor, charged to Vout',
      sizing: { kind: 'capacitor', ripple: 'coupling' },
    },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor (pulsating input current)',
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
      duty: 'current-mode controller with high-side drive',
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
  const vcs = (dc * (vin - rq * pt.iswA) - (1 - dc) * pt.vdV - p[L1].dcrOhm * pt.il1A) / (1 - dc);
  const vQ1 = vin + pt.vdV + vcs;
  const vRect = vin - rq * pt.iswA + vcs;

  pt.vQ1SwV = vQ1;
  pt.vRectSwV = vRect;
  pt.vcsV = vcs;
  pt.voV = vo;
  writeCommonWaves(pt, w);
  // the input current is the switch current (pulsating); Cin supplies its ripple
  const iin = pt.iswAvgA;
  s.duty = pt.duty;
  s.duty2 = 0;
  s.mode = pt.mode;
  s.converged = pt.converged;
  s.iinA = iin;
  // Cs current from A to B: +iL2 while Q1 conducts, −iL1 otherwise; Cin supplies the switch current's AC.
  w.combine(CS, L2, 1, SEGMENT_0, L1, -1, ALL_SEGMENTS & ~SEGMENT_0);
  w.copy(CIN, Q1);
  w.shift(CIN, -iin);
}

function cautions(d: Design, spec: RailSpec, nominal: OperatingScalars): Caution[] {
  const out: Caution[] = [];
  const ring = couplingResonanceCaution(d, spec, nominal.duty, 'through the switch, scaled by the duty');
  if (ring) out.push(ring);
  const rLoad = spec.output.voltageV / spec.load.maxA;
  out.push(couplingRhpZeroCaution(rLoad, nominal.duty, d.parts[L1].value, d.parts[CS].value));
  out.push({
    code: 'switching-loop',
    message:
      'The pulsating input current runs in the loop Cin → Q1 → Cs → rectifier → ground, and Q1 needs a floating gate drive whose reference swings below ground: keep that loop and the drive loop tight (common practice).',
  });
  return out;
}

export const zeta: Topology = {
  id: 'zeta',
  title: 'Zeta converter',
  summary:
    'High-side switch (floating gate drive) into an inductor to ground and a coupling capacitor that feeds an output inductor: a positive output above or below the input, Vout = Vin·D/(1−D), with continuous output current (buck-like output ripple) but pulsating input current. The switch and rectifier block Vin + Vout; the L1–Cs–L2 network rings on input steps.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components,
  operate,
  cautions,
};
