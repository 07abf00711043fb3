/**
 * Loss breakdown as one horizontal stacked bar per corner, by loss kind. Kinds differ by colour AND by
 * hatching pattern, each segment carries a <title> with its watts, and the legend names every kind;
 * the same numbers are in the table beside the chart.
 */
import type { FC } from 'hono/jsx';
import { formatSiShort } from '../../src/units/format.ts';
import { AxesFrame, type Frame, makeAxis } from './axes.tsx';

export const LOSS_KIND_STYLE: Record<string, { colour: string; pattern: string; label: string }> = {
  conduction: { colour: '#0072B2', pattern: 'none', label: 'conduction (I²R, diode drop)' },
  switching: { colour: '#D55E00', pattern: 'diag', label: 'switching (overlap, Coss, recovery)' },
  gate: { colour: '#E69F00', pattern: 'dots', label: 'gate drive' },
  core: { colour: '#009E73', pattern: 'cross', label: 'core (iGSE)' },
  capacitor: { colour: '#CC79A7', pattern: 'horiz', label: 'capacitor ESR' },
  other: { colour: '#595959', pattern: 'vert', label: 'other (sense, controller, damping)' },
};

const Patterns: FC = () => (
  <defs>
    {Object.entries(LOSS_KIND_STYLE).map(([kind, s]) => (
      <pattern id={`hatch-${kind}`} width="6" height="6" patternUnits="userSpaceOnUse">
        <rect width="6" height="6" fill={s.colour} />
        {s.pattern === 'diag' ? <path d="M0,6L6,0" stroke="white" stroke-width="1.2" /> : null}
        {s.pattern === 'dots' ? <circle cx="3" cy="3" r="1.1" fill="white" /> : null}
        {s.pattern === 'cross' ? <path d="M0,0L6,6M6,0L0,6" stroke="white" stroke-width="0.8" /> : null}
        {s.pattern === 'horiz' ? <path d="M0,3H6" stroke="white" stroke-width="1.2" /> : null}
        {s.pattern === 'vert' ? <path d="M3,0V6" stroke="white" stroke-width="1.2" /> : null}
      </pattern>
    ))}
  </defs>
);

export interface CornerLoss {
  label: string;
  lossByKind: Record<string, number>;
}

export const LossBars: FC<{ corners: CornerLoss[] }> = ({ corners }) => {
  const kinds = Object.keys(LOSS_KIND_STYLE);
  const barH = 22;
  const frame: Frame = {
    width: 640,
    height: 40 + corners.length * (barH + 10) + 10,
    left: 110,
    right: 70,
    top: 10,
    bottom: 40,
  };
  const totals = corners.map((c) => kinds.reduce((s, k) => s + (c.lossByKind[k] ?? 0), 0));
  const xs = makeAxis([0, Math.max(...totals, 1e-9) * 1.05], [frame.left, frame.width - frame.right], {
    unit: 'W',
    title: 'Loss (W)',
    count: 6,
  });
  const none = makeAxis([0, 1], [frame.height - frame.bottom, frame.top], { unit: '', title: '', count: 0 });
  none.ticks = [];
  return (
    <figure class="plot">
      <svg
        viewBox={`0 0 ${frame.width} ${frame.height}`}
        width={frame.width}
        height={frame.height}
        role="img"
        aria-label="Loss breakdown per corner"
        xmlns="http://www.w3.org/2000/svg"
      >
        <Patterns />
        <AxesFrame frame={frame} x={xs} y={none} />
        {corners.map((c, i) => {
          const y = frame.top + 10 + i * (barH + 10);
          let x = 0;
          return (
            <g>
              <text x={frame.left - 6} y={y + barH / 2 + 4} text-anchor="end">
                {c.label}
              </text>
              {kinds.map((k) => {
                const w = c.lossByKind[k] ?? 0;
                const x0 = xs.at(x);
                x += w;
                return w > 0 ? (
                  <rect
                    x={x0}
                    y={y}
                    width={Math.max(0, xs.at(x) - x0)}
                    height={barH}
                    fill={`url(#hatch-${k})`}
                    stroke="white"
                    stroke-width="0.5"
                  >
                    <title>{`${c.label}: ${k} ${formatSiShort(w, 'W', 3)}`}</title>
                  </rect>
                ) : null;
              })}
              <text x={xs.at(totals[i]) + 4} y={y + barH / 2 + 4}>
                {formatSiShort(totals[i], 'W', 3)}
              </text>
            </g>
          );
        })}
      </svg>
      <ul class="legend">
        {kinds.map((k) => (
          <li>
            <svg width="14" height="14" aria-hidden="true">
              <rect width="14" height="14" fill={`url(#hatch-${k})`} />
            </svg>{' '}
            {LOSS_KIND_STYLE[k].label}
          </li>
        ))}
      </ul>
    </figure>
  );
};
