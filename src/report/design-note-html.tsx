/**
 * The study's design-note section as a printable HTML page body: the same content as the Markdown
 * (src/report/study-markdown.ts) with the plots inline as SVG. The page shell and print stylesheet are
 * the web app's; this is only the article.
 */
import type { FC } from 'hono/jsx';
import { FrontScatter } from '../../views/plots/front-scatter.tsx';
import { TopologyLegend } from '../../views/plots/markers.tsx';
import { SweepPlots } from '../../views/plots/sweep-plots.tsx';
import { formatObjective } from '../study/objectives.ts';
import type { Study } from '../study/types.ts';
import { formatPercent, formatSiShort } from '../units/format.ts';
import { SAFETY_CAUTION } from './caution.ts';
import { FRONT_ROWS } from './study-markdown.ts';

const hz = (f: number) => formatSiShort(f, 'Hz', 3);
const v = (x: number) => formatSiShort(x, 'V');

export const DesignNote: FC<{
  study: Study;
  titles: Record<string, string>;
  href: (id: string) => string;
}> = ({ study, titles, href }) => {
  const s = study.spec;
  const o = study.options;
  const rec = study.candidates.find((c) => c.id === study.summary.recommended);
  const byId = new Map(study.candidates.map((c) => [c.id, c]));
  const front = study.front
    .map((id) => byId.get(id)!)
    .sort((a, b) => o.objectives.reduce((acc, k) => acc || a.objectives[k] - b.objectives[k], 0));
  const topologies = [...new Set(study.candidates.map((c) => c.topology))];
  return (
    <article class="design-note">
      <h1>Topology study: {s.name}</h1>
      <p class="safety-note" role="note">
        <strong>Caution.</strong> {SAFETY_CAUTION}
      </p>
      <h2>Rail spec</h2>
      <ul>
        <li>
          Input: {v(s.input.minV)} min, {v(s.input.nomV)} nominal, {v(s.input.maxV)} max
        </li>
        <li>
          Output: {v(s.output.voltageV)} (polarity {s.output.polarity}), load{' '}
          {formatSiShort(s.load.maxA, 'A')} max, {formatSiShort(s.load.minA, 'A')} min
          {s.load.ccmRequired ? ', CCM required' : ''}
        </li>
        <li>
          Ripple limits: output {v(s.ripple.outputVpp)} p-p
          {s.ripple.inputVpp === undefined ? '' : `, input ${v(s.ripple.inputVpp)} p-p`}
        </li>
        <li>
          Switching band {hz(s.switching.minHz)} to {hz(s.switching.maxHz)}; ambient {s.ambientC} °C;
          technology preset {s.technology}
        </li>
      </ul>
      <h2>Candidates considered</h2>
      <p>
        {study.candidates.length} candidates: each applicable topology × {o.frequencyPoints} switching
        frequencies on a log grid from {hz(o.band.minHz)} to {hz(o.band.maxHz)} × ripple ratios{' '}
        {o.ripples.join(', ')} × the rectifiers it offers. {study.candidates.filter((c) => c.feasible).length}{' '}
        feasible; {study.front.length} on the front.
      </p>
      {study.excluded.length > 0 ? (
        <ul>
          {study.excluded.map((e) => (
            <li>
              Excluded {titles[e.topology] ?? e.topology}: {e.reason}
            </li>
          ))}
        </ul>
      ) : null}
      <h2>Pareto front</h2>
      <p>Objectives (minimised): {o.objectives.join(', ')}.</p>
      <FrontScatter study={study} x="lossW" y="volumeMm3" href={href} width={680} height={380} />
      <TopologyLegend topologies={topologies} titles={titles} />
      <table class="data">
        <thead>
          <tr>
            <th>Candidate</th>
            <th class="num">Parts</th>
            <th class="num">Loss</th>
            <th class="num">Stress</th>
            <th class="num">Volume</th>
            <th class="num">η nominal</th>
          </tr>
        </thead>
        <tbody>
          {front.slice(0, FRONT_ROWS).map((c) => (
            <tr class={c.id === rec?.id ? 'recommended' : undefined}>
              <td>{c.id === rec?.id ? <strong>{c.id}</strong> : c.id}</td>
              <td class="num">{c.objectives.parts}</td>
              <td class="num">{formatObjective('lossW', c.objectives.lossW)}</td>
              <td class="num">{formatObjective('stress', c.objectives.stress)}</td>
              <td class="num">{formatObjective('volumeMm3', c.objectives.volumeMm3)}</td>
              <td class="num">{formatPercent(c.efficiencyNom)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {front.length > FRONT_ROWS ? (
        <p>… and {front.length - FRONT_ROWS} more on the front (see the CSV or JSON).</p>
      ) : null}
      <h2>Recommendation</h2>
      <p>{study.summary.headline}</p>
      {rec ? <p>Why it is on the front: {rec.verdict.text.replace(/^on the front: /, '')}.</p> : null}
      <ul>
        {study.summary.details.map((d) => (
          <li>{d}</li>
        ))}
      </ul>
      {study.summary.infeasibleTopologies.map((t) => (
        <p>{t.text}</p>
      ))}
      {rec ? (
        <>
          <h2>Cautions for {rec.id}</h2>
          {rec.cautions.length === 0 ? (
            <p>The engine raised no caution for this candidate.</p>
          ) : (
            <ul>
              {rec.cautions.map((c) => (
                <li>
                  {c.code}: {c.message}
                </li>
              ))}
            </ul>
          )}
        </>
      ) : null}
      <h2>Frequency sweeps</h2>
      <div class="sweep-grid">
        {topologies.map((t) => (
          <SweepPlots
            topology={t}
            title={titles[t] ?? t}
            points={study.sweeps[t] ?? []}
            highlights={study.highlights[t]}
            href={href}
          />
        ))}
      </div>
      <h2>Safety</h2>
      <blockquote>{SAFETY_CAUTION}</blockquote>
    </article>
  );
};
