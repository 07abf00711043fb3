/** Cautions that follow from any topology's numbers (the topology adds its own). */
import type { Topology } from '../topologies/topology.ts';
import { formatSi } from '../units/format.ts';
import type { CornerFigures } from './corner-figures.ts';
import type { Design } from './design.ts';
import type { Caution } from './types.ts';

/** Input-capacitor RMS current above this fraction of the input current marks pulsating input (common practice). */
export const PULSATING_INPUT_RATIO = 0.5;

export function generalCautions(topology: Topology, d: Design, figures: CornerFigures[]): Caution[] {
  const out: Caution[] = [];
  if (topology.outputSign < 0) {
    out.push({
      code: 'negative-output',
      message: `The output is negative (${d.voutV} V): the load, its ground reference and any feedback divider must accept a rail below ground.`,
    });
  }
  let worst = 0;
  for (const r of figures) {
    if (!r.fullLoad) continue;
    const iin = r.pinW / r.vinV;
    if (r.cinRmsA !== undefined && iin > 0) worst = Math.max(worst, r.cinRmsA / iin);
  }
  if (worst > PULSATING_INPUT_RATIO) {
    out.push({
      code: 'pulsating-input',
      value: worst,
      message: `Pulsating input current: the input capacitor carries ${(worst * 100).toFixed(0)} % of the input current as RMS ripple; expect an input filter (and its damping) to meet conducted-emission limits.`,
    });
  }
  const light = figures.find((r) => !r.fullLoad);
  if (light?.mode === 'dcm') {
    out.push({
      code: 'light-load-dcm',
      value: light.ioutA,
      message: `Discontinuous conduction at ${formatSi(light.ioutA, 'A')} load: the duty drops to ${(light.duty * 100).toFixed(1)} % and the loop's small-signal behaviour changes; check stability and minimum on-time there.`,
    });
  }
  if (topology.loops > 1) {
    out.push({
      code: 'cascade-two-loops',
      message:
        'Two stages in cascade need two control loops (or one controller with two outputs); the second stage is a constant-power load on the bus, a negative incremental resistance the first loop must tolerate.',
    });
  }
  return out;
}
