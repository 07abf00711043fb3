/**
 * The waveform engine behind the candidate sheet, at URLs below the candidate's:
 *   /waveforms, /transients, /bode   one section each: the htmx fragment the sheet loads, or as a plain
 *                                    request the same section on a page of its own (one handler);
 *   /netlist.cir                     the SPICE netlist (text, as an attachment);
 *   /waveforms.csv, /simulation.json the simulated data.
 * A simulation that fails (SimulationError, EngineError) becomes a message inside its section.
 */
import type { Context } from 'hono';
import { Hono } from 'hono';
import type { Child } from 'hono/jsx';
import {
  type Outcome,
  SIM_SECTIONS,
  type SimSectionId,
  SimSectionPage,
} from '../../../views/candidate-waves.tsx';
import { candidateHref } from '../../../views/links.ts';
import { BodeSection } from '../../../views/waves/bode-section.tsx';
import { dutiesOf } from '../../../views/waves/signal-groups.ts';
import { SteadySection } from '../../../views/waves/steady-section.tsx';
import { type TransientRun, TransientSection } from '../../../views/waves/transient-section.tsx';
import { EngineError } from '../../engine/evaluate.ts';
import type { SimulationResult } from '../../simulate/types.ts';
import { getTopology } from '../../topologies/registry.ts';
import { SimulationError } from '../../waveform/errors.ts';
import { WebError } from '../errors.ts';
import { renderPage } from '../render.tsx';
import { SAFETY_CAUTION } from '../safety.ts';
import { CANDIDATE_ROUTE, type Resolved, resolveCandidate } from './candidate-resolve.tsx';
import { renderSimulationCsv } from './simulation-csv.ts';
import type { CandidateSimulator, SimulationInput } from './simulation-input.ts';

/** Run a simulation; its numerical failure (or the engine's) becomes the message the section shows. */
export function attempt<T>(run: () => T): Outcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (err) {
    if (err instanceof SimulationError) {
      const text = err.message.replace(/^simulation could not settle:\s*/i, '');
      return { ok: false, message: `Simulation could not settle: ${text}` };
    }
    if (err instanceof EngineError)
      return { ok: false, message: `The design could not be simulated: ${err.message}` };
    throw err;
  }
}

/** File name stem of a candidate id: `sepic@400k/r0.3/diode` → `sepic_400k_r0.3_diode`. */
export function fileStem(id: string): string {
  return id.replace(/[^a-zA-Z0-9.-]+/g, '_');
}

function inputOf(r: Resolved): SimulationInput {
  return { spec: r.spec, params: r.params, tech: r.tech, pins: {} };
}

function steady(sim: CandidateSimulator, r: Resolved): Outcome<SimulationResult> {
  const i = inputOf(r);
  return attempt(() => sim.simulate(i.spec, i.params, i.tech, i.pins, { analysis: 'steady' }));
}

/** Points per transient: enough for the plot's width (the simulator thins keeping each bucket's extremes). */
const TRANSIENT_POINTS = 1000;

function transientRuns(sim: CandidateSimulator, r: Resolved): TransientRun[] {
  const i = inputOf(r);
  return [
    {
      analysis: 'startup',
      outcome: attempt(() =>
        sim.simulate(i.spec, i.params, i.tech, i.pins, { analysis: 'startup', maxPoints: TRANSIENT_POINTS }),
      ),
    },
    {
      analysis: 'step',
      stepFromSpec: r.spec.step !== undefined,
      outcome: attempt(() =>
        sim.simulate(i.spec, i.params, i.tech, i.pins, { analysis: 'step', maxPoints: TRANSIENT_POINTS }),
      ),
    },
  ];
}

export function candidateWaveRoutes(sim: CandidateSimulator): Hono {
  const app = new Hono();
  const base = CANDIDATE_ROUTE;

  /** One handler per section: the fragment for htmx, the section on its own page otherwise. */
  const section = (id: SimSectionId, body: (r: Resolved) => Child) => (c: Context) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const content = () => body(r);
    return renderPage(c, {
      title: `${SIM_SECTIONS[id].title}: ${r.id}`,
      main: () => (
        <SimSectionPage candidateId={r.id} sheetHref={candidateHref(r.id, r.query)}>
          {content()}
        </SimSectionPage>
      ),
      fragments: { [id]: content },
    });
  };
  const duties = (r: Resolved) => dutiesOf(getTopology(r.params.topology)?.components(r.params.rect) ?? []);

  app.get(
    `${base}/waveforms`,
    section('waveforms', (r) => (
      <SteadySection
        outcome={steady(sim, r)}
        duties={duties(r)}
        rippleLimitV={r.spec.ripple.outputVpp}
        downloads={{
          csvHref: candidateHref(r.id, r.query, '/waveforms.csv'),
          jsonHref: candidateHref(r.id, r.query, '/simulation.json'),
        }}
      />
    )),
  );

  app.get(
    `${base}/transients`,
    section('transients', (r) => (
      <TransientSection runs={transientRuns(sim, r)} topology={r.params.topology} duties={duties(r)} />
    )),
  );

  app.get(
    `${base}/bode`,
    section('bode', (r) => {
      const i = inputOf(r);
      const closedForm = r.evaluation.cautions.find((x) => x.code === 'rhp-zero')?.value;
      return (
        <BodeSection
          outcome={attempt(() => sim.bode(i.spec, i.params, i.tech, i.pins))}
          closedFormRhpHz={closedForm}
        />
      );
    }),
  );

  app.get(`${base}/netlist.cir`, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const i = inputOf(r);
    const text = attempt(() => sim.netlist(i.spec, i.params, i.tech, i.pins, { analysis: 'steady' }));
    if (!text.ok) throw new WebError(500, `The netlist could not be written. ${text.message}`);
    c.header('Content-Type', 'text/plain; charset=utf-8');
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.id)}.cir"`);
    return c.body(text.value);
  });

  app.get(`${base}/waveforms.csv`, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const result = steady(sim, r);
    if (!result.ok) throw new WebError(500, result.message);
    c.header('Content-Type', 'text/csv; charset=utf-8');
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.id)}-period.csv"`);
    return c.body(renderSimulationCsv(result.value));
  });

  app.get(`${base}/simulation.json`, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const i = inputOf(r);
    const [startup, step] = transientRuns(sim, r);
    const plain = <T,>(o: Outcome<T>) => (o.ok ? o.value : { error: o.message });
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.id)}-simulation.json"`);
    return c.json({
      caution: SAFETY_CAUTION,
      id: r.id,
      steady: plain(steady(sim, r)),
      startup: plain(startup.outcome),
      step: plain(step.outcome),
      bode: plain(attempt(() => sim.bode(i.spec, i.params, i.tech, i.pins))),
    });
  });

  return app;
}
