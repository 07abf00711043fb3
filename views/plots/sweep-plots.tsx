/**
 * Per-topology frequency sweeps: best nominal efficiency and smallest volume against switching frequency
 * (log axis), with the best-efficiency, smallest-volume and knee frequencies marked and labelled in words.
 */
import type { FC } from 'hono/jsx';
import type { TopologyId } from '../../src/engine/types.ts';
import type { SweepHighlights, SweepPoint } from '../../src/study/types.ts';
import { formatPercent, formatSiShort } from '../../src/units/format.ts';
import { AxesFrame, type Frame, makeAxis, paddedDomain } from './axes.tsx';
import { markerFor } from './markers.tsx';

interface Mark {
  fswHz: number;
  value: number;
  label: string;
  id?: string;
}

const SweepPanel: FC<{
  points: SweepPoint[];
  value: (p: SweepPoint) => number;
  unit: string;
  title: string;
  colour: string;
  marks: Mark[];
  href: (id: string) => string;
  caption: string;
}> = (p) => {
  const frame: Frame = { width: 340, height: 210, left: 64, right: 12, top: 12, bottom: 40 };
  const fs = p.points.map((q) => q.fswHz);
  const xs = makeAxis(paddedDomain(fs, true), [frame.left, frame.width - frame.right], {
    log: true,
    unit: 'Hz',
    title: 'Switching frequency',
    count: 4,
  });
  const ys = makeAxis(
    paddedDomain([...p.points.map(p.value), ...p.marks.map((m) => m.value)], false),
    [frame.height - frame.bottom, frame.top],
    {
      unit: p.unit,
      title: p.title,
      count: 4,
    },
  );
  const path = p.points.map((q) => `${xs.at(q.fswHz).toFixed(1)},${ys.at(p.value(q)).toFixed(1)}`).join(' ');
  return (
    <svg
      class="sweep"
      viewBox={`0 0 ${frame.width} ${frame.height}`}
      width={frame.width}
      height={frame.height}
      role="img"
      aria-label={p.caption}
      xmlns="http://www.w3.org/2000/svg"
    >
      <AxesFrame frame={frame} x={xs} y={ys} />
      <polyline class="sweep-line" points={path} stroke={p.colour} />
      {p.points.map((q) => (
        <circle cx={xs.at(q.fswHz)} cy={ys.at(p.value(q))} r="2.2" fill={p.colour}>
          <title>{`${formatSiShort(q.fswHz, 'Hz', 3)}: ${p.unit === '%' ? formatPercent(p.value(q)) : `${Math.round(p.value(q))} mm³`}`}</title>
        </circle>
      ))}
      {p.marks.map((m, i) => {
        const x = xs.at(m.fswHz);
        const y = ys.at(m.value);
        // Keep labels inside the frame: beside the point near an edge, below it near the top.
        const anchor = x > frame.width - frame.right - 40 ? 'end' : x < frame.left + 40 ? 'start' : 'middle';
        const dx = anchor === 'end' ? -8 : anchor === 'start' ? 8 : 0;
        const dy = y < frame.top + 24 ? 16 + 11 * i : -9 - 11 * i;
        return (
          <a href={m.id ? p.href(m.id) : undefined}>
            <title>{`${m.label}: ${formatSiShort(m.fswHz, 'Hz', 3)}`}</title>
            <circle class="highlight" cx={x} cy={y} r="5.5" />
            <text class="mark-label" x={x + dx} y={y + dy} text-anchor={anchor}>
              {m.label}
            </text>
          </a>
        );
      })}
    </svg>
  );
};

export const SweepPlots: FC<{
  topology: TopologyId;
  title: string;
  points: SweepPoint[];
  highlights?: SweepHighlights;
  href: (id: string) => string;
}> = ({ topology, title, points, highlights, href }) => {
  const colour = markerFor(topology).colour;
  if (points.length === 0 || !highlights) {
    return (
      <div class="sweep-pair">
        <h4>{title}</h4>
        <p class="empty">No feasible frequency in the band.</p>
      </div>
    );
  }
  const h = highlights;
  const effMarks: Mark[] = [
    {
      fswHz: h.bestEfficiency.fswHz,
      value: h.bestEfficiency.efficiency,
      label: 'best η',
      id: h.bestEfficiency.id,
    },
    { fswHz: h.knee.fswHz, value: h.knee.efficiency, label: 'knee' },
  ];
  const volMarks: Mark[] = [
    {
      fswHz: h.smallestVolume.fswHz,
      value: h.smallestVolume.volumeMm3,
      label: 'smallest',
      id: h.smallestVolume.id,
    },
    { fswHz: h.knee.fswHz, value: h.knee.volumeMm3, label: 'knee' },
  ];
  return (
    <div class="sweep-pair">
      <h4>{title}</h4>
      <div class="sweep-panels">
        <SweepPanel
          points={points}
          value={(p) => p.efficiency}
          unit="%"
          title="Efficiency (nominal)"
          colour={colour}
          marks={effMarks}
          href={href}
          caption={`${title}: best nominal efficiency against switching frequency`}
        />
        <SweepPanel
          points={points}
          value={(p) => p.volumeMm3}
          unit="mm³"
          title="Volume (mm³)"
          colour={colour}
          marks={volMarks}
          href={href}
          caption={`${title}: smallest volume against switching frequency`}
        />
      </div>
      <p class="sweep-notes">
        Best efficiency {formatPercent(h.bestEfficiency.efficiency)} at{' '}
        {formatSiShort(h.bestEfficiency.fswHz, 'Hz', 3)}; smallest volume{' '}
        {Math.round(h.smallestVolume.volumeMm3)} mm³ at {formatSiShort(h.smallestVolume.fswHz, 'Hz', 3)}; knee
        at {formatSiShort(h.knee.fswHz, 'Hz', 3)} ({formatPercent(h.knee.efficiency)},{' '}
        {Math.round(h.knee.volumeMm3)} mm³).
      </p>
    </div>
  );
};
