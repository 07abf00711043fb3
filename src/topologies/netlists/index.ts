/**
 * The switched netlist of every topology, by id: `buildNetlist(design, vinV, ioutA, duty)` gives the circuit
 * the waveform engine (src/waveform/) solves and the SPICE export (src/report/spice.ts) writes, at the duty
 * the topology's operate() found. Element names are the design's component names (Q1, D1, L1, Cs ...), so
 * simulated results map 1:1 onto the analytic corner results; the load is Rload = |Vout|/Iout and the source
 * Vin (plus Lsrc when NetlistOptions.sourceInductanceH is set).
 */
import type { Design } from '../../engine/design.ts';
import type { TopologyId } from '../../engine/types.ts';
import type { Netlist } from '../../waveform/netlist.ts';
import { buildBoostThenBuckNetlist } from './boost-then-buck.ts';
import { buildBuckThenBoostNetlist } from './buck-then-boost.ts';
import { buildCukNetlist } from './cuk.ts';
import { buildFourSwitchNetlist } from './four-switch-buck-boost.ts';
import { buildInvertingBuckBoostNetlist } from './inverting-buck-boost.ts';
import type { DutyCommand, NetlistBuilder, NetlistOptions } from './parts.ts';
import { buildSepicNetlist } from './sepic.ts';
import { buildSepicCoupledNetlist } from './sepic-coupled.ts';
import { buildSepicDampedNetlist } from './sepic-damped.ts';
import { buildZetaNetlist } from './zeta.ts';

export { seedInitialState } from './initial-state.ts';
export type { DutyCommand, NetlistBuilder, NetlistOptions } from './parts.ts';

export const NETLIST_BUILDERS: Readonly<Record<TopologyId, NetlistBuilder>> = {
  sepic: buildSepicNetlist,
  'sepic-coupled': buildSepicCoupledNetlist,
  'sepic-damped': buildSepicDampedNetlist,
  'inverting-buck-boost': buildInvertingBuckBoostNetlist,
  cuk: buildCukNetlist,
  zeta: buildZetaNetlist,
  'four-switch-buck-boost': buildFourSwitchNetlist,
  'boost-then-buck': buildBoostThenBuckNetlist,
  'buck-then-boost': buildBuckThenBoostNetlist,
};

export function buildNetlist(
  design: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  return NETLIST_BUILDERS[design.params.topology](design, vinV, ioutA, duty, opts);
}
