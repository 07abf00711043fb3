/**
 * Bode plot as a server-rendered SVG: magnitude (dB) above phase (degrees), on one log frequency axis.
 * Curves differ by colour and dash and are named in a key; the frequencies that limit a loop (the RHP
 * zero, lightly damped resonances, the suggested crossover) are vertical lines through both panels,
 * each labelled with its name and frequency in its own row so close marks never overprint.
 */
import type { FC } from 'hono/jsx';
import { formatSiShort } from '../../src/units/format.ts';
import { AxesFrame, type Axis, type Frame, makeAxis } from './axes.tsx';
import { decimalsFor } from './eng-axis.ts';
import { TRACE_STYLES } from './time-plot.tsx';

export interface BodeCurve {
  key: string;
  words: string;
  magDb: ArrayLike<number>;
  phaseDeg: ArrayLike<number>;
}

export type FrequencyMarkKind = 'rhp-zero' | 'resonance' | 'crossover';

export interface FrequencyMark {
  kind: FrequencyMarkKind;
  freqHz: number;
  label: string;
}

const MARK_STYLE: Record<FrequencyMarkKind, { colour: string; dash: string }> = {
  'rhp-zero': { colour: '#B00020', dash: '5 3' },
  resonance: { colour: '#555555', dash: '2 3' },
  crossover: { colour: '#007A4D', dash: '10 3' },
};

/** Phase made continuous: a jump of more than 180° between neighbours is a ±360° wrap, undone. */
export function unwrapPhase(phaseDeg: ArrayLike<number>): number[] {
  const out: number[] = [];
  let offset = 0;
  for (let i = 0; i < phaseDeg.length; i++) {
    if (i > 0) {
      const jump = phaseDeg[i] + offset - out[i - 1];
      if (jump > 180) offset -= 360 * Math.round(jump / 360);
      else if (jump < -180) offset += 360 * Math.round(-jump / 360);
    }
    out.push(phaseDeg[i] + offset);
  }
  return out;
}

/** Phase axis with ticks on multiples of 45° (90° over wide spans), labelled in degrees. */
function phaseAxis(values: number[], range: [number, number]): Axis {
  const finite = values.filter(Number.isFinite);
  const lo0 = finite.length ? Math.min(...finite) : -180;
  const hi0 = finite.length ? Math.max(...finite) : 0;
  const step = hi0 - lo0 > 300 ? 90 : 45;
  const lo = Math.floor((lo0 - 5) / step) * step;
  const hi = Math.ceil((hi0 + 5) / step) * step;
  const span = hi - lo || step;
  const ticks: number[] = [];
  for (let t = lo; t <= hi; t += step) ticks.push(t);
  return {
    at: (v) => range[0] + ((v - lo) / span) * (range[1] - range[0]),
    ticks,
    label: (v) => `${v}°`,
    title: 'Phase (°)',
  };
}

function magnitudeAxis(curves: BodeCurve[], range: [number, number]): Axis {
  const all: number[] = [];
  for (const c of curves)
    for (let i = 0; i < c.magDb.length; i++) if (Number.isFinite(c.magDb[i])) all.push(c.magDb[i]);
  const lo = all.length ? Math.min(...all) : -40;
  const hi = all.length ? Math.max(...all) : 40;
  const pad = Math.max(3, (hi - lo) * 0.06);
  const axis = makeAxis([lo - pad, hi + pad], range, { unit: '', title: 'Magnitude (dB)', count: 5 });
  const decimals = decimalsFor(axis.ticks.length > 1 ? axis.ticks[1] - axis.ticks[0] : 1);
  return { ...axis, label: (v) => v.toFixed(decimals) };
}

function path(freqHz: ArrayLike<number>, ys: ArrayLike<number>, x: Axis, y: Axis): string {
  const pts: string[] = [];
  for (let i = 0; i < freqHz.length; i++) {
    if (freqHz[i] > 0 && Number.isFinite(ys[i]))
      pts.push(`${x.at(freqHz[i]).toFixed(1)},${y.at(ys[i]).toFixed(1)}`);
  }
  return pts.join(' ');
}

