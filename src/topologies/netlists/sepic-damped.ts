/** Switched netlist of the damped SEPIC: the SEPIC circuit plus the Cd–Rd leg across the coupling capacitor. */
import type { Design } from '../../engine/design.ts';
import type { Netlist } from '../../waveform/netlist.ts';
import type { DutyCommand, NetlistOptions } from './parts.ts';
import { buildSepicFamilyNetlist } from './sepic.ts';

export function buildSepicDampedNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  return buildSepicFamilyNetlist(d, 'damped', vinV, ioutA, duty, opts);
}
