/** Rail specs built directly (already in SI) for engine tests; the zod boundary is tested on its own. */
import type { RailSpec } from '../../src/spec/rail-spec.ts';

export function railSpec(
  over: Partial<RailSpec> & {
    vin?: [number, number, number] | number;
    vout?: number;
    iout?: number;
    imin?: number;
  } = {},
): RailSpec {
  const vin = over.vin ?? [10, 12.8, 14.6];
  const [minV, nomV, maxV] = typeof vin === 'number' ? [vin, vin, vin] : vin;
  const iout = over.iout ?? 2;
  return {
    name: over.name ?? 'test rail',
    input: over.input ?? { minV, nomV, maxV },
    output: over.output ?? { voltageV: over.vout ?? 12, polarity: 'either' },
    load: over.load ?? { maxA: iout, minA: over.imin ?? 0.1 * iout, ccmRequired: false },
    ripple: over.ripple ?? { outputVpp: 0.05 },
    switching: over.switching ?? { minHz: 100e3, maxHz: 1e6 },
    ambientC: over.ambientC ?? 40,
    technology: over.technology ?? 'default',
    ...(over.step ? { step: over.step } : {}),
  };
}