export const BodePlot: FC<{
  caption: string;
  freqHz: ArrayLike<number>;
  curves: BodeCurve[];
  marks: FrequencyMark[];
  width?: number;
}> = (p) => {
  const width = p.width ?? 760;
  const rows = Math.max(1, p.marks.length);
  const magFrame: Frame = {
    width,
    height: 210 + 13 * rows,
    left: 58,
    right: 20,
    top: 8 + 13 * rows,
    bottom: 38,
  };
  const phaseFrame: Frame = { width, height: 190, left: 58, right: 20, top: 10, bottom: 40 };
  const height = magFrame.height + phaseFrame.height;
  const fs = Array.from(p.freqHz).filter((f) => f > 0);
  const domain: [number, number] = fs.length > 1 ? [Math.min(...fs), Math.max(...fs)] : [10, 1e6];
  const x = makeAxis(domain, [magFrame.left, width - magFrame.right], {
    log: true,
    unit: 'Hz',
    title: 'Frequency (Hz)',
    count: 6,
  });
  const phases = p.curves.map((c) => unwrapPhase(c.phaseDeg));
  const mag = magnitudeAxis(p.curves, [magFrame.height - magFrame.bottom, magFrame.top]);
  const ph = phaseAxis(phases.flat(), [phaseFrame.height - phaseFrame.bottom, phaseFrame.top]);
  const inside = p.marks.filter((m) => m.freqHz >= domain[0] && m.freqHz <= domain[1]);
  const markLines = (frame: Frame, withLabels: boolean) =>
    inside.map((m, i) => {
      const style = MARK_STYLE[m.kind];
      const xm = x.at(m.freqHz);
      const right = xm > width - magFrame.right - 150;
      return (
        <g class={`freq-mark ${m.kind}`} data-freq-hz={String(m.freqHz)}>
          <line
            x1={xm}
            x2={xm}
            y1={withLabels ? 6 + 13 * i : frame.top}
            y2={frame.height - frame.bottom}
            stroke={style.colour}
            stroke-width="1.3"
            stroke-dasharray={style.dash}
          />
          {withLabels ? (
            <text
              class="mark-label"
              x={right ? xm - 4 : xm + 4}
              y={15 + 13 * i}
              text-anchor={right ? 'end' : 'start'}
              fill={style.colour}
            >
              {m.label}
            </text>
          ) : null}
        </g>
      );
    });
  return (
    <figure class="plot bode-plot">
      <svg
        class="bode"
        viewBox={`0 0 ${width} ${height}`}
        width={width}
        height={height}
        role="img"
        aria-label={p.caption}
        xmlns="http://www.w3.org/2000/svg"
      >
        <g class="magnitude">
          <AxesFrame frame={magFrame} x={{ ...x, title: '' }} y={mag} />
          {markLines(magFrame, true)}
          {p.curves.map((c, k) => {
            const s = TRACE_STYLES[k % TRACE_STYLES.length];
            return (
              <polyline
                class="bode-curve"
                data-curve={c.key}
                points={path(p.freqHz, c.magDb, x, mag)}
                fill="none"
                stroke={s.colour}
                stroke-width="1.6"
                stroke-dasharray={s.dash}
              >
                <title>{`${c.words}: magnitude`}</title>
              </polyline>
            );
          })}
        </g>
        <g class="phase" transform={`translate(0 ${magFrame.height})`}>
          <AxesFrame frame={phaseFrame} x={x} y={ph} />
          {markLines(phaseFrame, false)}
          {p.curves.map((c, k) => {
            const s = TRACE_STYLES[k % TRACE_STYLES.length];
            return (
              <polyline
                class="bode-curve"
                data-curve={c.key}
                points={path(p.freqHz, phases[k], x, ph)}
                fill="none"
                stroke={s.colour}
                stroke-width="1.6"
                stroke-dasharray={s.dash}
              >
                <title>{`${c.words}: phase`}</title>
              </polyline>
            );
          })}
        </g>
      </svg>
      <figcaption>
        {p.caption}{' '}
        {p.curves.map((c, k) => {
          const s = TRACE_STYLES[k % TRACE_STYLES.length];
          return (
            <span class="trace-key">
              <svg width="22" height="8" aria-hidden="true">
                <line
                  x1="1"
                  x2="21"
                  y1="4"
                  y2="4"
                  stroke={s.colour}
                  stroke-width="1.6"
                  stroke-dasharray={s.dash}
                />
              </svg>{' '}
              {c.words}
            </span>
          );
        })}
      </figcaption>
    </figure>
  );
};

/** Label of a frequency mark: its name and its frequency in engineering units. */
export function frequencyMarkLabel(kind: FrequencyMarkKind, freqHz: number, q?: number): string {
  const f = formatSiShort(freqHz, 'Hz', 3);
  if (kind === 'rhp-zero') return `RHP zero ${f}`;
  if (kind === 'resonance')
    return `resonance ${f}${q !== undefined && Number.isFinite(q) ? `, Q ${q.toPrecision(2)}` : ''}`;
  return `suggested crossover ${f}`;
}
