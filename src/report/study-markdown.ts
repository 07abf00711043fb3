/**
 * The study as a design-note section in Markdown: the spec, the candidates considered, the front, the
 * recommendation with its reasoning, its cautions, and the standard safety caution. Every figure comes
 * from the Study; user and engine text is escaped so it cannot break the tables or inject HTML.
 */
import { formatObjective } from '../study/objectives.ts';
import type { Study, StudyCandidate } from '../study/types.ts';
import { formatSiShort } from '../units/format.ts';
import { SAFETY_CAUTION } from './caution.ts';

/** Front rows shown in the note; the rest are in the CSV and JSON. */
export const FRONT_ROWS = 25;

/** Escape text for Markdown: no HTML, no emphasis or links, no table breaks. */
export function escapeMarkdown(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/([\\`*_[\]|#])/g, '\\$1')
    .replace(/\r?\n/g, ' ');
}

const hz = (f: number) => formatSiShort(f, 'Hz', 3);
const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

function specLines(study: Study): string[] {
  const s = study.spec;
  const lines = [
    `- Input: ${formatSiShort(s.input.minV, 'V')} min, ${formatSiShort(s.input.nomV, 'V')} nominal, ${formatSiShort(s.input.maxV, 'V')} max`,
    `- Output: ${formatSiShort(s.output.voltageV, 'V')} (polarity ${s.output.polarity}), load ${formatSiShort(s.load.maxA, 'A')} max, ${formatSiShort(s.load.minA, 'A')} min${s.load.ccmRequired ? ', CCM required' : ''}`,
    `- Ripple limits: output ${formatSiShort(s.ripple.outputVpp, 'V')} p-p${s.ripple.inputVpp === undefined ? '' : `, input ${formatSiShort(s.ripple.inputVpp, 'V')} p-p`}`,
    `- Switching band ${hz(s.switching.minHz)} to ${hz(s.switching.maxHz)}; ambient ${s.ambientC} °C; technology preset ${escapeMarkdown(s.technology)}`,
  ];
  return lines;
}

function consideredLines(study: Study): string[] {
  const o = study.options;
  const feasible = study.candidates.filter((c) => c.feasible).length;
  const lines = [
    `${study.candidates.length} candidates: each applicable topology × ${o.frequencyPoints} switching frequencies on a log grid from ${hz(o.band.minHz)} to ${hz(o.band.maxHz)} × ripple ratios ${o.ripples.join(', ')} × the rectifiers it offers. ${feasible} feasible; ${study.front.length} on the front.`,
    '',
    '| topology | candidates | feasible | best efficiency | smallest volume | knee |',
    '|---|---:|---:|---|---|---|',
  ];
  const topologies = [...new Set(study.candidates.map((c) => c.topology))];
  for (const t of topologies) {
    const mine = study.candidates.filter((c) => c.topology === t);
    const h = study.highlights[t];
    const cells = h
      ? [
          `${pct(h.bestEfficiency.efficiency)} at ${hz(h.bestEfficiency.fswHz)}`,
          `${formatObjective('volumeMm3', h.smallestVolume.volumeMm3)} at ${hz(h.smallestVolume.fswHz)}`,
          `${hz(h.knee.fswHz)} (${pct(h.knee.efficiency)}, ${formatObjective('volumeMm3', h.knee.volumeMm3)})`,
        ]
      : ['–', '–', '–'];
    lines.push(`| ${t} | ${mine.length} | ${mine.filter((c) => c.feasible).length} | ${cells.join(' | ')} |`);
  }
  if (study.excluded.length > 0) {
    lines.push('', 'Excluded:', ...study.excluded.map((e) => `- ${e.topology}: ${escapeMarkdown(e.reason)}`));
  }
  return lines;
}

function frontLines(study: Study): string[] {
  const keys = study.options.objectives;
  const byId = new Map(study.candidates.map((c) => [c.id, c]));
  let rows = study.front.map((id) => byId.get(id)!);
  if (study.options.epsilon > 0) rows = rows.filter((c) => c.representative === c.id);
  rows.sort((a, b) => keys.reduce((acc, k) => acc || a.objectives[k] - b.objectives[k], 0));
  const lines = [
    `Objectives (minimised): ${keys.join(', ')}${study.options.epsilon > 0 ? `; near-identical candidates (within ${pct(study.options.epsilon)}) shown once` : ''}.`,
    '',
    '| candidate | parts | loss | stress | volume | efficiency (nominal) |',
    '|---|---:|---:|---:|---:|---:|',
  ];
  for (const c of rows.slice(0, FRONT_ROWS)) {
    const o = c.objectives;
    lines.push(
      `| ${c.id === study.summary.recommended ? `**${c.id}**` : c.id} | ${o.parts} | ${formatObjective('lossW', o.lossW)} | ${formatObjective('stress', o.stress)} | ${formatObjective('volumeMm3', o.volumeMm3)} | ${pct(c.efficiencyNom)} |`,
    );
  }
  if (rows.length > FRONT_ROWS)
    lines.push('', `… and ${rows.length - FRONT_ROWS} more on the front (see the CSV or JSON).`);
  return lines;
}

function recommendationLines(study: Study, rec: StudyCandidate | undefined): string[] {
  const s = study.summary;
  const lines = [escapeMarkdown(s.headline)];
  if (rec)
    lines.push(
      '',
      `Why it is on the front: ${escapeMarkdown(rec.verdict.text.replace(/^on the front: /, ''))}.`,
    );
  if (s.details.length > 0) {
    lines.push('', s.comparisons.length > 0 ? 'Against the best of each other topology:' : 'Runner-up:');
    lines.push(...s.details.map((d) => `- ${escapeMarkdown(d)}`));
  }
  if (s.infeasibleTopologies.length > 0) {
    lines.push(
      '',
      'Topologies with no feasible candidate:',
      ...s.infeasibleTopologies.map((t) => `- ${escapeMarkdown(t.text)}`),
    );
  }
  return lines;
}

export function renderStudyMarkdown(study: Study): string {
  const rec = study.candidates.find((c) => c.id === study.summary.recommended);
  const out = [
    `## Topology study: ${escapeMarkdown(study.spec.name)}`,
    '',
    '### Rail spec',
    '',
    ...specLines(study),
    '',
    '### Candidates considered',
    '',
    ...consideredLines(study),
    '',
    '### Pareto front',
    '',
    ...(study.front.length > 0 ? frontLines(study) : ['No feasible candidate, so no front.']),
    '',
    '### Recommendation',
    '',
    ...recommendationLines(study, rec),
    '',
  ];
  if (rec) {
    out.push(`### Cautions for ${rec.id}`, '');
    if (rec.cautions.length === 0) out.push('The engine raised no caution for this candidate.');
    else out.push(...rec.cautions.map((c) => `- ${c.code}: ${escapeMarkdown(c.message)}`));
    out.push('');
  }
  out.push('### Safety', '', `> ${SAFETY_CAUTION}`, '');
  return out.join('\n');
}
