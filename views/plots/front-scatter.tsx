/**
 * The front as an SVG scatter: x and y objectives chosen by the user, marker size for a third figure,
 * topology by shape and colour, front members filled and joined, dominated ones hollow. Each marker is
 * a link to its candidate sheet with a <title> tooltip carrying all its figures.
 */
import type { FC } from 'hono/jsx';
import type { Study, StudyCandidate } from '../../src/study/types.ts';
import { formatPercent, formatSiShort } from '../../src/units/format.ts';
import type { PlotAxis } from '../../src/web/view-state.ts';
import { AxesFrame, type Frame, makeAxis, paddedDomain } from './axes.tsx';
import { Marker } from './markers.tsx';

export const AXIS_INFO: Record<PlotAxis, { title: string; unit: string; integer?: boolean; log?: boolean }> =
  {
    lossW: { title: 'Loss at the worst full-load corner (W)', unit: 'W' },
    volumeMm3: { title: 'Magnetics + capacitor volume (mm³)', unit: 'mm³' },
    parts: { title: 'Power-stage parts', unit: '', integer: true },
    stress: { title: 'Semiconductor stress Σ V̂·Î / Pout', unit: '' },
    efficiency: { title: 'Efficiency at nominal input, full load', unit: '%' },
  };

export function axisValue(c: StudyCandidate, axis: PlotAxis): number {
  return axis === 'efficiency' ? c.efficiencyNom : c.objectives[axis];
}

/** Tooltip text: every figure of a candidate. */
export function candidateFigures(c: StudyCandidate): string {
  const o = c.objectives;
  return [
    c.id,
    `${formatSiShort(c.fswHz, 'Hz', 3)}, ripple ${c.ripple}, ${c.rect === 'sync' ? 'synchronous' : 'diode'} rectifier`,
    `loss ${formatSiShort(o.lossW, 'W', 3)}, efficiency ${formatPercent(c.efficiencyNom)} (nominal)`,
    `${o.parts} parts, stress ${o.stress.toPrecision(3)}, volume ${Math.round(o.volumeMm3)} mm³`,
    c.rank === 1 ? 'on the front' : `rank ${c.rank}`,
  ].join('\n');
}

const SIZE_ORDER: PlotAxis[] = ['volumeMm3', 'lossW', 'stress', 'parts'];

export interface ScatterProps {
  study: Study;
  x: PlotAxis;
  y: PlotAxis;
  /** Candidate sheet URL of an id. */
  href: (id: string) => string;
  width?: number;
  height?: number;
}

export const FrontScatter: FC<ScatterProps> = ({ study, x, y, href, width = 860, height = 460 }) => {
  const points = study.candidates.filter((c) => c.feasible);
  const frame: Frame = { width, height, left: 78, right: 16, top: 14, bottom: 44 };
  if (points.length === 0) {
    return <p class="empty">No feasible candidate to plot.</p>;
  }
  const xi = AXIS_INFO[x];
  const yi = AXIS_INFO[y];
  const xs = makeAxis(
    paddedDomain(
      points.map((c) => axisValue(c, x)),
      false,
    ),
    [frame.left, width - frame.right],
    xi,
  );
  const ys = makeAxis(
    paddedDomain(
      points.map((c) => axisValue(c, y)),
      false,
    ),
    [height - frame.bottom, frame.top],
    yi,
  );
  const sizeKey = SIZE_ORDER.find((k) => k !== x && k !== y)!;
  const sizes = points.map((c) => axisValue(c, sizeKey));
  const [sMin, sMax] = [Math.min(...sizes), Math.max(...sizes)];
  const radius = (c: StudyCandidate) => {
    const t = sMax > sMin ? (axisValue(c, sizeKey) - sMin) / (sMax - sMin) : 0.5;
    return 3 + 5 * Math.sqrt(t);
  };
  const front = points
    .filter((c) => c.rank === 1)
    .sort((a, b) => axisValue(a, x) - axisValue(b, x) || axisValue(a, y) - axisValue(b, y));
  const dominated = points.filter((c) => c.rank !== 1);
  const line = front
    .map((c) => `${xs.at(axisValue(c, x)).toFixed(1)},${ys.at(axisValue(c, y)).toFixed(1)}`)
    .join(' ');
  return (
    <figure class="plot">
      <svg
        class="scatter"
        viewBox={`0 0 ${width} ${height}`}
        width={width}
        height={height}
        role="img"
        aria-label={`Candidates: ${yi.title} against ${xi.title}; ${front.length} on the front of ${points.length} feasible`}
        xmlns="http://www.w3.org/2000/svg"
      >
        <AxesFrame frame={frame} x={xs} y={ys} />
        <g class="dominated">
          {dominated.map((c) => (
            <a href={href(c.id)}>
              <title>{candidateFigures(c)}</title>
              <Marker
                topology={c.topology}
                x={xs.at(axisValue(c, x))}
                y={ys.at(axisValue(c, y))}
                r={radius(c)}
                filled={false}
              />
            </a>
          ))}
        </g>
        <polyline class="front-line" points={line} />
        <g class="front" data-front-count={String(front.length)}>
          {front.map((c) => (
            <a href={href(c.id)} data-id={c.id}>
              <title>{candidateFigures(c)}</title>
              <Marker
                topology={c.topology}
                x={xs.at(axisValue(c, x))}
                y={ys.at(axisValue(c, y))}
                r={radius(c)}
                filled={true}
              />
            </a>
          ))}
        </g>
      </svg>
      <figcaption>
        Filled and joined: the front ({front.length} of {points.length} feasible candidates, non-dominated on{' '}
        {study.options.objectives.join(', ')}). Hollow: dominated. Marker size: {AXIS_INFO[sizeKey].title}.
        Hover a marker for its figures; click it for its sheet.
      </figcaption>
    </figure>
  );
};
