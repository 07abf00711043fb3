/** SEPIC with two separate inductors. */

import { sepicCautions } from './sepic-cautions.ts';
import { operateSepic, sepicComponents } from './sepic-core.ts';
import type { Topology } from './topology.ts';

export const sepic: Topology = {
  id: 'sepic',
  title: 'SEPIC, separate inductors',
  summary:
    'Single low-side switch; input inductor, coupling capacitor and a second inductor to ground give a positive output above or below the input with continuous input current. Switch and rectifier block Vin + Vout.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components: (rect) => sepicComponents('separate', rect),
  operate: (d, at, w, s) => operateSepic(d, 'separate', at, w, s),
  cautions: (d, spec, nominal) => sepicCautions(d, spec, nominal, 'separate'),
};
