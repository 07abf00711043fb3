/** Buck stage down to an intermediate bus below every rail, then a boost stage up to the output. */
import { busReasons, prepareBus } from './cascade-bus.ts';
import { cascadeCautions } from './cascade-cautions.ts';
import { cascadeComponents, operateCascade } from './cascade-core.ts';
import type { Topology } from './topology.ts';

export const buckThenBoost: Topology = {
  id: 'buck-then-boost',
  title: 'Buck then boost (two-stage cascade)',
  summary:
    'A buck stage brings the input down to an intermediate bus below the lowest input and the output; a boost stage then lifts the bus to the output. Low voltage stress on every semiconductor, but the bus carries more current than either rail, and both the input and the output currents pulsate; two inductors, a bus capacitor and two controllers.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 2,
  components: (rect) => cascadeComponents('buck-boost', rect),
  prepare: (d, spec) => prepareBus('buck-boost', d, spec),
  operate: (d, at, w, s) => operateCascade(d, 'buck-boost', at, w, s),
  cautions: (d, spec) => cascadeCautions(d, spec, 'buck-boost'),
  reasons: (d, spec) => busReasons('buck-boost', d, spec),
};
