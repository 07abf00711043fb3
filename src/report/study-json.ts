/**
 * The study as JSON: `{ spec, options, candidates, front, summary, sweeps, highlights, excluded }`.
 * Corners stay out (they are big; `straddle evaluate` gives them per candidate). JSON has no Infinity, so
 * the crowding distance of a rank's extreme points is written as the string "Infinity".
 */
import type { Study, StudyCandidate } from '../study/types.ts';

export interface StudyCandidateJson extends Omit<StudyCandidate, 'crowding'> {
  crowding: number | 'Infinity' | null;
}

export function studyToJson(study: Study) {
  return {
    spec: study.spec,
    options: study.options,
    candidates: study.candidates.map(
      (c): StudyCandidateJson => ({
        id: c.id,
        topology: c.topology,
        fswHz: c.fswHz,
        ripple: c.ripple,
        rect: c.rect,
        feasible: c.feasible,
        objectives: c.objectives,
        efficiencyNom: c.efficiencyNom,
        rank: c.rank,
        crowding: c.crowding === Number.POSITIVE_INFINITY ? 'Infinity' : c.crowding,
        representative: c.representative,
        verdict: c.verdict,
        reasons: c.reasons,
        cautions: c.cautions,
      }),
    ),
    front: study.front,
    summary: study.summary,
    sweeps: study.sweeps,
    highlights: study.highlights,
    excluded: study.excluded,
  };
}

export function renderStudyJson(study: Study): string {
  return `${JSON.stringify(studyToJson(study), null, 2)}\n`;
}
