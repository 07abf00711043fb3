/**
 * The averaged small-signal model at nominal input and full load: control-to-output and line-to-output
 * magnitude and phase, with the right-half-plane zero, the lightly damped resonances and the suggested
 * crossover marked on the plot and said in words beside it.
 */
import type { FC } from 'hono/jsx';
import type { BodeResult } from '../../src/simulate/types.ts';
import { formatPercent, formatSiShort } from '../../src/units/format.ts';
import { type Outcome, SimSection, SimulationMessage } from '../candidate-waves.tsx';
import { BodePlot, type FrequencyMark, frequencyMarkLabel } from '../plots/bode-plot.tsx';

const hz = (f: number) => formatSiShort(f, 'Hz', 3);

/** The marks of a Bode result, lowest frequency first. */
export function bodeMarks(b: BodeResult): FrequencyMark[] {
  const marks: FrequencyMark[] = [];
  const add = (kind: FrequencyMark['kind'], freqHz: number | undefined, q?: number) => {
    if (freqHz !== undefined && Number.isFinite(freqHz) && freqHz > 0)
      marks.push({ kind, freqHz, label: frequencyMarkLabel(kind, freqHz, q) });
  };
  add('rhp-zero', b.rhpZeroHz);
  b.resonancesHz.forEach((f, i) => {
    add('resonance', f, b.resonanceQ?.[i]);
  });
  add('crossover', b.suggestedCrossoverHz);
  return marks.sort((x, y) => x.freqHz - y.freqHz);
}

/** Closed form and averaged model disagree beyond this ratio: say so, rather than leave two numbers. */
const RHP_AGREEMENT = 1.25;

function bodeWords(b: BodeResult, closedFormRhpHz?: number): string[] {
  const out: string[] = [];
  if (b.rhpZeroHz !== undefined) {
    out.push(
      `Right-half-plane zero at ${hz(b.rhpZeroHz)}: it adds phase lag while lifting the gain, so a voltage loop must cross over well below it — about a fifth of it (common practice).`,
    );
    const ratio = closedFormRhpHz !== undefined ? b.rhpZeroHz / closedFormRhpHz : 1;
    if (closedFormRhpHz !== undefined && (ratio > RHP_AGREEMENT || ratio < 1 / RHP_AGREEMENT)) {
      out.push(
        `The cautions above estimate it at ${hz(closedFormRhpHz)} from a textbook closed form; ${hz(b.rhpZeroHz)} is the zero of the averaged model of the whole circuit (every inductor and capacitor, with losses). The lower of the two is the safer bound for the loop.`,
      );
    }
  } else {
    out.push('No right-half-plane zero in the control-to-output response.');
  }
  if (b.resonancesHz.length > 0) {
    out.push(
      `Lightly damped resonance${b.resonancesHz.length > 1 ? 's' : ''} at ${b.resonancesHz
        .map((f, i) =>
          b.resonanceQ?.[i] !== undefined ? `${hz(f)} (Q ${b.resonanceQ[i].toPrecision(2)})` : hz(f),
        )
        .join(
          ', ',
        )}: a sharp gain peak and a fast phase drop; keep the crossover below ${b.resonancesHz.length > 1 ? 'the lowest' : 'it'} or damp it.`,
    );
  }
  if (b.suggestedCrossoverHz !== undefined) {
    out.push(
      `Suggested crossover: at most ${hz(b.suggestedCrossoverHz)}${b.crossoverRule ? `, set by ${b.crossoverRule}` : ''}.`,
    );
  }
  return out;
}

export const BodeSection: FC<{
  outcome: Outcome<BodeResult>;
  /** The RHP zero the analytic engine's caution quotes (closed form), to reconcile with the model's. */
  closedFormRhpHz?: number;
}> = ({ outcome, closedFormRhpHz }) => {
  if (!outcome.ok) {
    return (
      <SimSection id="bode" ok={false}>
        <SimulationMessage message={outcome.message} />
      </SimSection>
    );
  }
  const b = outcome.value;
  return (
    <SimSection id="bode" ok={true}>
      <p class="sim-lead">
        Averaged model (state-space averaging) at {formatSiShort(b.vinV, 'V', 3)} input,{' '}
        {formatSiShort(b.ioutA, 'A', 3)} load, duty {formatPercent(b.duty)}: duty of{' '}
        {b.controlGates.map((g) => g.toUpperCase()).join(' and ')} to output voltage, and input voltage to
        output voltage, open loop.
      </p>
      <div class="bode-body">
        <BodePlot
          caption="Magnitude in dB re 1 V per unit duty (control to output) and re 1 V/V (line to output)."
          freqHz={b.freqHz}
          curves={[
            { key: 'control', words: 'control to output (v out / duty)', ...b.controlToOutput },
            { key: 'line', words: 'line to output (v out / v in)', ...b.lineToOutput },
          ]}
          marks={bodeMarks(b)}
        />
        <div class="bode-words">
          {bodeWords(b, closedFormRhpHz).map((w) => (
            <p>{w}</p>
          ))}
        </div>
      </div>
    </SimSection>
  );
};
