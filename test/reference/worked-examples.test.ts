/**
 * The engine against published worked examples (data and sources in worked-examples.ts, conventions in
 * WORKED-EXAMPLES.md). Each example is rebuilt as a pinned design on the lossless `ideal` technology
 * at the example's single operating point, and every printed result is compared within the precision
 * its printed digits imply. Textbook buck and boost examples are checked on the four-switch
 * buck-boost in its buck and boost regions, the Ćuk example on the Zeta (which shares every quantity it
 * prints) and the separate-inductor SEPIC note on a 1:1 coupled pair at half the inductance; each
 * example's notes give the reduction.
 */
import { describe, it } from 'vitest';
import { evaluateCandidate } from '../../src/engine/evaluate.ts';
import type { CornerResult, TopologyId } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { expectClose } from '../support/expect-close.ts';
import { railSpec } from '../support/specs.ts';
import { MODE_CODE, WORKED_EXAMPLES, type WorkedExample } from './worked-examples.ts';

const ideal = loadTechnology('ideal');

const TOPOLOGY: Record<WorkedExample['topology'], TopologyId> = {
  sepic: 'sepic',
  'sepic-coupled': 'sepic-coupled',
  'inverting-buck-boost': 'inverting-buck-boost',
  'four-switch-buck-boost': 'four-switch-buck-boost',
  cuk: 'cuk',
  zeta: 'zeta',
  boost: 'four-switch-buck-boost',
  buck: 'four-switch-buck-boost',
};

function run(ex: WorkedExample): CornerResult {
  const i = ex.inputs;
  const vout = Math.abs(i.voutV ?? ex.expected.voutV);
  const iout = i.ioutA ?? vout / i.loadOhm;
  const pins: Record<string, number> = { L1: i.l1H };
  if (i.l2H) pins.L2 = i.l2H;
  if (i.csF) pins.Cs = i.csF;
  if (i.coutF) pins.Cout = i.coutF;
  if (i.couplingK) pins['L1.k'] = i.couplingK;
  const spec = railSpec({
    vin: i.vinV,
    vout,
    iout,
    imin: iout,
    switching: { minHz: i.fswHz, maxHz: i.fswHz },
  });
  // synchronous rectification keeps the textbook's CCM assumption at any load (forced CCM)
  const ev = evaluateCandidate(
    spec,
    { topology: TOPOLOGY[ex.topology], fswHz: i.fswHz, ripple: 0.3, rect: 'sync' },
    ideal,
    pins,
  );
  return ev.corners[0];
}

function mainSwitch(c: CornerResult): string {
  return c.mode === 'boost' ? 'Q3' : 'Q1';
}
function rectifier(c: CornerResult): string {
  return c.mode === 'boost' ? 'Q4' : 'Q2';
}

/** The engine's figure for each key an example may print. */
function actual(key: string, c: CornerResult, ex: WorkedExample): number | undefined {
  const eta = ex.inputs.efficiency ?? 1; // sources that divide the input current by an assumed efficiency
  const L1 = c.components.L1;
  const L2 = c.components.L2;
  switch (key) {
    case 'duty':
      return c.duty;
    case 'il1AvgA':
      return Math.abs(L1.iAvgA) / (ex.topology === 'sepic' ? eta : 1);
    case 'il2AvgA':
      return Math.abs(L2.iAvgA);
    case 'il1PpA':
      return L1.iPpA;
    case 'il2PpA':
      return L2.iPpA;
    case 'il1PeakA':
      return Math.abs(L1.iAvgA) / eta + L1.iPpA / 2;
    case 'il1MinA':
      return Math.abs(L1.iAvgA) - L1.iPpA / 2;
    case 'iinAvgA':
      return c.components.Q1 && ex.topology !== 'cuk' && ex.topology !== 'sepic'
        ? Math.abs(c.components.Q1.iAvgA)
        : Math.abs(L1.iAvgA);
    case 'qPeakA':
      return c.components[mainSwitch(c)].iPeakA;
    case 'dAvgA':
      return Math.abs(c.components[rectifier(c)].iAvgA);
    case 'csVPpV':
      return c.components.Cs.vPpV;
    case 'coutVPpV':
      return c.components.Cout.vPpV;
    case 'mode':
      return c.mode === 'boost' ? MODE_CODE.boost : MODE_CODE.buck;
    default:
      return undefined; // lCritH, cCritF, voutV: handled below or not an engine output
  }
}

describe('published worked examples', () => {
  for (const ex of WORKED_EXAMPLES) {
    it(`${ex.id} (${ex.provenance}): ${ex.source.slice(0, 90)}…`, () => {
      const c = run(ex);
      let checked = 0;
      if (ex.inputs.duty !== undefined && ex.expected.voutV !== undefined) {
        // the example fixes the duty and prints the output: the engine, asked for that output, must find that duty
        expectClose(c.duty, ex.inputs.duty, {
          rtol: Math.max(ex.precision.voutV, 1e-9),
          what: `${ex.id} duty for the printed output`,
        });
        checked++;
      }
      for (const [key, expected] of Object.entries(ex.expected)) {
        const got = actual(key, c, ex);
        if (got === undefined) continue;
        const rtol = ex.precision[key];
        if (rtol === 0) expectClose(got, expected, { atol: 0, what: `${ex.id} ${key}` });
        else expectClose(got, expected, { rtol: rtol + 1e-6, what: `${ex.id} ${key}` });
        checked++;
      }
      if (checked === 0) throw new Error(`${ex.id}: nothing compared`);
    });
  }
});
