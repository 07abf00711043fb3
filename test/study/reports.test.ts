/** The study's renderers: CSV (RFC 4180, injection-safe), Markdown design note, JSON. */
import { describe, expect, it } from 'vitest';
import { SAFETY_CAUTION } from '../../src/report/caution.ts';
import { csvCell, neutraliseCell, renderStudyCsv, STUDY_CSV_COLUMNS } from '../../src/report/study-csv.ts';
import { renderStudyJson } from '../../src/report/study-json.ts';
import { escapeMarkdown, renderStudyMarkdown } from '../../src/report/study-markdown.ts';
import { syntheticStudy, WORKED } from './synthetic.ts';

/** A slow, obvious RFC 4180 reader (RFC 4180, "Common Format and MIME Type for CSV Files", IETF, 2005). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      row.push(cell);
      cell = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += ch;
  }
  return rows;
}

describe('CSV', () => {
  it('prefixes text cells that a spreadsheet would run as a formula (OWASP, "CSV Injection")', () => {
    for (const bad of ['=1+2', '+1', '-2+3', '@SUM(A1)', '\t=1', '\r=1'])
      expect(neutraliseCell(bad)).toBe(`'${bad}`);
    expect(neutraliseCell('sepic@400k/r0.3/sync')).toBe('sepic@400k/r0.3/sync');
  });

  it('leaves numbers as numbers, negative ones included', () => {
    expect(csvCell(-12)).toBe('-12');
    expect(csvCell(Number.POSITIVE_INFINITY)).toBe('Infinity');
    expect(csvCell(null)).toBe('');
  });

  it('quotes commas, quotes and line breaks, doubling quotes', () => {
    expect(csvCell('a, "b"\nc')).toBe('"a, ""b""\nc"');
  });

  it('writes one row per candidate that reads back to the same text, with injection neutralised', () => {
    const study = syntheticStudy(WORKED);
    study.candidates[0].verdict = {
      ...study.candidates[0].verdict,
      text: '=HYPERLINK("http://x", "click"), then "more"',
    };
    const rows = parseCsv(renderStudyCsv(study));
    expect(rows[0]).toEqual([...STUDY_CSV_COLUMNS]);
    expect(rows).toHaveLength(study.candidates.length + 2);
    for (const r of rows) expect(r).toHaveLength(STUDY_CSV_COLUMNS.length);
    expect(rows.at(-1)?.slice(0, 2)).toEqual(['caution', SAFETY_CAUTION]);
    const explanation = STUDY_CSV_COLUMNS.indexOf('explanation');
    expect(rows[1][explanation]).toBe(`'=HYPERLINK("http://x", "click"), then "more"`);
    expect(rows[4][explanation]).toBe(study.candidates[3].verdict.text);
    expect(Number(rows[1][STUDY_CSV_COLUMNS.indexOf('lossW')])).toBe(2);
  });
});

describe('Markdown design note', () => {
  const study = syntheticStudy(WORKED);
  const md = renderStudyMarkdown(study);

  it('ends with the standard safety caution', () => {
    expect(md).toContain(`> ${SAFETY_CAUTION}`);
    expect(SAFETY_CAUTION).toBe(
      'Estimates for topology selection only: verify with a circuit simulator and on hardware; check thermal design, creepage and clearance; defer to local codes and licensed practice.',
    );
  });

  it('has the spec, candidates considered, the front, the recommendation and its reasoning', () => {
    for (const heading of [
      '### Rail spec',
      '### Candidates considered',
      '### Pareto front',
      '### Recommendation',
    ]) {
      expect(md).toContain(heading);
    }
    expect(md).toContain('| **zeta@300k/r0.3/sync** | 11 | 1.6 W |');
    expect(md).toContain(escapeMarkdown(study.summary.comparisons[0].text));
  });

  it('escapes user text so it cannot inject HTML or break a table', () => {
    expect(escapeMarkdown('a | <script>x</script> *b*')).toBe('a \\| &lt;script&gt;x&lt;/script&gt; \\*b\\*');
    const named = { ...study, spec: { ...study.spec, name: 'Rail <b>|</b>' } };
    expect(renderStudyMarkdown(named)).toContain('## Topology study: Rail &lt;b&gt;\\|&lt;/b&gt;');
  });

  it('still renders, with the reason per topology, when nothing is feasible', () => {
    const none = renderStudyMarkdown(syntheticStudy([WORKED[4]]));
    expect(none).toContain('No candidate is feasible.');
    expect(none).toContain('duty 92.1 % above the 88.0 % allowed');
    expect(none).toContain(SAFETY_CAUTION);
  });
});

describe('JSON', () => {
  it('has the agreed shape and writes infinite crowding as "Infinity"', () => {
    const json = JSON.parse(renderStudyJson(syntheticStudy(WORKED)));
    expect(Object.keys(json)).toEqual(
      expect.arrayContaining(['spec', 'candidates', 'front', 'summary', 'sweeps', 'excluded']),
    );
    expect(Object.keys(json.candidates[0])).toEqual(
      expect.arrayContaining([
        'id',
        'topology',
        'fswHz',
        'ripple',
        'rect',
        'feasible',
        'objectives',
        'rank',
        'crowding',
        'verdict',
        'reasons',
        'cautions',
      ]),
    );
    expect(json.candidates[0]).not.toHaveProperty('corners');
    // Extremes of a front have infinite crowding (NSGA-II, Deb et al., IEEE TEVC 2002).
    expect(json.candidates[0].crowding).toBe('Infinity');
    expect(json.sweeps.zeta[0]).toMatchObject({ fswHz: 300e3, efficiency: 0.95, volumeMm3: 1000 });
  });
});
