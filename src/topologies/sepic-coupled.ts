/** SEPIC with both windings on one core (one two-winding part, L1 = L2 enforced). */

import { sepicCautions } from './sepic-cautions.ts';
import { operateSepic, sepicComponents } from './sepic-core.ts';
import type { Topology } from './topology.ts';

export const sepicCoupled: Topology = {
  id: 'sepic-coupled',
  title: 'SEPIC, coupled inductor',
  summary:
    'SEPIC whose two windings share one core: one magnetic part, about half the inductance per winding for the same ripple, and the coupling capacitor absorbs the leakage energy. The windings must be equal.',
  outputSign: 1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components: (rect) => sepicComponents('coupled', rect),
  operate: (d, at, w, s) => operateSepic(d, 'coupled', at, w, s),
  cautions: (d, spec, nominal) => sepicCautions(d, spec, nominal, 'coupled'),
};
