/**
 * Start-up from rest of every topology and rectifier on the demo rail: the exact transient must get
 * through the start-up's diode events (two rectifiers sharing one inductor at zero current included)
 * and settle, open loop at the nominal duty, onto the output the analytic engine designed for. The
 * small-ripple duty with drops sets the final value, so 3 % is allowed (common practice tolerance for
 * an open-loop check; the closed loop trims the rest).
 */
import { describe, expect, it } from 'vitest';
import { simulateCandidate } from '../../src/simulate/candidate.ts';
import { loadSpecFile, loadTechnology } from '../../src/spec/load.ts';
import { TOPOLOGIES } from '../../src/topologies/registry.ts';

const loaded = loadSpecFile('data/specs/marine-lifepo4-12v.yaml');
if (!loaded.ok) throw new Error('demo spec invalid');
const spec = { ...loaded.spec, output: { ...loaded.spec.output, polarity: 'either' as const } };
const tech = loadTechnology('default');

describe('start-up from rest of every candidate kind', () => {
  for (const topology of TOPOLOGIES.values()) {
    for (const rect of topology.rectifiers) {
      it(`${topology.id} (${rect}) starts and settles on its output`, () => {
        const r = simulateCandidate(
          spec,
          { topology: topology.id, fswHz: 316e3, ripple: 0.3, rect },
          tech,
          {},
          { analysis: 'startup' },
        );
        const out = r.signals['out.v'];
        const tail = out.slice(Math.floor(out.length * 0.9));
        const final = tail.reduce((a, b) => a + b, 0) / tail.length;
        const target = topology.outputSign * spec.output.voltageV;
        expect(Math.abs(final - target) / Math.abs(target), `final ${final} V vs ${target} V`).toBeLessThan(
          0.03,
        );
      });
    }
  }
});
