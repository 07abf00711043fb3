/** Switched netlist of the buck-then-boost cascade: see cascade.ts. */
import type { Design } from '../../engine/design.ts';
import type { Netlist } from '../../waveform/netlist.ts';
import { buildCascadeNetlist } from './cascade.ts';
import type { DutyCommand, NetlistOptions } from './parts.ts';

export function buildBuckThenBoostNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  return buildCascadeNetlist(d, 'buck-boost', vinV, ioutA, duty, opts);
}
