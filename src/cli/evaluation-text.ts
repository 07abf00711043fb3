/** Plain-text rendering of one evaluation for the terminal. */
import type { Evaluation } from '../engine/types.ts';
import { SAFETY_CAUTION } from '../report/caution.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatPercent, formatSi } from '../units/format.ts';

export function renderEvaluationText(spec: RailSpec, ev: Evaluation): string {
  const lines: string[] = [];
  lines.push(
    `${spec.name}: ${ev.topology} at ${formatSi(ev.fswHz, 'Hz')}, ripple ratio ${ev.ripple}, ${ev.rect} rectifier`,
  );
  lines.push(
    ev.feasible ? 'feasible' : `INFEASIBLE:\n${ev.reasons.map((r) => `  - ${r.message}`).join('\n')}`,
  );
  const o = ev.objectives;
  lines.push(
    `parts ${o.parts}, worst-corner loss ${formatSi(o.lossW, 'W')}, stress ${o.stress.toFixed(2)}, volume ${o.volumeMm3.toFixed(0)} mm³, efficiency at nominal ${formatPercent(ev.efficiencyNom)}`,
  );
  lines.push('');
  for (const c of ev.corners) {
    lines.push(
      `${c.label}: Vin ${formatSi(c.vinV, 'V')}, Iout ${formatSi(c.ioutA, 'A')}, duty ${formatPercent(c.duty)}, ${c.mode}, loss ${formatSi(c.lossW, 'W')}, efficiency ${formatPercent(c.efficiency)}`,
    );
  }
  lines.push('');
  for (const p of ev.parts) lines.push(`  ${p.name.padEnd(7)} ${p.detail}`);
  if (ev.cautions.length) {
    lines.push('', 'cautions:');
    for (const c of ev.cautions) lines.push(`  - ${c.message}`);
  }
  lines.push('', SAFETY_CAUTION);
  return `${lines.join('\n')}\n`;
}
