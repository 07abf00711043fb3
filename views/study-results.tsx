/**
 * The study: recommendation and its reasoning, the front plot, per-topology frequency sweeps, the
 * candidate table and the exports. Each block has its own id so htmx can swap it alone.
 */
import type { FC } from 'hono/jsx';
import { OBJECTIVE_WORDS } from '../src/study/objectives.ts';
import type { Study } from '../src/study/types.ts';
import { formatSiShort } from '../src/units/format.ts';
import { PLOT_AXES, studyParams, type ViewState, viewParams } from '../src/web/view-state.ts';
import { CandidateTable } from './candidate-table.tsx';
import { SafetyNote } from './layout.tsx';
import { candidateHref, studyHref } from './links.ts';
import { AXIS_INFO, FrontScatter } from './plots/front-scatter.tsx';
import { TopologyLegend } from './plots/markers.tsx';
import { SweepPlots } from './plots/sweep-plots.tsx';

export interface StudyViewProps {
  study: Study;
  view: ViewState;
  titles: Record<string, string>;
}

/** One line describing the rail, for headings. */
export function railLine(study: Study): string {
  const s = study.spec;
  const v = (x: number) => formatSiShort(x, 'V', 3);
  const sign = s.output.polarity === 'negative' ? '−' : s.output.polarity === 'either' ? '±' : '+';
  return `${v(s.input.minV)}–${v(s.input.maxV)} in (nominal ${v(s.input.nomV)}) → ${sign}${v(s.output.voltageV)} at ${formatSiShort(s.load.maxA, 'A', 3)}`;
}

export const Recommendation: FC<StudyViewProps> = ({ study, view }) => {
  const sp = studyParams(view);
  const r = study.summary;
  return (
    <section id="recommendation" class="recommendation">
      <h3>Recommendation</h3>
      {r.recommended ? (
        <p class="pick">
          <a href={candidateHref(r.recommended, sp)}>{r.recommended}</a>
          {r.runnerUp ? (
            <>
              {' '}
              (runner-up: <a href={candidateHref(r.runnerUp, sp)}>{r.runnerUp}</a>)
            </>
          ) : null}
        </p>
      ) : (
        <p class="pick">No feasible candidate.</p>
      )}
      <p>{r.headline}</p>
      {r.details.length > 0 ? (
        <details class="comparisons">
          <summary>Why, against the best of each other topology ({r.details.length})</summary>
          <ul>
            {r.details.map((d) => (
              <li>{d}</li>
            ))}
          </ul>
        </details>
      ) : null}
      {r.infeasibleTopologies.map((t) => (
        <p class="infeasible-topology">{t.text}</p>
      ))}
      <p class="weights">
        Weights:{' '}
        {study.options.objectives
          .map((k, i) => `${OBJECTIVE_WORDS[k].noun} ${study.options.weights[i]}`)
          .join(', ')}
        . <a href="#weights">Change the objectives and weights in the form</a>.
      </p>
    </section>
  );
};

export const FrontPlot: FC<StudyViewProps> = ({ study, view, titles }) => {
  const sp = studyParams(view);
  const hidden = viewParams(view);
  hidden.delete('x');
  hidden.delete('y');
  const topologies = [...new Set(study.candidates.map((c) => c.topology))];
  return (
    <section id="front-plot" class="front-plot">
      <h3>Front</h3>
      <form
        class="axes-choice"
        method="get"
        action="/study"
        hx-get="/study"
        hx-target="#front-plot"
        hx-push-url="true"
        hx-trigger="change, submit"
      >
        {[...hidden.entries()].map(([k, v]) => (
          <input type="hidden" name={k} value={v} />
        ))}
        {(['x', 'y'] as const).map((axis) => (
          <label>
            {axis === 'x' ? 'Horizontal' : 'Vertical'}{' '}
            <select name={axis}>
              {PLOT_AXES.map((a) => (
                <option value={a} selected={view[axis] === a}>
                  {AXIS_INFO[a].title}
                </option>
              ))}
            </select>{' '}
          </label>
        ))}
        <button type="submit">Plot</button>
      </form>
      <FrontScatter study={study} x={view.x} y={view.y} href={(id) => candidateHref(id, sp)} />
      <TopologyLegend topologies={topologies} titles={titles} />
    </section>
  );
};

export const StudyResults: FC<StudyViewProps> = (props) => {
  const { study, view, titles } = props;
  const sp = studyParams(view);
  const feasible = study.candidates.filter((c) => c.feasible).length;
  return (
    <section id="results" class="results" data-study-key={sp}>
      <h2>
        {study.spec.name}: {railLine(study)}
      </h2>
      <p class="study-stats">
        {study.candidates.length} candidates, {feasible} feasible, {study.front.length} on the front.{' '}
        <span class="exports">
          <a href={studyHref('/study', sp)}>Link to this study</a> ·{' '}
          <a href={studyHref('/note', sp)}>Design note</a> ·{' '}
          <a href={studyHref('/note.md', sp)} download>
            Markdown
          </a>{' '}
          ·{' '}
          <a href={studyHref('/study.csv', sp)} download>
            CSV
          </a>{' '}
          ·{' '}
          <a href={studyHref('/study.json', sp)} download>
            JSON
          </a>
        </span>
      </p>
      <SafetyNote />
      <Recommendation {...props} />
      <FrontPlot {...props} />
      <section class="sweeps">
        <h3>Frequency sweeps per topology</h3>
        <p class="hint">
          At each frequency: the best nominal efficiency and the smallest volume over the ripple ratios and
          rectifiers.
        </p>
        <div class="sweep-grid">
          {Object.entries(study.sweeps).map(([t, points]) => (
            <SweepPlots
              topology={t as never}
              title={titles[t] ?? t}
              points={points ?? []}
              highlights={study.highlights[t as keyof typeof study.highlights]}
              href={(id) => candidateHref(id, sp)}
            />
          ))}
        </div>
      </section>
      <CandidateTable study={study} view={view} titles={titles} />
      {study.excluded.length > 0 ? (
        <section class="excluded">
          <h3>Not evaluated</h3>
          <ul>
            {study.excluded.map((e) => (
              <li>
                {titles[e.topology] ?? e.topology}: {e.reason}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </section>
  );
};
