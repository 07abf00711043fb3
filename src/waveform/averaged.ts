/**
 * State-space averaging (Middlebrook & Ćuk, "A general unified approach to modelling switching-converter
 * power stages", IEEE PESC 1976): over a CCM period with configurations k lasting fractions d_k,
 *   A = Σ d_k·A_k,  B = Σ d_k·B_k,  C = Σ d_k·C_k,  D = Σ d_k·D_k,
 *   operating point X = −A⁻¹·B·U (states), Y = C·X + D·U (outputs).
 * A duty perturbation d̂ moves the trailing edge of the controlled gates by d̂·T, trading the configuration
 * just after the edge (k⁺) for the one just before it (k⁻):
 *   B_d = (A_k⁻ − A_k⁺)·X + (B_k⁻ − B_k⁺)·U,   E_d = (C_k⁻ − C_k⁺)·X + (D_k⁻ − D_k⁺)·U,
 * which for a two-configuration converter is the textbook B_d = (A₁ − A₂)X + (B₁ − B₂)U
 * (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 7).
 * The configurations and their durations come from the exact periodic steady state, so diode states
 * follow the circuit rather than an assumption.
 */
import { matVec, solveChecked } from './dense.ts';
import { SimulationError } from './errors.ts';
import type { Netlist } from './netlist.ts';
import { type CompiledCircuit, compileCircuit } from './state-space.ts';
import { type SteadyState, solvePeriodicSteadyState } from './steady-state.ts';

export interface AveragedModel {
  n: number;
  m: number;
  p: number;
  stateNames: string[];
  inputNames: string[];
  outputNames: string[];
  /** Averaged matrices, row-major: A n×n, B n×m, C p×n, D p×m. */
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
  d: Float64Array;
  /** Operating point: inputs U, states X = −A⁻¹BU, outputs Y = CX + DU. */
  u: Float64Array;
  x: Float64Array;
  y: Float64Array;
  /** Duty input: ẋ̂ += B_d·d̂ (n), ŷ += E_d·d̂ (p), per unit of duty (d̂ = 1 is a whole period). */
  bd: Float64Array;
  ed: Float64Array;
  /** The gate signals whose trailing edge the duty perturbation moves. */
  control: string[];
}

export interface AveragingOptions {
  /** V/I source values by name (the operating point). */
  inputs?: Record<string, number>;
  /** Gate signals whose duty is the control input (default: every pwm signal). */
  control?: string[];
  /** A steady state already solved for this netlist and inputs. */
  steady?: SteadyState;
  circuit?: CompiledCircuit;
}

function addScaled(acc: Float64Array, m: Float64Array, s: number): void {
  for (let i = 0; i < acc.length; i++) acc[i] += s * m[i];
}

/** (M⁻ − M⁺)·v for two matrices of `rows` rows. */
function diffTimes(mMinus: Float64Array, mPlus: Float64Array, v: Float64Array, rows: number): Float64Array {
  const diff = mMinus.map((x, i) => x - mPlus[i]);
  return matVec(diff, v, rows, v.length);
}

export function averageModel(netlist: Netlist, opts: AveragingOptions = {}): AveragedModel {
  const circuit = opts.circuit ?? compileCircuit(netlist);
  const steady =
    opts.steady ?? solvePeriodicSteadyState(netlist, opts.inputs ?? {}, { circuit, samples: 20 });
  if (steady.hasDiodeEvents) {
    throw new SimulationError(
      'averaging-requires-ccm',
      'state-space averaging needs a steady state whose configurations change only at gate edges (CCM); this one has diode events (DCM)',
      { segments: steady.segments.length },
    );
  }
  const { n, m, p } = circuit;
  const T = steady.periodS;
  const u = circuit.inputVector(opts.inputs ?? {});
  const a = new Float64Array(n * n);
  const b = new Float64Array(n * m);
  const c = new Float64Array(p * n);
  const d = new Float64Array(p * m);
  for (const seg of steady.segments) {
    const ss = circuit.configuration(seg.mask);
    const frac = (seg.endS - seg.startS) / T;
    addScaled(a, ss.a, frac);
    addScaled(b, ss.b, frac);
    addScaled(c, ss.c, frac);
    addScaled(d, ss.d, frac);
  }
  // X = −A⁻¹·B·U
  const bu = matVec(b, u, n, m);
  const x = solveChecked(a, n, bu, 1, 'the averaged state matrix A').map((v) => -v);
  const y = matVec(c, x, p, n);
  const du = matVec(d, u, p, m);
  for (let i = 0; i < p; i++) y[i] += du[i];
  const control = opts.control ?? Object.keys(netlist.pwm);
  const bd = new Float64Array(n);
  const ed = new Float64Array(p);
  const edges = new Set<number>();
  for (const name of control) {
    const sig = netlist.pwm[name];
    if (!sig) throw new SimulationError('invalid-netlist', `control '${name}' is not a pwm signal`);
    edges.add(sig.dutyTo - Math.floor(sig.dutyTo));
  }
  const segs = steady.segments;
  for (const phase of edges) {
    const k = segs.findIndex((s) => Math.abs(s.startS - phase * T) <= 1e-9 * T);
    if (k < 0)
      throw new SimulationError('invalid-netlist', `no configuration change at the trailing edge ${phase}`);
    const before = circuit.configuration(segs[(k + segs.length - 1) % segs.length].mask);
    const after = circuit.configuration(segs[k].mask);
    addScaled(bd, diffTimes(before.a, after.a, x, n), 1);
    addScaled(bd, diffTimes(before.b, after.b, u, n), 1);
    addScaled(ed, diffTimes(before.c, after.c, x, p), 1);
    addScaled(ed, diffTimes(before.d, after.d, u, p), 1);
  }
  return {
    n,
    m,
    p,
    stateNames: circuit.stateNames,
    inputNames: circuit.inputNames,
    outputNames: circuit.outputNames,
    a,
    b,
    c,
    d,
    u,
    x,
    y,
    bd,
    ed,
    control,
  };
}
