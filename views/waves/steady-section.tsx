/**
 * One switching period of the exact periodic steady state at nominal input and full load: inductor
 * currents, switch node and coupling capacitor, switch and rectifier currents, output ripple; then each
 * signal's average, RMS and extremes in a table (the numbers behind the plots), and the downloads.
 */
import type { FC } from 'hono/jsx';
import type { SimulationResult } from '../../src/simulate/types.ts';
import { formatPercent, formatSi, formatSiShort } from '../../src/units/format.ts';
import { type Outcome, SimSection, SimulationMessage } from '../candidate-waves.tsx';
import { TimePlot } from '../plots/time-plot.tsx';
import { type Duties, type SignalGroup, steadyGroups } from './signal-groups.ts';

export interface SteadyDownloads {
  csvHref: string;
  jsonHref: string;
}

const NOISE = 1e-9;
const si = (x: number, unit: string) => formatSi(Math.abs(x) < NOISE ? 0 : x, unit, 3);

function unitOf(signal: string): 'A' | 'V' {
  return signal.endsWith('.i') ? 'A' : 'V';
}

const MetricsTable: FC<{ result: SimulationResult; groups: SignalGroup[] }> = ({ result, groups }) => {
  const shown = [...new Set(groups.flatMap((g) => g.traces.map((t) => t.signal)))].filter(
    (s) => result.metrics[s],
  );
  return (
    <div class="table-scroll">
      <table class="data sim-metrics">
        <thead>
          <tr>
            <th>Signal</th>
            <th class="num">Average</th>
            <th class="num">RMS</th>
            <th class="num">Minimum</th>
            <th class="num">Maximum</th>
            <th class="num">Peak-to-peak</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((s) => {
            const m = result.metrics[s];
            const u = unitOf(s);
            return (
              <tr>
                <td>{s}</td>
                <td class="num">{si(m.avg, u)}</td>
                <td class="num">{si(m.rms, u)}</td>
                <td class="num">{si(m.min, u)}</td>
                <td class="num">{si(m.max, u)}</td>
                <td class="num">{si(m.max - m.min, u)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
};

function rippleCaption(r: SimulationResult, limitV: number | undefined): string {
  const m = r.metrics['out.v'];
  if (!m) return 'Output ripple over one period.';
  const pp = formatSiShort(m.max - m.min, 'V', 3);
  const limit = limitV !== undefined ? ` (spec limit ${formatSiShort(limitV, 'V', 3)})` : '';
  return `Output ripple over one period: ${pp} peak to peak${limit}.`;
}

export const SteadySection: FC<{
  outcome: Outcome<SimulationResult>;
  duties: Duties;
  downloads: SteadyDownloads;
  /** The spec's output ripple limit, peak to peak (V). */
  rippleLimitV?: number;
}> = ({ outcome, duties, downloads, rippleLimitV }) => {
  if (!outcome.ok) {
    return (
      <SimSection id="waveforms" ok={false}>
        <SimulationMessage message={outcome.message} />
      </SimSection>
    );
  }
  const r = outcome.value;
  const outAvg = r.metrics['out.v']?.avg ?? 0;
  const groups = steadyGroups(r.signals, outAvg, duties);
  const period = 1 / r.fswHz;
  return (
    <SimSection id="waveforms" ok={true}>
      <p class="sim-lead">
        Nominal input {formatSiShort(r.vinV, 'V', 3)}, full load {formatSiShort(r.ioutA, 'A', 3)}: duty{' '}
        {formatPercent(r.duty)}
        {r.duty2 > 0 ? `, second duty ${formatPercent(r.duty2)}` : ''}, one period of{' '}
        {formatSiShort(period, 's', 3)} at {formatSiShort(r.fswHz, 'Hz', 3)}. Exact periodic steady state of
        the switched circuit (piecewise-linear engine), not an average.
      </p>
      <div class="sim-plots">
        {groups.map((g) => (
          <TimePlot
            caption={g.key === 'ripple' ? rippleCaption(r, rippleLimitV) : `${g.title} over one period.`}
            timeS={r.timeS}
            traces={g.traces}
            unit={g.unit}
            quantity={g.quantity}
          />
        ))}
      </div>
      <MetricsTable result={r} groups={groups} />
      <p class="sim-downloads">
        Download this period: <a href={downloads.csvHref}>CSV</a> · <a href={downloads.jsonHref}>JSON</a>
      </p>
    </SimSection>
  );
};
