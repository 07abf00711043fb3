/**
 * The candidate sheet at /candidate/<id>?<study params>, where the id reads `topology@freq/r<ripple>/<rect>`
 * and the study parameters say which grid it came from (so its exact frequency is known), and its
 * evaluation as JSON at /candidate/<id>/evaluation.json. The sheet paints at once; its simulation
 * sections (waveforms, transients, Bode) load as htmx fragments from candidate-waves.tsx.
 */
import { Hono } from 'hono';
import { CandidateSheet } from '../../../views/candidate-sheet.tsx';
import { LazySimSection, SIM_SECTIONS, type SimSectionId } from '../../../views/candidate-waves.tsx';
import { candidateHref } from '../../../views/links.ts';
import { getTopology } from '../../topologies/registry.ts';
import { renderPage } from '../render.tsx';
import { SAFETY_CAUTION } from '../safety.ts';
import type { StudyService } from '../study-service.ts';
import { CANDIDATE_ROUTE, resolveCandidate } from './candidate-resolve.tsx';
import { candidateWaveRoutes } from './candidate-waves.tsx';
import { type CandidateSimulator, ENGINE_SIMULATOR } from './simulation-input.ts';

export { CANDIDATE_ROUTE, type Resolved, resolveCandidate } from './candidate-resolve.tsx';

const SECTION_ORDER: readonly SimSectionId[] = ['waveforms', 'transients', 'bode'];

export function candidateRoutes(service: StudyService, sim: CandidateSimulator = ENGINE_SIMULATOR): Hono {
  const app = new Hono();
  const base = CANDIDATE_ROUTE;

  app.get(base, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const topology = getTopology(r.evaluation.topology)!;
    const studied = service.cached(r.spec, r.options)?.candidates.find((x) => x.id === r.id);
    const href = (suffix: string) => candidateHref(r.id, r.query, suffix);
    return renderPage(c, {
      title: `Candidate ${r.id}`,
      main: () => (
        <CandidateSheet
          id={r.id}
          spec={r.spec}
          topology={topology}
          evaluation={r.evaluation}
          tech={r.tech}
          studied={studied}
          studyHref={`/study?${r.query}`}
          jsonHref={href('/evaluation.json')}
          simulation={SECTION_ORDER.map((id) => (
            <LazySimSection id={id} href={href(SIM_SECTIONS[id].path)} />
          ))}
          moreExports={[
            { href: href('/netlist.cir'), label: 'SPICE netlist (.cir, runs as is in ngspice)' },
            { href: href('/waveforms.csv'), label: 'One simulated period as CSV' },
            { href: href('/simulation.json'), label: 'Simulation (period, transients, Bode) as JSON' },
          ]}
        />
      ),
    });
  });

  app.get(`${base}/evaluation.json`, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    c.header('Content-Disposition', `attachment; filename="${r.id.replace(/[^a-zA-Z0-9.-]+/g, '_')}.json"`);
    return c.json({ caution: SAFETY_CAUTION, id: r.id, spec: r.spec, evaluation: r.evaluation });
  });

  app.route('/', candidateWaveRoutes(sim));
  return app;
}
