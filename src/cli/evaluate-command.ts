/** `straddle evaluate SPEC --topology ID --fsw FREQ [--ripple R] [--rect diode|sync] [--tech NAME] [--set N=V]... --json` */
import { parseArgs } from 'node:util';
import { evaluateCandidate } from '../engine/evaluate.ts';
import { SAFETY_CAUTION } from '../report/caution.ts';
import { CANDIDATE_OPTIONS, parseCandidateArgs } from './candidate-args.ts';
import { renderEvaluationText } from './evaluation-text.ts';

/** evaluate reports every corner, so it takes no operating point (--vin, --iout). */
const { vin: _vin, iout: _iout, ...EVALUATE_OPTIONS } = CANDIDATE_OPTIONS;

export function evaluateCommand(argv: string[]): string {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: { ...EVALUATE_OPTIONS, json: { type: 'boolean' } },
  });
  const { spec, params, tech, pins } = parseCandidateArgs('evaluate', values, positionals, []);
  const ev = evaluateCandidate(spec, params, tech, pins);
  if (values.json) {
    const { corners, ...rest } = ev;
    return `${JSON.stringify({ ...rest, corners, caution: SAFETY_CAUTION }, null, 2)}\n`;
  }
  return renderEvaluationText(spec, ev);
}
