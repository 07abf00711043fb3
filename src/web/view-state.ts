/**
 * Everything a study page shows, as URL query parameters, so every view is a bookmarkable URL and the
 * back button restores it: the spec (`s`), the sweep (`fp`, `rp`, `obj`, `w`), the plot axes (`x`, `y`),
 * the table order and filter (`sort`, `dir`, `topo`, `verdict`).
 */

import { OBJECTIVE_KEYS } from '../study/options.ts';
import type { ObjectiveKey } from '../study/types.ts';
import { encodeSpec } from './spec-codec.ts';
import type { FormValues } from './spec-fields.ts';

/** Web defaults: a coarser grid than the CLI's so a study answers while the user types. */
export const WEB_FREQUENCY_POINTS = 10;
/** Largest sweep the web app accepts (candidates). */
export const WEB_MAX_CANDIDATES = 6000;

export const PLOT_AXES = ['lossW', 'volumeMm3', 'parts', 'stress', 'efficiency'] as const;
export type PlotAxis = (typeof PLOT_AXES)[number];

export const SORT_KEYS = [
  'id',
  'topology',
  'fsw',
  'ripple',
  'rect',
  'parts',
  'lossW',
  'efficiency',
  'stress',
  'volumeMm3',
  'verdict',
] as const;
export type SortKey = (typeof SORT_KEYS)[number];

export const VERDICT_FILTERS = ['all', 'front', 'dominated', 'infeasible'] as const;
export type VerdictFilter = (typeof VERDICT_FILTERS)[number];

/** Sweep options as typed (text), so a bad value is re-shown beside its field. */
export interface SweepText {
  fp: string;
  rp: string;
  obj: string[];
  /** Weight text by objective key (`w.lossW=2`); blank means 1. */
  w: Record<string, string>;
}

export interface ViewState {
  spec: FormValues;
  sweep: SweepText;
  x: PlotAxis;
  y: PlotAxis;
  sort: SortKey;
  dir: 'asc' | 'desc';
  topo: string;
  verdict: VerdictFilter;
}

const pick = <T extends string>(allowed: readonly T[], v: string | undefined, fallback: T): T =>
  v !== undefined && (allowed as readonly string[]).includes(v) ? (v as T) : fallback;

/** Objectives named in a comma list, unknown names kept so the options check can report them. */
export function splitList(text: string | undefined): string[] {
  return (text ?? '')
    .split(/[,\s]+/)
    .map((s) => s.trim())
    .filter((s) => s !== '')
    .slice(0, 20);
}

export function sweepFromQuery(q: Record<string, string | string[] | undefined>): SweepText {
  const one = (k: string) => {
    const v = q[k];
    return (Array.isArray(v) ? v[0] : v)?.slice(0, 200);
  };
  const objRaw = q.obj;
  const obj = Array.isArray(objRaw) ? objRaw.flatMap((o) => splitList(o)) : splitList(objRaw);
  const w: Record<string, string> = {};
  for (const k of OBJECTIVE_KEYS) {
    const v = one(`w.${k}`)?.trim();
    if (v) w[k] = v;
  }
  return { fp: one('fp') ?? String(WEB_FREQUENCY_POINTS), rp: one('rp') ?? '', obj, w };
}

export function viewFromQuery(spec: FormValues, q: Record<string, string | string[] | undefined>): ViewState {
  const one = (k: string) => {
    const v = q[k];
    return Array.isArray(v) ? v[0] : v;
  };
  return {
    spec,
    sweep: sweepFromQuery(q),
    x: pick(PLOT_AXES, one('x'), 'lossW'),
    y: pick(PLOT_AXES, one('y'), 'volumeMm3'),
    sort: pick(SORT_KEYS, one('sort'), 'verdict'),
    dir: one('dir') === 'desc' ? 'desc' : 'asc',
    topo: (one('topo') ?? 'all').slice(0, 40),
    verdict: pick(VERDICT_FILTERS, one('verdict'), 'all'),
  };
}

/** Query parameters of a view, defaults left out so URLs stay short. */
export function viewParams(v: ViewState): URLSearchParams {
  const p = new URLSearchParams();
  p.set('s', encodeSpec(v.spec));
  if (v.sweep.fp !== String(WEB_FREQUENCY_POINTS)) p.set('fp', v.sweep.fp);
  if (v.sweep.rp !== '') p.set('rp', v.sweep.rp);
  if (v.sweep.obj.length > 0) p.set('obj', v.sweep.obj.join(','));
  for (const [k, text] of Object.entries(v.sweep.w)) if (text !== '') p.set(`w.${k}`, text);
  if (v.x !== 'lossW') p.set('x', v.x);
  if (v.y !== 'volumeMm3') p.set('y', v.y);
  if (v.sort !== 'verdict') p.set('sort', v.sort);
  if (v.dir !== 'asc') p.set('dir', v.dir);
  if (v.topo !== 'all') p.set('topo', v.topo);
  if (v.verdict !== 'all') p.set('verdict', v.verdict);
  return p;
}

/** URL of `path` with the view's parameters, some overridden. */
export function viewUrl(path: string, v: ViewState, overrides: Partial<ViewState> = {}): string {
  return `${path}?${viewParams({ ...v, ...overrides }).toString()}`;
}

/** Only the parameters that define the study (spec and sweep): for candidate sheets and exports. */
export function studyParams(v: ViewState): string {
  const p = viewParams({
    ...v,
    x: 'lossW',
    y: 'volumeMm3',
    sort: 'verdict',
    dir: 'asc',
    topo: 'all',
    verdict: 'all',
  });
  return p.toString();
}

export function isObjectiveKey(k: string): k is ObjectiveKey {
  return (OBJECTIVE_KEYS as readonly string[]).includes(k);
}
