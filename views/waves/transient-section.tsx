/**
 * Start-up and input-step transients: the output and coupling-capacitor voltages and the inductor
 * currents against time, with overshoot, peaks and settling time said in words beside the plots.
 * Each analysis fails on its own: a message replaces its plots, the other still shows.
 */
import type { FC } from 'hono/jsx';
import type { TopologyId } from '../../src/engine/types.ts';
import type { SimulationResult } from '../../src/simulate/types.ts';
import { formatSiShort } from '../../src/units/format.ts';
import { type Outcome, SimSection, SimulationMessage } from '../candidate-waves.tsx';
import { type TimeMark, TimePlot } from '../plots/time-plot.tsx';
import { type Duties, transientGroups } from './signal-groups.ts';
import { describeTransient } from './transient-words.ts';

export interface TransientRun {
  analysis: 'startup' | 'step';
  outcome: Outcome<SimulationResult>;
  /** Whether the rail spec names the input step (else the simulator's default step was applied). */
  stepFromSpec?: boolean;
}

const TITLES = { startup: 'Start-up', step: 'Input step' } as const;

function lastOf(values: ArrayLike<number> | undefined): number | undefined {
  return values && values.length > 0 ? values[values.length - 1] : undefined;
}

/** Largest |i| of each inductor over the run, from the metrics (taken before the waveforms were thinned). */
function inductorPeaks(r: SimulationResult): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, m] of Object.entries(r.metrics)) {
    if (/^L\d+\.i$/.test(name)) out[name.slice(0, -2)] = Math.max(Math.abs(m.min), Math.abs(m.max));
  }
  return out;
}

/** Wider than the one-period plots: a transient has detail over thousands of periods. */
const TRANSIENT_PLOT_WIDTH = 760;

const TransientBlock: FC<{ run: TransientRun; topology: TopologyId; duties: Duties }> = ({
  run,
  topology,
  duties,
}) => {
  const title = TITLES[run.analysis];
  if (!run.outcome.ok) {
    return (
      <div class="transient" data-analysis={run.analysis} data-state="error">
        <h3>{title}</h3>
        <SimulationMessage message={run.outcome.message} />
      </div>
    );
  }
  const r = run.outcome.value;
  const words = describeTransient({
    analysis: run.analysis,
    topology,
    overshoot: r.overshoot,
    peaks: r.peaks,
    settlingTimeS: r.settlingTimeS,
    finalOutV: lastOf(r.signals['out.v']),
    step: r.step ? { fromV: r.step.fromV, toV: r.step.toV, fromSpec: run.stepFromSpec === true } : undefined,
    settled: r.settled,
    inductorPeaksA: inductorPeaks(r),
  });
  const start = r.step?.atS ?? r.timeS[0] ?? 0;
  const marks: TimeMark[] = [];
  if (r.step) marks.push({ timeS: start, label: 'step' });
  if (r.settlingTimeS !== undefined && Number.isFinite(r.settlingTimeS)) {
    marks.push({
      timeS: start + r.settlingTimeS,
      label: `settled (2 %) ${formatSiShort(r.settlingTimeS, 's', 3)}`,
    });
  }
  const groups = transientGroups(r.signals, duties);
  return (
    <div class="transient" data-analysis={run.analysis} data-state="ready">
      <h3>{title}</h3>
      <div class="transient-body">
        <div class="sim-plots">
          {groups.map((g) => (
            <TimePlot
              caption={`${title}: ${g.title.toLowerCase()}.`}
              timeS={r.timeS}
              traces={g.traces}
              unit={g.unit}
              quantity={g.quantity}
              timeMarks={g.key === 'output' ? marks : []}
              originS={r.step?.atS}
              width={TRANSIENT_PLOT_WIDTH}
            />
          ))}
        </div>
        <div class="transient-words">
          {words.map((w) => (
            <p>{w}</p>
          ))}
        </div>
      </div>
    </div>
  );
};

export const TransientSection: FC<{ runs: TransientRun[]; topology: TopologyId; duties: Duties }> = ({
  runs,
  topology,
  duties,
}) => (
  <SimSection id="transients" ok={runs.every((r) => r.outcome.ok)}>
    <p class="sim-lead">
      Open loop: the duty stays at its steady value for nominal input, so these show the power stage's own
      response. A voltage loop shortens the output's settling, but does little against a coupling-network
      ringing near or above its crossover. Time zero is the start of the run (start-up) or the step.
    </p>
    {runs.map((run) => (
      <TransientBlock run={run} topology={topology} duties={duties} />
    ))}
  </SimSection>
);
