/**
 * The intermediate bus of a two-stage cascade: where it sits, and whether any bus satisfies both
 * stages' duty limits.
 *
 * Boost then buck: the bus sits above the highest input and the output, Vbus = max(Vin,max, Vout)·(1 + m).
 * Buck then boost: the bus sits below the lowest input and the output, Vbus = min(Vin,min, Vout)·(1 − m).
 * m = 15 % (common practice: keep the bus clear of the rails it sits between, so neither stage runs
 * at a duty near 0 or 1; the technology presets record the same figure as `busMargin`).
 *
 * Duties (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2), with an
 * allowance for the drops: a rectifier drop Vd and a resistive share r of the stage voltage. Drops raise
 * the duty of both a buck, D ≈ (Vo + Vd)/(Vi + Vd)·(1 + r), and a boost, D ≈ 1 − Vi·(1 − r)/(Vo + Vd), so
 * the bounds from the maximum duty use the allowance and the bounds from the minimum duty use the
 * lossless duty (both are then safe whatever the real drops, up to the allowance). With the controller's
 * duty limits [Dmin, Dmax] at fsw:
 *   boost then buck:  Vbus ≥ Vin,max/(1 − Dmin) (boost at Vin,max),  Vbus ≥ (Vout + Vd)(1 + r)/Dmax − Vd (buck),
 *                     Vbus ≤ Vin,min(1 − r)/(1 − Dmax) − Vd (boost at Vin,min),  Vbus ≤ Vout/Dmin (buck);
 *   buck then boost:  Vbus ≥ Dmin·Vin,max (buck at Vin,max),  Vbus ≥ (1 − Dmax)(Vout + Vd)/(1 − r) (boost),
 *                     Vbus ≤ Dmax(Vin,min + Vd)/(1 + r) − Vd (buck at Vin,min),  Vbus ≤ Vout(1 − Dmin) (boost).
 * The lossless bounds are tightened by 1 % so no stage is left exactly at its limit. The preferred bus
 * is clamped into that window; if the window is empty, no bus works: the candidate is infeasible and
 * the corner duty checks show where.
 */
import type { Design } from '../engine/design.ts';
import type { Reason, RectifierKind } from '../engine/types.ts';
import type { RailSpec } from '../spec/rail-spec.ts';

export type CascadeOrder = 'boost-buck' | 'buck-boost';

/** Distance of the bus from the rails it sits between, as a fraction (common practice). */
export const BUS_MARGIN = 0.15;
/** Tightening of the lossless duty bounds so no stage sits exactly at its limit (common practice). */
export const BUS_EDGE = 0.01;
/**
 * Drop allowance of the bus window: rectifier drop (V) by rectifier kind and resistive share of the stage
 * voltage (from memory: a Schottky rectifier near its rated current drops about 0.5 V; on-resistance,
 * sense resistor and winding together take a few per cent of the voltage of a well-designed stage).
 */
export const RECT_DROP_ALLOWANCE_V: Readonly<Record<RectifierKind, number>> = { diode: 0.5, sync: 0.2 };
export const RESISTIVE_DROP_ALLOWANCE = 0.04;

export interface BusChoice {
  /** The chosen bus (V). */
  busV: number;
  /** The bus the margin alone asks for (V). */
  preferredV: number;
  /** Window of buses that keep both stages within their duty limits (V); empty when lowV > highV. */
  lowV: number;
  highV: number;
  reachable: boolean;
  /** Actual distance of the chosen bus from the nearest rail it must clear, as a fraction. */
  margin: number;
  /** The rail the margin is measured from (V): the highest input or output, or the lowest. */
  railV: number;
}

export function chooseBus(
  order: CascadeOrder,
  spec: RailSpec,
  dutyMin: number,
  dutyMax: number,
  rect: RectifierKind,
  preferredMargin = BUS_MARGIN,
): BusChoice {
  const { minV, maxV } = spec.input;
  const vo = spec.output.voltageV;
  const e = 1 + BUS_EDGE;
  const vd = RECT_DROP_ALLOWANCE_V[rect];
  const r = RESISTIVE_DROP_ALLOWANCE;
  let railV: number;
  let preferredV: number;
  let lowV: number;
  let highV: number;
  if (order === 'boost-buck') {
    railV = Math.max(maxV, vo);
    preferredV = railV * (1 + preferredMargin);
    const boostMin = dutyMin < 1 ? (maxV / (1 - dutyMin)) * e : Infinity;
    const buckMax = dutyMax > 0 ? ((vo + vd) * (1 + r)) / dutyMax - vd : Infinity;
    const boostMax = dutyMax < 1 ? (minV * (1 - r)) / (1 - dutyMax) - vd : Infinity;
    const buckMin = dutyMin > 0 ? vo / dutyMin / e : Infinity;
    lowV = Math.max(boostMin, buckMax);
    highV = Math.min(boostMax, buckMin);
  } else {
    railV = Math.min(minV, vo);
    preferredV = railV * (1 - preferredMargin);
    const buckMin = dutyMin * maxV * e;
    const boostMax = ((1 - dutyMax) * (vo + vd)) / (1 - r);
    const buckMax = (dutyMax * (minV + vd)) / (1 + r) - vd;
    const boostMin = (vo * (1 - dutyMin)) / e;
    lowV = Math.max(buckMin, boostMax);
    highV = Math.min(buckMax, boostMin);
  }
  const reachable = lowV <= highV;
  let busV: number;
  if (reachable) busV = Math.min(Math.max(preferredV, lowV), highV);
  else if (order === 'boost-buck') busV = Number.isFinite(lowV) ? Math.max(preferredV, lowV) : preferredV;
  else busV = highV > 0 ? Math.min(preferredV, highV) : preferredV;
  const margin = order === 'boost-buck' ? busV / railV - 1 : 1 - busV / railV;
  return { busV, preferredV, lowV, highV, reachable, margin, railV };
}

/** The bus of a design (for `prepare`): the chosen voltage is stored in design.busV. */
export function prepareBus(order: CascadeOrder, d: Design, spec: RailSpec): void {
  d.busV = chooseBus(order, spec, d.dutyMin, d.dutyMax, d.params.rect, d.busMargin).busV;
}

/** 'bus-voltage-unreachable' when no bus keeps both stages inside the duty limits at this fsw. */
export function busReasons(order: CascadeOrder, d: Design, spec: RailSpec): Reason[] {
  const bus = chooseBus(order, spec, d.dutyMin, d.dutyMax, d.params.rect, d.busMargin);
  if (bus.reachable) return [];
  const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
  const kHz = (d.params.fswHz / 1e3).toFixed(0);
  const first = order === 'boost-buck' ? 'boost' : 'buck';
  return [
    {
      code: 'bus-voltage-unreachable',
      value: bus.lowV,
      limit: bus.highV,
      message:
        `no intermediate bus keeps both stages within the duty limits ${pct(d.dutyMin)}–${pct(d.dutyMax)} at ${kHz} kHz: ` +
        `the ${first} stage over ${spec.input.minV}–${spec.input.maxV} V and the second stage to ${spec.output.voltageV} V ` +
        `need a bus of at least ${bus.lowV.toFixed(2)} V and at most ${bus.highV.toFixed(2)} V`,
    },
  ];
}
