/** Design cautions of the two cascades, each with its reason and numbers. */
import type { Design } from '../engine/design.ts';
import type { Caution } from '../engine/types.ts';
import { WaveSet } from '../engine/wave.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSi } from '../units/format.ts';
import { type CascadeOrder, chooseBus } from './cascade-bus.ts';
import { CBUS, L1, L2, Q1, Q3, RECT1, RECT2, solveCascade } from './cascade-core.ts';
import { rhpZeroCaution } from './rhp-zero.ts';
import { newStageState } from './stage.ts';

export function cascadeCautions(d: Design, spec: RailSpec, order: CascadeOrder): Caution[] {
  const out: Caution[] = [];
  const boostFirst = order === 'boost-buck';
  const bus = chooseBus(order, spec, d.dutyMin, d.dutyMax, d.params.rect, d.busMargin);
  const where = boostFirst ? 'above the highest' : 'below the lowest';
  const clamp =
    Math.abs(bus.busV - bus.preferredV) > 1e-9 * bus.preferredV
      ? ` The ${(100 * (bus.preferredV / bus.railV - 1)).toFixed(0)} % margin alone asks for ${formatSi(bus.preferredV, 'V')}; ` +
        `the duty limits at ${formatSi(d.params.fswHz, 'Hz')} move it to ${formatSi(bus.busV, 'V')}` +
        (bus.reachable ? '.' : ', and no bus satisfies both stages.')
      : '';
  out.push({
    code: 'bus-voltage',
    value: d.busV,
    message:
      `Intermediate bus at ${formatSi(d.busV, 'V')}, ${(100 * bus.margin).toFixed(0)} % ${where} rail ` +
      `(${formatSi(bus.railV, 'V')}), so neither stage runs at a duty near 0 or 1. ` +
      (boostFirst
        ? `Every semiconductor blocks about the bus voltage, more than the input or output alone.`
        : `The bus carries more current than the input or the output: ${formatSi((spec.output.voltageV * spec.load.maxA) / d.busV, 'A')} or more at full load.`) +
      clamp,
  });

  // operating point at nominal input and full load, solved afresh (the nominal scalars carry stage 1 only)
  const w = new WaveSet(d.parts.length);
  const s1 = newStageState();
  const s2 = newStageState();
  solveCascade(d, order, { vinV: spec.input.nomV, ioutA: spec.load.maxA }, w, s1, s2);

  // RHP zero of the boost stage: ωz = D′²·R/L with R the boost's own load (Erickson & Maksimović Table 8.2)
  if (boostFirst) {
    const rBus = s2.iinA > 0 ? d.busV / s2.iinA : Number.POSITIVE_INFINITY;
    const c = rhpZeroCaution(rBus, s1.duty, d.parts[L1].value, 'boost');
    out.push({ ...c, message: `Stage-1 boost (load Vbus/iBus = ${formatSi(rBus, 'Ω')}): ${c.message}` });
  } else {
    const rOut = spec.output.voltageV / spec.load.maxA;
    const c = rhpZeroCaution(rOut, s2.duty, d.parts[L2].value, 'boost');
    out.push({ ...c, message: `Stage-2 boost: ${c.message}` });
  }

  const rect1 = d.parts[RECT1].name;
  const rect2 = d.parts[RECT2].name;
  const cbusRms = formatSi(w.rms(CBUS), 'A');
  out.push({
    code: 'switching-loop',
    value: w.rms(CBUS),
    message: boostFirst
      ? `Cbus takes pulsating current from both sides: the boost rectifier ${rect1} pushes pulses of up to ` +
        `${formatSi(w.max(RECT1), 'A')} in and the buck switch Q3 pulls pulses of up to ${formatSi(w.max(Q3), 'A')} out ` +
        `(${cbusRms} RMS at nominal input). Keep both hot loops, ${rect1}–Cbus–Q1 and Q3–${rect2}–Cbus, tight around Cbus (common practice).`
      : `The bus current is continuous on both sides (buck inductor in, boost inductor out; Cbus carries ${cbusRms} RMS), ` +
        `but the input (buck switch Q1, pulses of up to ${formatSi(w.max(Q1), 'A')}) and the output (boost rectifier ${rect2}, ` +
        `pulses of up to ${formatSi(w.max(RECT2), 'A')}) pulsate: keep Cin–Q1–${rect1} and Q3–${rect2}–Cout tight (common practice).`,
  });
  return out;
}
