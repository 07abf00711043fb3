/**
 * Signals against time as a server-rendered SVG: one prefix per axis ("Time (µs)", "Current (A)"), each
 * trace drawn with its own colour AND dash pattern and named at its right-hand end (so it reads in
 * grey-scale print and without colour vision), plus a legend in words. Horizontal reference lines
 * (a final value, a peak) and vertical time marks (the step, the settling instant) are labelled.
 */
import type { FC } from 'hono/jsx';
import { AxesFrame, type Frame } from './axes.tsx';
import { decimateMinMax } from './decimate.ts';
import { engineeringAxis, seriesDomain } from './eng-axis.ts';

export interface Trace {
  /** Signal name in the simulation result ('L1.i'). */
  signal: string;
  /** Short name drawn at the trace's end ('i L1'). */
  tag: string;
  /** The trace in words, for the legend ('L1 current (input inductor)'). */
  words: string;
  values: ArrayLike<number>;
}

export interface LevelMark {
  value: number;
  label: string;
}

export interface TimeMark {
  timeS: number;
  label: string;
}

export interface TimePlotProps {
  /** What the plot shows, in words: the SVG's accessible name and the caption. */
  caption: string;
  timeS: ArrayLike<number>;
  traces: Trace[];
  unit: string;
  quantity: string;
  levels?: LevelMark[];
  timeMarks?: TimeMark[];
  /** Time shown as zero (s), e.g. the instant of a step; default the first sample. */
  originS?: number;
  width?: number;
  height?: number;
}

/** Okabe–Ito colours (Okabe & Ito, "Color Universal Design", 2008) with a distinct dash each. */
export const TRACE_STYLES: readonly { colour: string; dash?: string }[] = [
  { colour: '#0072B2' },
  { colour: '#D55E00', dash: '7 3' },
  { colour: '#009E73', dash: '2 2' },
  { colour: '#CC79A7', dash: '9 3 2 3' },
];

/** Spread label positions (px, any order) so neighbours are at least `gap` apart, staying in [lo, hi]. */
export function spreadLabels(ys: readonly number[], gap: number, lo: number, hi: number): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  const placed = order.map((o) => Math.min(hi, Math.max(lo, o.y)));
  for (let k = 1; k < placed.length; k++) placed[k] = Math.max(placed[k], placed[k - 1] + gap);
  // Pushed past the bottom: shift the whole run back up, keeping the gaps.
  const over = placed.length > 0 ? placed[placed.length - 1] - hi : 0;
  if (over > 0) for (let k = 0; k < placed.length; k++) placed[k] -= over;
  const out = new Array<number>(ys.length);
  order.forEach((o, k) => {
    out[o.i] = placed[k];
  });
  return out;
}

function lastFinite(values: ArrayLike<number>): number {
  for (let i = values.length - 1; i >= 0; i--) if (Number.isFinite(values[i])) return values[i];
  return 0;
}

export const TimePlot: FC<TimePlotProps> = (p) => {
  const width = p.width ?? 560;
  const height = p.height ?? 230;
  const frame: Frame = { width, height, left: 58, right: 64, top: 14, bottom: 40 };
  const x0 = frame.left;
  const x1 = width - frame.right;
  const yBottom = height - frame.bottom;
  const n = p.timeS.length;
  const first = n > 0 ? p.timeS[0] : 0;
  const t0 = p.originS ?? first;
  const t1 = n > 0 ? p.timeS[n - 1] : first + 1;
  const xs = engineeringAxis([first - t0, t1 > first ? t1 - t0 : first - t0 + 1], [x0, x1], {
    unit: 's',
    quantity: 'Time',
    count: 7,
  });
  const ys = engineeringAxis(
    seriesDomain(
      p.traces.map((t) => t.values),
      (p.levels ?? []).map((l) => l.value),
    ),
    [yBottom, frame.top],
    { unit: p.unit, quantity: p.quantity, count: 5 },
  );
  const columns = Math.max(1, Math.round(x1 - x0));
  const labelYs = spreadLabels(
    p.traces.map((t) => ys.at(lastFinite(t.values))),
    12,
    frame.top + 4,
    yBottom,
  );
  return (
    <figure class="plot time-plot">
      <svg
        class="waveform"
        viewBox={`0 0 ${width} ${height}`}
        width={width}
        height={height}
        role="img"
        aria-label={p.caption}
        xmlns="http://www.w3.org/2000/svg"
      >
        <AxesFrame frame={frame} x={xs} y={ys} />
        {(p.levels ?? []).map((l) => (
          <g class="level-mark">
            <line x1={x0} x2={x1} y1={ys.at(l.value)} y2={ys.at(l.value)} />
            <text x={x0 + 4} y={ys.at(l.value) - 3}>
              {l.label}
            </text>
          </g>
        ))}
        {(p.timeMarks ?? []).map((m, i) => {
          const x = xs.at(m.timeS - t0);
          const right = x > x0 + (x1 - x0) * 0.6;
          return (
            <g class="time-mark">
              <line x1={x} x2={x} y1={frame.top} y2={yBottom} />
              <text x={right ? x - 4 : x + 4} y={yBottom - 6 - 12 * i} text-anchor={right ? 'end' : 'start'}>
                {m.label}
              </text>
            </g>
          );
        })}
        {p.traces.map((t, k) => {
          const style = TRACE_STYLES[k % TRACE_STYLES.length];
          const keep = decimateMinMax(p.timeS, t.values, columns);
          const points = keep
            .filter((i) => Number.isFinite(t.values[i]))
            .map((i) => `${xs.at(p.timeS[i] - t0).toFixed(1)},${ys.at(t.values[i]).toFixed(1)}`)
            .join(' ');
          return (
            <g class="trace" data-signal={t.signal}>
              <title>{t.words}</title>
              <polyline
                points={points}
                fill="none"
                stroke={style.colour}
                stroke-width="1.5"
                stroke-dasharray={style.dash}
              />
              <line
                class="tag-swatch"
                x1={x1 + 4}
                x2={x1 + 16}
                y1={labelYs[k]}
                y2={labelYs[k]}
                stroke={style.colour}
                stroke-dasharray={style.dash}
              />
              <text class="trace-label" x={x1 + 19} y={labelYs[k] + 4} fill={style.colour}>
                {t.tag}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption>
        {p.caption}{' '}
        {p.traces.map((t, k) => {
          const style = TRACE_STYLES[k % TRACE_STYLES.length];
          return (
            <span class="trace-key">
              <svg width="22" height="8" aria-hidden="true">
                <line x1="1" x2="21" y1="4" y2="4" stroke={style.colour} stroke-dasharray={style.dash} />
              </svg>{' '}
              <strong>{t.tag}</strong>: {t.words}
            </span>
          );
        })}
      </figcaption>
    </figure>
  );
};
