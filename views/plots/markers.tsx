/**
 * Topology markers: each topology gets a shape AND a colour, so the plots read in grey-scale print and
 * for colour-blind readers (the colours are the Okabe–Ito palette, "Color Universal Design", Okabe & Ito,
 * 2008, plus a dark grey). Shapes are paths centred on (0, 0).
 */
import type { FC } from 'hono/jsx';
import type { TopologyId } from '../../src/engine/types.ts';

type Shape =
  | 'circle'
  | 'square'
  | 'triangle'
  | 'diamond'
  | 'triangle-down'
  | 'plus'
  | 'cross'
  | 'star'
  | 'hexagon';

const ORDER: readonly TopologyId[] = [
  'sepic',
  'sepic-coupled',
  'sepic-damped',
  'inverting-buck-boost',
  'four-switch-buck-boost',
  'boost-then-buck',
  'buck-then-boost',
  'cuk',
  'zeta',
];
const SHAPES: readonly Shape[] = [
  'circle',
  'square',
  'triangle',
  'diamond',
  'triangle-down',
  'plus',
  'cross',
  'star',
  'hexagon',
];
const COLOURS: readonly string[] = [
  '#0072B2',
  '#D55E00',
  '#009E73',
  '#CC79A7',
  '#E69F00',
  '#56B4E9',
  '#000000',
  '#8c6d1f',
  '#595959',
];

export interface MarkerStyle {
  shape: Shape;
  colour: string;
}

export function markerFor(topology: TopologyId): MarkerStyle {
  const i = Math.max(0, ORDER.indexOf(topology));
  return { shape: SHAPES[i % SHAPES.length], colour: COLOURS[i % COLOURS.length] };
}

/** Path of a shape of "radius" r (area roughly that of a circle of radius r). */
export function shapePath(shape: Shape, r: number): string {
  const f = (v: number) => Number(v.toFixed(2));
  switch (shape) {
    case 'circle':
      return `M${f(-r)},0a${f(r)},${f(r)} 0 1,0 ${f(2 * r)},0a${f(r)},${f(r)} 0 1,0 ${f(-2 * r)},0Z`;
    case 'square': {
      const s = r * 0.89;
      return `M${f(-s)},${f(-s)}H${f(s)}V${f(s)}H${f(-s)}Z`;
    }
    case 'triangle': {
      const s = r * 1.35;
      return `M0,${f(-s)}L${f(s * 0.87)},${f(s * 0.5)}H${f(-s * 0.87)}Z`;
    }
    case 'triangle-down': {
      const s = r * 1.35;
      return `M0,${f(s)}L${f(s * 0.87)},${f(-s * 0.5)}H${f(-s * 0.87)}Z`;
    }
    case 'diamond': {
      const s = r * 1.25;
      return `M0,${f(-s)}L${f(s)},0L0,${f(s)}L${f(-s)},0Z`;
    }
    case 'plus': {
      const a = r * 1.2;
      const b = r * 0.4;
      return `M${f(-b)},${f(-a)}H${f(b)}V${f(-b)}H${f(a)}V${f(b)}H${f(b)}V${f(a)}H${f(-b)}V${f(b)}H${f(-a)}V${f(-b)}H${f(-b)}Z`;
    }
    case 'cross': {
      const a = r * 1.1;
      const b = r * 0.35;
      return `M${f(-a)},${f(-a + b)}L${f(-a + b)},${f(-a)}L0,${f(-b)}L${f(a - b)},${f(-a)}L${f(a)},${f(-a + b)}L${f(b)},0L${f(a)},${f(a - b)}L${f(a - b)},${f(a)}L0,${f(b)}L${f(-a + b)},${f(a)}L${f(-a)},${f(a - b)}L${f(-b)},0Z`;
    }
    case 'star': {
      const pts: string[] = [];
      for (let k = 0; k < 10; k++) {
        const rad = k % 2 === 0 ? r * 1.4 : r * 0.6;
        const ang = -Math.PI / 2 + (k * Math.PI) / 5;
        pts.push(`${f(rad * Math.cos(ang))},${f(rad * Math.sin(ang))}`);
      }
      return `M${pts.join('L')}Z`;
    }
    case 'hexagon': {
      const pts: string[] = [];
      for (let k = 0; k < 6; k++) {
        const ang = (k * Math.PI) / 3;
        pts.push(`${f(r * 1.1 * Math.cos(ang))},${f(r * 1.1 * Math.sin(ang))}`);
      }
      return `M${pts.join('L')}Z`;
    }
  }
}

/** A marker at (x, y); `filled` false draws the outline only (dominated points). */
export const Marker: FC<{ topology: TopologyId; x: number; y: number; r: number; filled: boolean }> = (p) => {
  const m = markerFor(p.topology);
  return (
    <path
      d={shapePath(m.shape, p.r)}
      transform={`translate(${p.x.toFixed(1)} ${p.y.toFixed(1)})`}
      fill={p.filled ? m.colour : 'white'}
      fill-opacity={p.filled ? 0.9 : 0.6}
      stroke={m.colour}
      stroke-width={p.filled ? 1.2 : 1}
    />
  );
};

/** Legend: one swatch per topology, with its name in words. */
export const TopologyLegend: FC<{ topologies: readonly TopologyId[]; titles: Record<string, string> }> = (
  p,
) => (
  <ul class="legend">
    {p.topologies.map((t) => (
      <li>
        <svg width="16" height="16" viewBox="-8 -8 16 16" aria-hidden="true">
          <Marker topology={t} x={0} y={0} r={5} filled={true} />
        </svg>{' '}
        {p.titles[t] ?? t}
      </li>
    ))}
  </ul>
);
