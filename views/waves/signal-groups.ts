/**
 * Which simulated signals go on which plot, and what each is called. Signals are named `<part>.i` /
 * `<part>.v` after the design's components, plus `sw.v` (switch node) and `out.v` (output); a plot is
 * drawn only for the signals a topology has (no coupling capacitor in a four-switch stage).
 */
import type { ComponentInfo } from '../../src/engine/types.ts';
import type { Trace } from '../plots/time-plot.tsx';

export interface SignalGroup {
  key: 'inductors' | 'switches' | 'nodes' | 'ripple' | 'output';
  title: string;
  quantity: string;
  unit: 'A' | 'V';
  traces: Trace[];
}

export type Signals = Record<string, ArrayLike<number>>;

/** Component name → what it does, from the topology's component list. */
export type Duties = ReadonlyMap<string, string>;

export function dutiesOf(components: readonly ComponentInfo[]): Duties {
  return new Map(components.map((c) => [c.name, c.duty]));
}

const byNumber = (a: string, b: string) => a.localeCompare(b, 'en', { numeric: true });

/** Signal names of one kind present in the result: `L1.i`, `L2.i` for /^L\d+$/ and `.i`. */
function present(signals: Signals, part: RegExp, suffix: '.i' | '.v'): string[] {
  return Object.keys(signals)
    .filter((k) => k.endsWith(suffix) && part.test(k.slice(0, -suffix.length)))
    .sort(byNumber);
}

/** A trace of a part's current or voltage, named in short ('i L1') and in words. */
export function partTrace(signals: Signals, name: string, duties: Duties): Trace {
  const [part, kind] = name.split('.');
  const duty = duties.get(part);
  const what = kind === 'i' ? 'current' : 'voltage';
  const words =
    part === 'sw'
      ? 'switch-node voltage to ground (the node Q1 shares with an inductor)'
      : part === 'out'
        ? 'output voltage'
        : `${part} ${what}${duty ? ` (${duty})` : ''}`;
  return { signal: name, tag: `${kind} ${part}`, words, values: signals[name] };
}

/** The signal minus its average: the output ripple as the eye sees it on an AC-coupled probe. */
export function withoutAverage(values: ArrayLike<number>, average: number): number[] {
  return Array.from(values, (v) => v - average);
}

/** Plots of the one-period steady state: inductor currents, switch/rectifier currents, nodes, ripple. */
export function steadyGroups(signals: Signals, outAverageV: number, duties: Duties): SignalGroup[] {
  const groups: SignalGroup[] = [];
  const inductors = present(signals, /^L\d+$/, '.i');
  if (inductors.length > 0) {
    groups.push({
      key: 'inductors',
      title: 'Inductor currents',
      quantity: 'Current',
      unit: 'A',
      traces: inductors.map((n) => partTrace(signals, n, duties)),
    });
  }
  const nodes = [...present(signals, /^sw\d*$/, '.v'), ...present(signals, /^(Cs|Cbus)$/, '.v')];
  if (nodes.length > 0) {
    groups.push({
      key: 'nodes',
      title: nodes.some((n) => n.startsWith('Cs')) ? 'Switch node and coupling capacitor' : 'Switch node',
      quantity: 'Voltage',
      unit: 'V',
      traces: nodes.map((n) => partTrace(signals, n, duties)),
    });
  }
  // Switches first, then rectifiers: the order the current hands over in.
  const semis = [...present(signals, /^Q\d+$/, '.i'), ...present(signals, /^D\d+$/, '.i')];
  if (semis.length > 0) {
    groups.push({
      key: 'switches',
      title: 'Switch and rectifier currents',
      quantity: 'Current',
      unit: 'A',
      traces: semis.map((n) => partTrace(signals, n, duties)),
    });
  }
  if (signals['out.v']) {
    groups.push({
      key: 'ripple',
      title: 'Output ripple',
      quantity: 'Ripple',
      unit: 'V',
      traces: [
        {
          signal: 'out.v',
          tag: 'ṽ out',
          words: 'output voltage minus its average (AC-coupled view)',
          values: withoutAverage(signals['out.v'], outAverageV),
        },
      ],
    });
  }
  return groups;
}

/** Plots of a transient: the output and coupling-capacitor voltages, then the inductor currents. */
export function transientGroups(signals: Signals, duties: Duties): SignalGroup[] {
  const groups: SignalGroup[] = [];
  const volts = [...(signals['out.v'] ? ['out.v'] : []), ...present(signals, /^(Cs|Cbus)$/, '.v')];
  if (volts.length > 0) {
    groups.push({
      key: 'output',
      title: volts.length > 1 ? 'Output and coupling-capacitor voltages' : 'Output voltage',
      quantity: 'Voltage',
      unit: 'V',
      traces: volts.map((n) => partTrace(signals, n, duties)),
    });
  }
  const inductors = present(signals, /^L\d+$/, '.i');
  if (inductors.length > 0) {
    groups.push({
      key: 'inductors',
      title: 'Inductor currents',
      quantity: 'Current',
      unit: 'A',
      traces: inductors.map((n) => partTrace(signals, n, duties)),
    });
  }
  return groups;
}
