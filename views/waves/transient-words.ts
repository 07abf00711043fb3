/**
 * A transient in words, beside its plot: how far the output and the coupling capacitor overshoot, their
 * peak voltages, and how long the output takes to settle; and for the SEPIC family whether the coupling
 * network (Cs with the two inductors) rings, with the remedy when it does.
 *
 * Why it rings: an input step drives Cs through the series L–C of the coupling network; an undamped
 * second-order network answers a step by swinging to twice the step (100 % overshoot) — common practice.
 * The usual remedies are a coupled inductor (Cs then works against the windings' leakage instead of the
 * full L2, and the winding coupling ties the two currents together) or an R–C damping leg across Cs;
 * the damping-leg design follows the optimal-damping method of Erickson & Maksimović, Fundamentals of
 * Power Electronics, 2nd ed., Kluwer 2001, input-filter chapter (from memory). Common practice.
 */
import type { TopologyId } from '../../src/engine/types.ts';
import { formatSiShort } from '../../src/units/format.ts';

/** Cs overshoot ratio at and above which the coupling network is called ringing (towards 2×). */
export const RINGING_RATIO = 1.5;
/**
 * Cs overshoot ratio at or below which a damped network is called well damped: the step overshoot of a
 * second-order network with damping ratio ζ ≈ 0.28, 1 + exp(−πζ/√(1−ζ²)) ≈ 1.4 (common practice), well
 * under the 2 × of the undamped network. The Rd–Cd legs this tool sizes land at 1.3–1.4 in the engine.
 */
export const WELL_DAMPED_RATIO = 1.4;

export interface TransientFacts {
  analysis: 'startup' | 'step';
  topology: TopologyId;
  /** Peak excursion over the final change, by signal ('out.v', 'Cs.v'); 1 = no overshoot. */
  overshoot?: Record<string, number>;
  /** Peak voltages reached (V), by signal. */
  peaks?: Record<string, number>;
  settlingTimeS?: number;
  /** Output voltage at the end of the run (V). */
  finalOutV?: number;
  /** The input step applied (V), for 'step'; fromSpec: the rail spec names it (else the default step). */
  step?: { fromV: number; toV: number; fromSpec: boolean };
  /** False when the run ended before the states reached the final periodic steady state. */
  settled?: boolean;
  /** Largest |current| of each inductor over the run (A), by part name ('L1'). */
  inductorPeaksA?: Record<string, number>;
}

const v = (x: number) => formatSiShort(x, 'V', 3);
const ratio = (r: number) => `${r.toFixed(2)} ×`;
const percent = (r: number) => `${Math.round((r - 1) * 100)} %`;

/** The overshoot ratio in words: "1.93 × the final change (93 % overshoot)"; "no overshoot" at ≤ 1. */
export function overshootWords(r: number): string {
  if (!(r > 1.005)) return 'no overshoot';
  return `${ratio(r)} the final change (${percent(r)} overshoot)`;
}

function opening(f: TransientFacts): string {
  if (f.analysis === 'startup') {
    return `Start-up from zero at nominal input and full load${f.finalOutV !== undefined ? `, to ${v(f.finalOutV)}` : ''}.`;
  }
  if (!f.step) return 'Input step at full load.';
  const { fromV, toV, fromSpec } = f.step;
  const change = Math.round(((toV - fromV) / fromV) * 100);
  const why = fromSpec ? "the spec's step" : `${change >= 0 ? '+' : ''}${change} %; the spec names no step`;
  return `Input step from ${v(fromV)} to ${v(toV)} at full load (${why}), duty held at its value for ${v(fromV)} (open loop).`;
}

function outputSentence(f: TransientFacts): string | undefined {
  const parts: string[] = [];
  const os = f.overshoot?.['out.v'];
  const peak = f.peaks?.['out.v'];
  if (peak !== undefined) parts.push(`peaks at ${v(peak)}`);
  if (os !== undefined) parts.push(`${parts.length ? 'that is ' : ''}${overshootWords(os)}`);
  if (f.settlingTimeS !== undefined && Number.isFinite(f.settlingTimeS)) {
    parts.push(`settles within 2 % of its final change in ${formatSiShort(f.settlingTimeS, 's', 3)}`);
  }
  return parts.length ? `Output: ${parts.join(', ')}.` : undefined;
}

function couplingSentence(f: TransientFacts): string | undefined {
  const os = f.overshoot?.['Cs.v'];
  const peak = f.peaks?.['Cs.v'];
  if (os === undefined && peak === undefined) return undefined;
  const parts: string[] = [];
  if (peak !== undefined) parts.push(`peaks at ${v(peak)}`);
  if (os !== undefined) parts.push(overshootWords(os));
  return `Coupling capacitor Cs: ${parts.join(', ')}.`;
}

function inductorSentence(f: TransientFacts): string | undefined {
  const peaks = Object.entries(f.inductorPeaksA ?? {}).filter(([, a]) => Number.isFinite(a));
  if (peaks.length === 0) return undefined;
  const list = peaks.map(([name, a]) => `${formatSiShort(a, 'A', 3)} (${name})`).join(' and ');
  const advice =
    f.analysis === 'startup'
      ? 'the inductors must not saturate there, or a soft-start must limit it'
      : 'check it against the inductors’ saturation current';
  return `Inductor current peaks at ${list} during this run: ${advice}.`;
}

/** Whether the coupling network rings, and what to do about it; only where a Cs overshoot is known. */
export function ringingVerdict(topology: TopologyId, csOvershoot: number | undefined): string | undefined {
  if (csOvershoot === undefined || !Number.isFinite(csOvershoot)) return undefined;
  const r = ratio(csOvershoot);
  const pct = `${percent(csOvershoot)} overshoot, against about 100 % for an undamped coupling network`;
  if (topology === 'sepic-damped') {
    return csOvershoot <= WELL_DAMPED_RATIO
      ? `Well damped: the Rd–Cd leg across Cs holds its swing to ${r} the step (${pct}).`
      : `The Rd–Cd leg damps the coupling network only partly: Cs swings to ${r} the step (${pct}); revisit Rd and Cd.`;
  }
  if (csOvershoot < RINGING_RATIO) {
    return topology === 'sepic-coupled'
      ? `The coupled inductor keeps the coupling network quiet: Cs swings to ${r} the step (${pct}).`
      : `The coupling network rings little: Cs swings to ${r} the step (${pct}).`;
  }
  const network = 'the coupling network (Cs between the two inductors) is lightly damped';
  if (topology === 'sepic-coupled') {
    return `Visible ringing: ${network}; Cs swings to ${r} the step (${pct}). The coupled inductor alone does not damp it here; an Rd–Cd damping leg across Cs would.`;
  }
  const remedy =
    topology === 'sepic'
      ? 'Remedy: a coupled inductor (the sepic-coupled candidates) or an Rd–Cd damping leg across Cs (sepic-damped).'
      : 'Remedy: an Rd–Cd damping leg across Cs, or a coupled-inductor variant of this stage.';
  return `Visible ringing: ${network}; Cs swings to ${r} the step, about the 2 × an undamped network reaches. ${remedy}`;
}

/** Sentences for the transient's caption, in reading order. */
export function describeTransient(f: TransientFacts): string[] {
  return [
    opening(f),
    outputSentence(f),
    couplingSentence(f),
    inductorSentence(f),
    f.analysis === 'step' ? ringingVerdict(f.topology, f.overshoot?.['Cs.v']) : undefined,
    f.settled === false
      ? 'The run stopped at its length cap before reaching the final steady state: the figures are those of the simulated window.'
      : undefined,
  ].filter((s): s is string => s !== undefined);
}
