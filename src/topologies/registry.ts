/** Every topology Straddle evaluates, by id. Adding one = one file + one line here. */
import type { TopologyId } from '../engine/types.ts';
import { boostThenBuck } from './boost-then-buck.ts';
import { buckThenBoost } from './buck-then-boost.ts';
import { cuk } from './cuk.ts';
import { fourSwitchBuckBoost } from './four-switch-buck-boost.ts';
import { invertingBuckBoost } from './inverting-buck-boost.ts';
import { sepic } from './sepic.ts';
import { sepicCoupled } from './sepic-coupled.ts';
import { sepicDamped } from './sepic-damped.ts';
import type { Topology } from './topology.ts';
import { zeta } from './zeta.ts';

const ALL: Topology[] = [
  sepic,
  sepicCoupled,
  sepicDamped,
  boostThenBuck,
  buckThenBoost,
  invertingBuckBoost,
  cuk,
  zeta,
  fourSwitchBuckBoost,
];

export const TOPOLOGIES: ReadonlyMap<TopologyId, Topology> = new Map(ALL.map((t) => [t.id, t]));

export function topologyIds(): TopologyId[] {
  return [...TOPOLOGIES.keys()];
}

export function getTopology(id: string): Topology | undefined {
  return TOPOLOGIES.get(id as TopologyId);
}
