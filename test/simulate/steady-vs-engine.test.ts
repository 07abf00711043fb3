/**
 * The exact periodic steady state of every sized candidate against the analytic engine that sized it
 * (src/engine/evaluate.ts at the same corner): default technology, marine demo rail at 400 kHz, ripple
 * ratio 0.3, nominal input, full load (CCM for every topology).
 *
 * The analytic engine builds its waveforms with the small-ripple approximation (every capacitor voltage
 * constant over each interval, Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer
 * 2001, §2.2); the switched netlist keeps the ripple. Tolerances (relative, from the brief): averages 2 %,
 * inductor ripple and semiconductor peaks 5 %. Known effects of the approximation, measured here:
 * - coupled SEPIC winding ripple: 4.8–4.9 % apart: with k = 0.98 the coupling capacitor's ripple drives a
 *   differential current through the leakage that the constant-voltage picture leaves out;
 * - output, bus and damping capacitor ripple: the engine adds the charge part and the ESR part peak to
 *   peak, though they peak at different instants, so its estimate is an upper bound (exact is 2–19 % lower);
 *   those are checked as bounds. Cin is not compared: here the ideal source takes the AC input current,
 *   which the engine assigns to Cin.
 */
import { describe, expect, it } from 'vitest';
import { designCandidate, evaluateCorner } from '../../src/engine/evaluate.ts';
import type { RectifierKind } from '../../src/engine/types.ts';
import { simulateCandidate } from '../../src/simulate/candidate.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { expectClose } from '../support/expect-close.ts';
import { ALL_IDS, marineSpec } from './fixtures.ts';

const RTOL_AVG = 0.02;
const RTOL_RIPPLE = 0.05;
const RTOL_PEAK = 0.05;
const RTOL_COUPLING_CAP_RIPPLE = 0.05;
/** Bound on the engine's capacitor-ripple estimate (see header): exact ≤ (1 + 5 %)·engine and ≥ 75 %·engine. */
const CAP_BOUND_ABOVE = 0.05;
const CAP_BOUND_BELOW = 0.25;

const spec = marineSpec();
const tech = loadTechnology('default');
const peakAbs = (m: { min: number; max: number }) => Math.max(Math.abs(m.min), Math.abs(m.max));

describe('exact steady state of each sized candidate against the analytic engine (default technology, nominal input, full load)', () => {
  for (const id of ALL_IDS) {
    for (const rect of ['diode', 'sync'] as RectifierKind[]) {
      it(`${id}, ${rect}: averages within 2 %, inductor ripple and peaks within 5 %`, () => {
        const params = { topology: id, fswHz: 400e3, ripple: 0.3, rect };
        const sim = simulateCandidate(spec, params, tech, {}, { analysis: 'steady' });
        const { topology, design } = designCandidate(spec, params, tech, {});
        const corner = { label: 'vin-nom', vinV: spec.input.nomV, ioutA: spec.load.maxA, fullLoad: true };
        const a = evaluateCorner(topology, design, tech, corner);
        expect(sim.hasDiodeEvents, 'CCM: diodes change only at gate edges').toBe(false);
        expect(sim.duty).toBe(a.duty);
        expectClose(sim.metrics['out.v'].avg, design.voutV, { rtol: RTOL_AVG, what: 'output average' });
        for (const p of design.parts) {
          const c = a.components[p.name];
          const i = sim.metrics[`${p.name}.i`];
          const v = sim.metrics[`${p.name}.v`];
          const what = `${id} ${rect} ${p.name}`;
          if (p.role === 'inductor' || p.role === 'coupled-inductor') {
            expectClose(i.avg, c.iAvgA, { rtol: RTOL_AVG, what: `${what} average current` });
            expectClose(i.max - i.min, c.iPpA, { rtol: RTOL_RIPPLE, what: `${what} ripple` });
            expectClose(peakAbs(i), c.iPeakA, { rtol: RTOL_PEAK, what: `${what} peak current` });
          } else if (p.role === 'switch' || p.role === 'sync' || p.role === 'diode') {
            expectClose(peakAbs(i), c.iPeakA, { rtol: RTOL_PEAK, what: `${what} peak current` });
            expectClose(peakAbs(v), c.vPeakV, { rtol: RTOL_PEAK, what: `${what} peak voltage` });
          } else if (p.name === 'Cs') {
            expectClose(v.max - v.min, c.vPpV, { rtol: RTOL_COUPLING_CAP_RIPPLE, what: `${what} ripple` });
          } else if ((p.role === 'capacitor' || p.role === 'damping-capacitor') && p.name !== 'Cin') {
            const pp = v.max - v.min;
            expect(pp, `${what} ripple ${pp} V within the engine's bound ${c.vPpV} V`).toBeLessThanOrEqual(
              (1 + CAP_BOUND_ABOVE) * c.vPpV,
            );
            expect(
              pp,
              `${what} ripple ${pp} V not far below the engine's ${c.vPpV} V`,
            ).toBeGreaterThanOrEqual((1 - CAP_BOUND_BELOW) * c.vPpV);
          }
        }
      });
    }
  }
});
