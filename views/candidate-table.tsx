/**
 * Every candidate of the study, sortable by any column and filterable by topology and verdict; the
 * verdict and its reasons in words. Sorting and filtering are plain links and a GET form, which htmx
 * turns into swaps of this table (with the URL pushed, so Back restores the previous order).
 */
import type { FC } from 'hono/jsx';
import type { Study } from '../src/study/types.ts';
import { formatPercent, formatSiShort } from '../src/units/format.ts';
import { sortCandidates } from '../src/web/candidate-sort.ts';
import {
  type SortKey,
  studyParams,
  VERDICT_FILTERS,
  type ViewState,
  viewParams,
  viewUrl,
} from '../src/web/view-state.ts';
import { candidateHref } from './links.ts';
import { Marker } from './plots/markers.tsx';

/** Rows shown at most; a filter narrows the rest. */
export const MAX_ROWS = 150;

const COLUMNS: { key: SortKey; label: string; numeric?: boolean }[] = [
  { key: 'id', label: 'Candidate' },
  { key: 'fsw', label: 'f sw', numeric: true },
  { key: 'ripple', label: 'Ripple', numeric: true },
  { key: 'rect', label: 'Rectifier' },
  { key: 'parts', label: 'Parts', numeric: true },
  { key: 'lossW', label: 'Loss (worst)', numeric: true },
  { key: 'efficiency', label: 'η nominal', numeric: true },
  { key: 'stress', label: 'Stress', numeric: true },
  { key: 'volumeMm3', label: 'Volume', numeric: true },
  { key: 'verdict', label: 'Verdict and reasons' },
];

const swap = (href: string) => ({ href, 'hx-get': href, 'hx-target': '#candidates', 'hx-push-url': 'true' });

export const CandidateTable: FC<{ study: Study; view: ViewState; titles: Record<string, string> }> = ({
  study,
  view,
  titles,
}) => {
  const rows = sortCandidates(study.candidates, view.sort, view.dir, {
    topology: view.topo,
    verdict: view.verdict,
  });
  const topologies = [...new Set(study.candidates.map((c) => c.topology))];
  const hidden = viewParams(view);
  hidden.delete('topo');
  hidden.delete('verdict');
  const sp = studyParams(view);
  return (
    <section id="candidates" class="candidates">
      <h3>Candidates</h3>
      <form
        class="table-filter"
        method="get"
        action="/study"
        hx-get="/study"
        hx-target="#candidates"
        hx-push-url="true"
        hx-trigger="change, submit"
      >
        {[...hidden.entries()].map(([k, v]) => (
          <input type="hidden" name={k} value={v} />
        ))}
        <label>
          Topology{' '}
          <select name="topo">
            <option value="all">all</option>
            {topologies.map((t) => (
              <option value={t} selected={t === view.topo}>
                {titles[t] ?? t}
              </option>
            ))}
          </select>
        </label>{' '}
        <label>
          Verdict{' '}
          <select name="verdict">
            {VERDICT_FILTERS.map((v) => (
              <option value={v} selected={v === view.verdict}>
                {v === 'front' ? 'on the front' : v}
              </option>
            ))}
          </select>
        </label>{' '}
        <button type="submit">Filter</button>{' '}
        <span class="count">
          {rows.length} of {study.candidates.length} candidates
          {rows.length > MAX_ROWS ? `; showing the first ${MAX_ROWS}` : ''}
        </span>
      </form>
      <div class="table-scroll">
        <table class="data">
          <thead>
            <tr>
              {COLUMNS.map((col) => {
                const active = view.sort === col.key;
                const dir = active && view.dir === 'asc' ? 'desc' : 'asc';
                return (
                  <th
                    class={col.numeric ? 'num' : undefined}
                    aria-sort={active ? (view.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                  >
                    <a {...swap(viewUrl('/study', view, { sort: col.key, dir }))}>
                      {col.label}
                      {active ? (view.dir === 'asc' ? ' ▲' : ' ▼') : ''}
                    </a>
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody>
            {rows.slice(0, MAX_ROWS).map((c) => (
              <tr class={`verdict-${c.verdict.kind}`}>
                <td>
                  <svg width="12" height="12" viewBox="-6 -6 12 12" aria-hidden="true">
                    <Marker topology={c.topology} x={0} y={0} r={4} filled={c.rank === 1} />
                  </svg>{' '}
                  <a href={candidateHref(c.id, sp)}>{c.id}</a>
                </td>
                <td class="num">{formatSiShort(c.fswHz, 'Hz', 3)}</td>
                <td class="num">{c.ripple}</td>
                <td>{c.rect === 'sync' ? 'synchronous' : 'diode'}</td>
                <td class="num">{c.objectives.parts}</td>
                <td class="num">
                  {c.feasible || Number.isFinite(c.objectives.lossW)
                    ? formatSiShort(c.objectives.lossW, 'W', 3)
                    : '—'}
                </td>
                <td class="num">{Number.isFinite(c.efficiencyNom) ? formatPercent(c.efficiencyNom) : '—'}</td>
                <td class="num">
                  {Number.isFinite(c.objectives.stress) ? c.objectives.stress.toPrecision(3) : '—'}
                </td>
                <td class="num">
                  {Number.isFinite(c.objectives.volumeMm3)
                    ? `${Math.round(c.objectives.volumeMm3)} mm³`
                    : '—'}
                </td>
                <td class="verdict">
                  <strong>
                    {c.verdict.kind === 'front'
                      ? 'Front'
                      : c.verdict.kind === 'dominated'
                        ? `Dominated (rank ${c.rank})`
                        : 'Infeasible'}
                  </strong>{' '}
                  <span>
                    {c.verdict.text.replace(/^(on the front|infeasible|dominated \(rank \d+\)):?\s*/, '')}
                  </span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
};
