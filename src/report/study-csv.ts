/**
 * The study as CSV (RFC 4180: comma separated, CRLF line ends, fields with a comma, quote or line break
 * quoted, quotes doubled): one row per candidate. Text cells that a spreadsheet would read as a formula
 * (starting with =, +, -, @, tab or carriage return) are prefixed with a single quote, the usual
 * neutralisation against CSV injection (common practice, OWASP "CSV Injection" page). Numbers are
 * written as numbers and left alone, so a negative value stays a number. The last row carries the
 * safety caution (id cell `caution`).
 */
import type { Study } from '../study/types.ts';
import { SAFETY_CAUTION } from './caution.ts';

export const STUDY_CSV_COLUMNS = [
  'id',
  'topology',
  'fswHz',
  'ripple',
  'rect',
  'feasible',
  'rank',
  'crowding',
  'parts',
  'lossW',
  'stress',
  'volumeMm3',
  'efficiencyNom',
  'verdict',
  'representative',
  'explanation',
  'cautions',
] as const;

type Cell = string | number | boolean | null;

/** Prefix a text cell that a spreadsheet would evaluate as a formula. */
export function neutraliseCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function csvCell(value: Cell): string {
  if (value === null) return '';
  if (typeof value === 'number')
    return Number.isFinite(value) ? String(value) : value > 0 ? 'Infinity' : String(value);
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  const text = neutraliseCell(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function renderStudyCsv(study: Study): string {
  const rows: Cell[][] = study.candidates.map((c) => [
    c.id,
    c.topology,
    c.fswHz,
    c.ripple,
    c.rect,
    c.feasible,
    c.rank,
    c.crowding,
    c.objectives.parts,
    c.objectives.lossW,
    c.objectives.stress,
    c.objectives.volumeMm3,
    c.efficiencyNom,
    c.verdict.kind,
    c.representative,
    c.verdict.text,
    c.cautions.map((k) => k.code).join('; '),
  ]);
  // the safety caution travels with the file: a last row whose id cell is `caution`, padded to full width
  const caution: Cell[] = ['caution', SAFETY_CAUTION, ...Array(STUDY_CSV_COLUMNS.length - 2).fill(null)];
  return [[...STUDY_CSV_COLUMNS], ...rows, caution].map((r) => `${r.map(csvCell).join(',')}\r\n`).join('');
}
