/**
 * Switched netlist of the coupled-inductor SEPIC: the SEPIC circuit plus a K element between the two
 * windings at the design's coupling, clamped to 0.999 (parts.ts K_MAX) because the ideal preset's
 * k = 1 makes the inductance matrix singular for the waveform engine and for SPICE alike.
 */
import type { Design } from '../../engine/design.ts';
import type { Netlist } from '../../waveform/netlist.ts';
import type { DutyCommand, NetlistOptions } from './parts.ts';
import { buildSepicFamilyNetlist } from './sepic.ts';

export function buildSepicCoupledNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  return buildSepicFamilyNetlist(d, 'coupled', vinV, ioutA, duty, opts);
}
