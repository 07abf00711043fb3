/**
 * The corners a candidate must survive: input min / nominal / max at full load, the input nearest
 * the output for mode-changing stages, and light load (at maximum input, where the inductor ripple
 * of every topology here is largest relative to the load) for the CCM/DCM check.
 */
import type { RailSpec } from '../spec/rail-spec.ts';
import type { Topology } from '../topologies/topology.ts';
import type { Corner } from './types.ts';

export function cornersFor(spec: RailSpec, topology: Topology): Corner[] {
  const { minV, nomV, maxV } = spec.input;
  const full = spec.load.maxA;
  const list: Corner[] = [{ label: 'vin-min', vinV: minV, ioutA: full, fullLoad: true }];
  if (nomV !== minV) list.push({ label: 'vin-nom', vinV: nomV, ioutA: full, fullLoad: true });
  if (maxV !== nomV && maxV !== minV)
    list.push({ label: 'vin-max', vinV: maxV, ioutA: full, fullLoad: true });
  const vo = spec.output.voltageV;
  if (topology.modeChanging && vo > minV && vo < maxV && !list.some((c) => c.vinV === vo)) {
    list.push({ label: 'vin-near-vout', vinV: vo, ioutA: full, fullLoad: true });
  }
  if (spec.load.minA > 0 && spec.load.minA < full) {
    list.push({ label: 'light-load', vinV: maxV, ioutA: spec.load.minA, fullLoad: false });
  }
  return list;
}

/** The nominal full-load corner (for efficiency at nominal and the cautions). */
export function nominalCorner(corners: Corner[]): Corner {
  return corners.find((c) => c.label === 'vin-nom') ?? corners[0];
}
