/** SEPIC with separate inductors and an Rd–Cd damping leg across the coupling capacitor. */

import { sepicCautions } from './sepic-cautions.ts';
import { operateSepic, sepicComponents } from './sepic-core.ts';
import type { Topology } from './topology.ts';

export const sepicDamped: Topology = {
  id: 'sepic-damped',
  title: 'SEPIC, damped coupling network',
  summary:
    'Separate-inductor SEPIC with a resistor in series with a large capacitor across the coupling capacitor, sized by the optimal-damping method, so an input step no longer rings the coupling network towards twice the step.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components: (rect) => sepicComponents('damped', rect),
  operate: (d, at, w, s) => operateSepic(d, 'damped', at, w, s),
  cautions: (d, spec, nominal) => sepicCautions(d, spec, nominal, 'damped'),
};
