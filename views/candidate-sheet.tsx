/**
 * One candidate in full: what it is, its verdict, feasibility reasons and cautions, the part table with
 * worst-corner stresses and suggested minimum ratings (derating stated), efficiency and losses per corner.
 */
import type { Child, FC } from 'hono/jsx';
import { CURRENT_RATING_MARGIN } from '../src/engine/part-summary.ts';
import type { ComponentStress, CornerResult, Evaluation, PartSummary } from '../src/engine/types.ts';
import type { Technology } from '../src/parts/technology.ts';
import type { RailSpec } from '../src/spec/rail-spec.ts';
import type { StudyCandidate } from '../src/study/types.ts';
import type { Topology } from '../src/topologies/topology.ts';
import { formatPercent, formatSi, formatSiShort } from '../src/units/format.ts';
import { SafetyNote } from './layout.tsx';
import { type CornerLoss, LossBars } from './plots/loss-bars.tsx';

export interface SheetProps {
  id: string;
  spec: RailSpec;
  topology: Topology;
  evaluation: Evaluation;
  tech: Technology;
  /** The candidate as the cached study sees it (verdict), when the study is at hand. */
  studied?: StudyCandidate;
  studyHref: string;
  jsonHref: string;
  /** Sections the waveform engine fills (loaded as htmx fragments), after the loss breakdown. */
  simulation?: Child;
  /** Further downloads listed under Exports (SPICE netlist, simulated data). */
  moreExports?: { href: string; label: string }[];
}

/** Below this magnitude a current or voltage is rounding noise of a zero (a capacitor's average current). */
const NOISE_FLOOR = 1e-9;
const si = (v: number, unit: string) =>
  Number.isFinite(v) ? formatSi(Math.abs(v) < NOISE_FLOOR ? 0 : v, unit, 3) : '—';

/** Worst value of a component's figure over the full-load corners. */
function worst(e: Evaluation, name: string, pick: (s: ComponentStress) => number): number {
  return Math.max(
    0,
    ...e.corners
      .filter((c) => c.ioutA > 0)
      .map((c) => Math.abs(pick(c.components[name] ?? ({} as ComponentStress)) || 0)),
  );
}

function deratingNote(p: PartSummary, tech: Technology): string {
  const parts: string[] = [];
  const vd =
    p.role === 'switch' || p.role === 'sync'
      ? tech.mosfet.voltageDerating
      : p.role === 'diode'
        ? tech.diode.voltageDerating
        : p.role === 'capacitor'
          ? tech.capacitor.voltageDerating
          : p.role === 'damping-capacitor'
            ? 0.8
            : undefined;
  if (p.ratingV !== undefined && vd !== undefined)
    parts.push(`V̂ ÷ ${vd} (used to ${formatPercent(vd, 0)} of rating)`);
  if (p.ratingA !== undefined) {
    const base =
      p.role === 'capacitor' || p.role === 'sense' || p.role === 'damping-resistor' ? 'I rms' : 'Î';
    parts.push(`${base} × ${CURRENT_RATING_MARGIN} (${formatPercent(CURRENT_RATING_MARGIN - 1, 0)} margin)`);
  }
  return parts.join('; ');
}

