/**
 * Plot axes for server-rendered SVG: d3-scale for the mapping and the tick positions (1-2-5 steps on
 * linear axes, decades with 2 and 5 on log axes), engineering-unit tick labels from src/units/format.ts.
 */
import { scaleLinear, scaleLog } from 'd3-scale';
import type { FC } from 'hono/jsx';
import { formatSiShort } from '../../src/units/format.ts';

export interface Axis {
  /** Data value → pixel. */
  at: (value: number) => number;
  ticks: number[];
  label: (value: number) => string;
  title: string;
}

export interface Frame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** Padded domain so points do not sit on the frame; a single value gets a ±5 % (or ±1) window. */
export function paddedDomain(values: readonly number[], log: boolean): [number, number] {
  const finite = values.filter((v) => Number.isFinite(v) && (!log || v > 0));
  if (finite.length === 0) return log ? [1, 10] : [0, 1];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (log) {
    if (lo === hi) return [lo / 1.2, hi * 1.2];
    const pad = (hi / lo) ** 0.04;
    return [lo / pad, hi * pad];
  }
  if (lo === hi) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.05;
    return [lo - d, hi + d];
  }
  const pad = (hi - lo) * 0.05;
  lo -= pad;
  hi += pad;
  return [lo, hi];
}

/** Tick label for a value in `unit`: '' → plain number, '%' → percent, anything else SI-prefixed. */
export function tickFormatter(unit: string, integer = false): (v: number) => string {
  if (integer) return (v) => String(Math.round(v));
  if (unit === '%') return (v) => `${Number((v * 100).toPrecision(3))} %`;
  if (unit === 'mm³') return (v) => `${Math.round(v)}`;
  if (unit === '') return (v) => formatSiShort(v, '', 3);
  return (v) => formatSiShort(v, unit, 3);
}

export function makeAxis(
  domain: [number, number],
  range: [number, number],
  options: { log?: boolean; unit: string; title: string; integer?: boolean; count?: number },
): Axis {
  const count = options.count ?? 6;
  const format = tickFormatter(options.unit, options.integer);
  if (options.log) {
    const s = scaleLog().domain(domain).range(range);
    let ticks = s.ticks(count);
    // d3 gives every 1…9 multiple over a short log axis; keep the 1-2-5 ones, which never crowd.
    if (ticks.length > count + 2) {
      const lead = (t: number) => Math.round(t / 10 ** Math.floor(Math.log10(t) + 1e-9));
      const oneTwoFive = ticks.filter((t) => [1, 2, 5].includes(lead(t)));
      ticks = oneTwoFive.length >= 3 ? oneTwoFive : ticks.filter((t) => lead(t) === 1 || lead(t) === 3);
    }
    return { at: (v) => s(v), ticks, label: format, title: options.title };
  }
  const s = scaleLinear().domain(domain).range(range);
  let ticks = s.ticks(count);
  if (options.integer) ticks = ticks.filter((t) => Number.isInteger(t));
  return { at: (v) => s(v), ticks, label: format, title: options.title };
}

/** Frame, grid, ticks and axis titles. */
export const AxesFrame: FC<{ frame: Frame; x: Axis; y: Axis }> = ({ frame, x, y }) => {
  const { width, height, left, right, top, bottom } = frame;
  const x0 = left;
  const x1 = width - right;
  const y0 = height - bottom;
  const y1 = top;
  return (
    <g class="axes">
      <rect class="plot-area" x={x0} y={y1} width={x1 - x0} height={y0 - y1} />
      {x.ticks.map((t) => (
        <g class="tick">
          <line class="grid" x1={x.at(t)} x2={x.at(t)} y1={y1} y2={y0} />
          <text x={x.at(t)} y={y0 + 16} text-anchor="middle">
            {x.label(t)}
          </text>
        </g>
      ))}
      {y.ticks.map((t) => (
        <g class="tick">
          <line class="grid" x1={x0} x2={x1} y1={y.at(t)} y2={y.at(t)} />
          <text x={x0 - 6} y={y.at(t) + 4} text-anchor="end">
            {y.label(t)}
          </text>
        </g>
      ))}
      <text class="axis-title" x={(x0 + x1) / 2} y={height - 6} text-anchor="middle">
        {x.title}
      </text>
      <text class="axis-title" transform={`translate(14 ${(y0 + y1) / 2}) rotate(-90)`} text-anchor="middle">
        {y.title}
      </text>
    </g>
  );
};
