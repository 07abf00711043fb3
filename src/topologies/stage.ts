/**
 * One switching stage of a cascade (a plain buck or a plain boost): the component slots it drives,
 * the drops it sees and what it reports back. The stage helpers (stage-buck.ts, stage-boost.ts) write
 * the waveforms of their own four parts; the cascade combines stage waveforms for the capacitors.
 */
import type { Design } from '../engine/design.ts';
import { SEGMENT_0, SEGMENT_1, type WaveSet } from '../engine/wave.ts';

/** Slots (indices into the design's parts) of one stage's switch, sense resistor, rectifier, inductor. */
export interface StageSlots {
  sw: number;
  sense: number;
  rect: number;
  inductor: number;
}

/**
 * One stage at one operating point: its inputs (filled by the caller: numbers travel in this object, not
 * as arguments, which V8 boxes when a call stays out of line) and its result (written in place).
 */
export interface StageState {
  /** Input and output voltage (V) and output current (A) the stage works between. */
  viV: number;
  voV: number;
  ioA: number;
  /** On-time fraction of the stage's controlled switch. */
  duty: number;
  /** Fraction of the period the rectifier conducts (1 − D in CCM, D₂ in DCM). */
  rectDuty: number;
  mode: 'ccm' | 'dcm';
  /** Average current the stage draws from its input (A), from the stage's own charge balance. */
  iinA: number;
  /** Average inductor current (A). */
  ilA: number;
  /** Inductor ripple, peak to peak (A). */
  ripplePpA: number;
  /** false when the stage has no steady state with its drops (or needs a duty outside [0, 1]). */
  converged: boolean;
}

export function newStageState(): StageState {
  return {
    viV: 0,
    voV: 0,
    ioA: 0,
    duty: 0,
    rectDuty: 0,
    mode: 'ccm',
    iinA: 0,
    ilA: 0,
    ripplePpA: 0,
    converged: true,
  };
}

/** The drops of one stage, taken from the design's present parasitics. */
export interface StageDrops {
  /** Switch path resistance: MOSFET on-resistance plus the sense resistor in series (Ω). */
  rqOhm: number;
  /** Rectifier knee: diode forward drop (V); 0 for a synchronous rectifier. */
  vfV: number;
  /** Rectifier slope: diode dynamic resistance or synchronous-rectifier on-resistance (Ω). */
  rrOhm: number;
  /** Inductor winding resistance (Ω). */
  rlOhm: number;
  /** true when the rectifier is a diode (the stage may then run discontinuous). */
  diode: boolean;
}

export function readDrops(d: Design, slots: StageSlots, out: StageDrops): void {
  const p = d.parts;
  const sync = d.params.rect === 'sync';
  out.rqOhm = p[slots.sw].ronOhm + p[slots.sense].value;
  out.vfV = sync ? 0 : p[slots.rect].vfV;
  out.rrOhm = sync ? p[slots.rect].ronOhm : p[slots.rect].rdOhm;
  out.rlOhm = p[slots.inductor].dcrOhm;
  out.diode = !sync;
}

export function newDrops(): StageDrops {
  return { rqOhm: 0, vfV: 0, rrOhm: 0, rlOhm: 0, diode: true };
}

/**
 * A stage's switch (and sense resistor) carries the inductor current while on, its rectifier while off:
 * both masked from the inductor's waveform (CCM and DCM alike; the parts' other fields stay zero).
 */
export function writeStageBranches(slots: StageSlots, w: WaveSet): void {
  w.combine(slots.sw, slots.inductor, 1, SEGMENT_0, slots.inductor, 0, 0);
  w.copy(slots.sense, slots.sw);
  w.combine(slots.rect, slots.inductor, 1, SEGMENT_1, slots.inductor, 0, 0);
}