const PartTable: FC<{ e: Evaluation; tech: Technology; topology: Topology }> = ({ e, tech, topology }) => {
  const info = new Map(topology.components(e.rect).map((c) => [c.name, c.duty]));
  return (
    <div class="table-scroll">
      <table class="data parts">
        <thead>
          <tr>
            <th>Part</th>
            <th>Value</th>
            <th>What it is</th>
            <th class="num">I avg</th>
            <th class="num">I rms</th>
            <th class="num">I peak</th>
            <th class="num">V peak</th>
            <th class="num">Min. V rating</th>
            <th class="num">Min. I rating</th>
            <th>Derating applied</th>
          </tr>
        </thead>
        <tbody>
          {e.parts.map((p) => (
            <tr>
              <td>
                <strong>{p.name}</strong>
                <br />
                <small>{info.get(p.name) ?? p.role}</small>
              </td>
              <td class="num">{p.unit === '' ? '—' : si(p.value, p.unit)}</td>
              <td>
                {p.detail}
                {p.count > 1 ? ` (${p.count} units)` : ''}
              </td>
              <td class="num">
                {si(
                  worst(e, p.name, (s) => s.iAvgA),
                  'A',
                )}
              </td>
              <td class="num">
                {si(
                  worst(e, p.name, (s) => s.iRmsA),
                  'A',
                )}
              </td>
              <td class="num">
                {si(
                  worst(e, p.name, (s) => s.iPeakA),
                  'A',
                )}
              </td>
              <td class="num">
                {si(
                  worst(e, p.name, (s) => s.vPeakV),
                  'V',
                )}
              </td>
              <td class="num">{p.ratingV !== undefined ? si(p.ratingV, 'V') : '—'}</td>
              <td class="num">{p.ratingA !== undefined ? si(p.ratingA, 'A') : '—'}</td>
              <td>
                <small>{deratingNote(p, tech)}</small>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p class="hint">Currents and voltages are the worst over the full-load corners (magnitudes).</p>
    </div>
  );
};

const CornerTable: FC<{ corners: CornerResult[] }> = ({ corners }) => (
  <table class="data corners">
    <thead>
      <tr>
        <th>Corner</th>
        <th class="num">V in</th>
        <th class="num">I out</th>
        <th class="num">Duty</th>
        <th>Mode</th>
        <th class="num">P out</th>
        <th class="num">Loss</th>
        <th class="num">Efficiency</th>
      </tr>
    </thead>
    <tbody>
      {corners.map((c) => (
        <tr>
          <td>{c.label}</td>
          <td class="num">{formatSi(c.vinV, 'V', 3)}</td>
          <td class="num">{formatSi(c.ioutA, 'A', 3)}</td>
          <td class="num">{formatPercent(c.duty)}</td>
          <td>{c.mode}</td>
          <td class="num">{formatSi(c.poutW, 'W', 3)}</td>
          <td class="num">{formatSi(c.lossW, 'W', 3)}</td>
          <td class="num">{formatPercent(c.efficiency)}</td>
        </tr>
      ))}
    </tbody>
  </table>
);

const StressDetails: FC<{ corners: CornerResult[] }> = ({ corners }) => (
  <details class="stress-details">
    <summary>Stresses of every part at every corner</summary>
    {corners.map((c) => (
      <div class="table-scroll">
        <h4>
          {c.label}: {formatSiShort(c.vinV, 'V')} in, {formatSiShort(c.ioutA, 'A')} out
        </h4>
        <table class="data">
          <thead>
            <tr>
              <th>Part</th>
              <th class="num">I avg</th>
              <th class="num">I rms</th>
              <th class="num">I peak</th>
              <th class="num">I p-p</th>
              <th class="num">V peak</th>
              <th class="num">V p-p</th>
              <th class="num">Loss</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(c.components).map(([name, s]) => (
              <tr>
                <td>{name}</td>
                <td class="num">{si(s.iAvgA, 'A')}</td>
                <td class="num">{si(s.iRmsA, 'A')}</td>
                <td class="num">{si(s.iPeakA, 'A')}</td>
                <td class="num">{si(s.iPpA, 'A')}</td>
                <td class="num">{si(s.vPeakV, 'V')}</td>
                <td class="num">{s.vPpV > 0 ? si(s.vPpV, 'V') : '—'}</td>
                <td class="num">{si(s.lossW, 'W')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    ))}
  </details>
);

export const CandidateSheet: FC<SheetProps> = ({
  id,
  spec,
  topology,
  evaluation: e,
  tech,
  studied,
  studyHref,
  jsonHref,
  simulation,
  moreExports = [],
}) => {
  const lossCorners: CornerLoss[] = e.corners.map((c) => ({
    label: c.label,
    lossByKind: (c as CornerResult & { lossByKind?: Record<string, number> }).lossByKind ?? {
      other: c.lossW,
    },
  }));
  const o = e.objectives;
  return (
    <article class="candidate-sheet" id="sheet">
      <p class="crumbs">
        <a href={studyHref}>← Study of {spec.name}</a>
      </p>
      <h1>{id}</h1>
      <p class="lead">
        {topology.title} at {formatSiShort(e.fswHz, 'Hz', 3)}, ripple ratio {e.ripple},{' '}
        {e.rect === 'sync' ? 'synchronous' : 'diode'} rectifier
        {e.busV !== undefined ? `, intermediate bus ${formatSiShort(e.busV, 'V', 3)}` : ''}.
      </p>
      <p>{topology.summary}</p>
      <SafetyNote />
      <dl class="figures">
        <dt>Feasible</dt>
        <dd>
          {e.feasible
            ? 'yes, at every corner'
            : `no: ${e.reasons.length} limit${e.reasons.length === 1 ? '' : 's'} broken`}
        </dd>
        <dt>Efficiency (nominal input, full load)</dt>
        <dd>{formatPercent(e.efficiencyNom)}</dd>
        <dt>Loss (worst full-load corner)</dt>
        <dd>{formatSi(o.lossW, 'W', 3)}</dd>
        <dt>Power-stage parts</dt>
        <dd>
          {o.parts} (
          {Object.entries(e.partsByRole)
            .map(([r, n]) => `${n} ${r}`)
            .join(', ')}
          )
        </dd>
        <dt>Semiconductor stress Σ V̂·Î / Pout</dt>
        <dd>{o.stress.toPrecision(3)}</dd>
        <dt>Magnetics + capacitor volume</dt>
        <dd>{Math.round(o.volumeMm3)} mm³</dd>
      </dl>
      {studied ? (
        <section class="verdict">
          <h2>Verdict</h2>
          <p>{studied.verdict.text.charAt(0).toUpperCase() + studied.verdict.text.slice(1)}.</p>
        </section>
      ) : null}
      <section>
        <h2>Feasibility</h2>
        {e.reasons.length === 0 ? (
          <p>No limit is broken at any corner.</p>
        ) : (
          <ul class="reasons">
            {e.reasons.map((r) => (
              <li>{r.message}</li>
            ))}
          </ul>
        )}
      </section>
      <section>
        <h2>Cautions</h2>
        {e.cautions.length === 0 ? (
          <p>None raised.</p>
        ) : (
          <ul class="cautions">
            {e.cautions.map((c) => (
              <li>
                <strong>{c.code.replace(/-/g, ' ')}:</strong> {c.message}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section>
        <h2>Parts, stresses and suggested minimum ratings</h2>
        <PartTable e={e} tech={tech} topology={topology} />
      </section>
      <section>
        <h2>Efficiency and loss per corner</h2>
        <CornerTable corners={e.corners} />
        <LossBars corners={lossCorners} />
        <StressDetails corners={e.corners} />
      </section>
      {simulation}
      <section class="exports">
        <h2>Exports</h2>
        <ul>
          <li>
            <a href={jsonHref} download>
              Evaluation as JSON
            </a>
          </li>
          {moreExports.map((x) => (
            <li>
              <a href={x.href} download>
                {x.label}
              </a>
            </li>
          ))}
        </ul>
      </section>
    </article>
  );
};
