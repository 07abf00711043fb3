/**
 * Sweep options as the form types them (text) → study options, with every problem beside its field:
 * `fp` frequency points, `rp` ripple ratios, `obj` objectives, `w.<objective>` weights.
 */
import type { SpecIssue } from '../spec/errors.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { DEFAULT_OBJECTIVES, resolveStudyOptions, type StudyOptionsInput } from '../study/options.ts';
import type { StudyOptions } from '../study/types.ts';
import { type SweepText, splitList, WEB_MAX_CANDIDATES } from './view-state.ts';

export type SweepCheck = { ok: true; options: StudyOptions } | { ok: false; issues: SpecIssue[] };

const OPTION_FIELD: Record<string, string> = {
  frequencyPoints: 'fp',
  maxCandidates: 'fp',
  ripples: 'rp',
  objectives: 'obj',
  weights: 'w',
  band: '',
  epsilon: '',
};

export function checkSweep(spec: RailSpec, text: SweepText): SweepCheck {
  const issues: SpecIssue[] = [];
  const input: StudyOptionsInput = { maxCandidates: WEB_MAX_CANDIDATES };

  const fp = Number(text.fp.trim());
  if (!/^\d+$/.test(text.fp.trim()) || fp < 2 || fp > 200) {
    issues.push({
      path: 'fp',
      message: `fp: "${text.fp}" is not a whole number of frequency points from 2 to 200`,
    });
  } else input.frequencyPoints = fp;

  if (text.rp.trim() !== '') {
    const parts = splitList(text.rp);
    const ripples = parts.map(Number);
    const bad = parts.filter((_, i) => !Number.isFinite(ripples[i]));
    if (bad.length > 0)
      issues.push({ path: 'rp', message: `rp: ${bad.map((b) => `"${b}"`).join(', ')} not a number` });
    else input.ripples = ripples;
  }

  const objectives = text.obj.length > 0 ? text.obj : [...DEFAULT_OBJECTIVES];
  input.objectives = objectives;
  const weights: number[] = [];
  for (const key of objectives) {
    const t = text.w[key];
    const w = t === undefined ? 1 : Number(t);
    if (!Number.isFinite(w) || w < 0) {
      issues.push({ path: `w.${key}`, message: `w.${key}: "${t}" is not a weight ≥ 0` });
    }
    weights.push(w);
  }
  if (issues.every((i) => !i.path.startsWith('w.'))) input.weights = weights;
  if (issues.length > 0) return { ok: false, issues };

  const resolved = resolveStudyOptions(spec, input);
  if (resolved.ok) return resolved;
  return {
    ok: false,
    issues: resolved.issues.map((i) => {
      const path = OPTION_FIELD[i.option] ?? '';
      return { path, message: path === '' ? i.message : `${path}: ${i.message}` };
    }),
  };
}
