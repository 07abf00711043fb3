/** Boost stage up to an intermediate bus above every rail, then a buck stage down to the output. */
import { busReasons, prepareBus } from './cascade-bus.ts';
import { cascadeCautions } from './cascade-cautions.ts';
import { cascadeComponents, operateCascade } from './cascade-core.ts';
import type { Topology } from './topology.ts';

export const boostThenBuck: Topology = {
  id: 'boost-then-buck',
  title: 'Boost then buck (two-stage cascade)',
  summary:
    'A boost stage lifts the input to an intermediate bus above the highest input and the output; a buck stage then steps the bus down to the output. Two simple, well-understood stages with two controllers: continuous input current and a quiet output, at the price of two inductors, a bus capacitor and semiconductors that all block the bus voltage.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 2,
  components: (rect) => cascadeComponents('boost-buck', rect),
  prepare: (d, spec) => prepareBus('boost-buck', d, spec),
  operate: (d, at, w, s) => operateCascade(d, 'boost-buck', at, w, s),
  cautions: (d, spec) => cascadeCautions(d, spec, 'boost-buck'),
  reasons: (d, spec) => busReasons('boost-buck', d, spec),
};
