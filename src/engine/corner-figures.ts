/**
 * What a candidate's verdict needs from each corner, without the per-component report records: the
 * scalars, the loss and power balance, and the input-capacitor RMS current. A study evaluates thousands
 * of candidates and keeps only these; the candidate sheet builds the full CornerDetail beside them from
 * the same buffers, so both paths judge a candidate on identical numbers.
 */
import { formatSi } from '../units/format.ts';
import type { Design } from './design.ts';
import type { Corner, Mode, Reason } from './types.ts';

export interface CornerFigures {
  label: string;
  vinV: number;
  ioutA: number;
  fullLoad: boolean;
  duty: number;
  duty2: number;
  mode: Mode;
  converged: boolean;
  lossW: number;
  poutW: number;
  pinW: number;
  efficiency: number;
  /** RMS current of the part named Cin (A); undefined when the topology has none. */
  cinRmsA: number | undefined;
}

/**
 * Duty limits, light-load DCM and convergence, per corner, with the numbers. When the switching period
 * leaves no on-time window at all (the minimum on-time at or above the largest duty the minimum off-time
 * and the controller's ceiling allow), that is one reason for the candidate instead of two per corner
 * against limits outside 0–100 %.
 */
export function cornerReasons(d: Design, ccmRequired: boolean, figures: CornerFigures[]): Reason[] {
  const out: Reason[] = [];
  const fsw = d.params.fswHz;
  const windowClosed = !(d.dutyMax > d.dutyMin);
  if (windowClosed) {
    const T = 1 / fsw;
    out.push({
      code: 'period-too-short',
      value: T,
      limit: d.dutyMin * T + (1 - Math.max(0, d.dutyMax)) * T,
      message:
        `${formatSi(fsw, 'Hz')} is too fast for the controller: its ${formatSi(T, 's')} period leaves no on-time ` +
        `between the minimum on-time (${formatSi(d.dutyMin * T, 's')}) and the longest on-time the minimum ` +
        `off-time and duty ceiling allow (${formatSi(Math.max(0, d.dutyMax) * T, 's')})`,
    });
  }
  for (const r of figures) {
    if (!r.converged && r.fullLoad) {
      out.push({
        code: 'not-converged',
        corner: r.label,
        message: `${r.label}: no steady state with these drops (the stage cannot reach ${Math.abs(d.voutV)} V from ${r.vinV} V)`,
      });
      continue;
    }
    if (!r.fullLoad) {
      if (r.mode === 'dcm' && ccmRequired) {
        out.push({
          code: 'dcm-light-load',
          corner: r.label,
          value: r.ioutA,
          message: `${r.label}: discontinuous conduction at ${r.ioutA} A while the spec requires CCM`,
        });
      }
      continue;
    }
    // the commanded duties at a corner that must respect min on/off time
    if (windowClosed) continue;
    for (let i = 0; i < (r.duty2 > 0 ? 2 : 1); i++) {
      const duty = i === 0 ? r.duty : r.duty2;
      if (duty > d.dutyMax + 1e-12) {
        out.push({
          code: 'duty-above-max',
          corner: r.label,
          value: duty,
          limit: d.dutyMax,
          message: `${r.label}: duty ${(duty * 100).toFixed(1)} % above the ${(d.dutyMax * 100).toFixed(1)} % allowed at ${formatSi(fsw, 'Hz')} (min off-time, controller ceiling)`,
        });
      }
      if (duty > 0 && duty < d.dutyMin - 1e-12) {
        out.push({
          code: 'duty-below-min-on-time',
          corner: r.label,
          value: duty,
          limit: d.dutyMin,
          message: `${r.label}: duty ${(duty * 100).toFixed(1)} % below the ${(d.dutyMin * 100).toFixed(1)} % that the minimum on-time allows at ${formatSi(fsw, 'Hz')}`,
        });
      }
    }
  }
  return out;
}

/** Figures of the nominal full-load corner (vin-nom, else the first corner; as nominalCorner). */
export function nominalFigures(corners: Corner[], figures: CornerFigures[]): CornerFigures {
  const i = corners.findIndex((c) => c.label === 'vin-nom');
  return figures[Math.max(i, 0)];
}
