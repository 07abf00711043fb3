/** `straddle evaluate SPEC --topology ID --fsw FREQ [--ripple R] [--rect diode|sync] [--tech NAME] [--set N=V]... --json` */
import { parseArgs } from 'node:util';
import { createDesign, evaluateCandidate } from '../engine/evaluate.ts';
import { checkPins } from '../engine/pins.ts';
import type { RectifierKind } from '../engine/types.ts';
import { SAFETY_CAUTION } from '../report/study-markdown.ts';
import { loadSpecFile, loadTechnology } from '../spec/load.ts';
import { getTopology, topologyIds } from '../topologies/registry.ts';
import { parsePins, quantityOption, UsageError } from './args.ts';
import { renderEvaluationText } from './evaluation-text.ts';

export const DEFAULT_RIPPLE = 0.3;

export function evaluateCommand(argv: string[]): string {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      topology: { type: 'string' },
      fsw: { type: 'string' },
      ripple: { type: 'string' },
      rect: { type: 'string' },
      tech: { type: 'string' },
      set: { type: 'string', multiple: true },
      json: { type: 'boolean' },
    },
  });
  const problems: string[] = [];
  if (positionals.length !== 1) problems.push('evaluate takes exactly one SPEC file');
  const topology = values.topology ? getTopology(values.topology) : undefined;
  if (!values.topology) problems.push(`--topology is required (one of ${topologyIds().join(', ')})`);
  else if (!topology)
    problems.push(`--topology ${values.topology}: unknown (one of ${topologyIds().join(', ')})`);
  const fsw = quantityOption('fsw', values.fsw, 'Hz', problems);
  if (values.fsw === undefined) problems.push('--fsw is required, e.g. --fsw 400k');
  else if (fsw !== undefined && !(fsw >= 1e3 && fsw <= 1e8))
    problems.push(`--fsw ${values.fsw}: outside 1 kHz–100 MHz`);
  const ripple = values.ripple === undefined ? DEFAULT_RIPPLE : Number(values.ripple);
  if (!(ripple > 0 && ripple <= 2)) problems.push(`--ripple ${values.ripple}: a ripple ratio in (0, 2]`);
  const rect = (values.rect ?? 'diode') as RectifierKind;
  if (rect !== 'diode' && rect !== 'sync') problems.push(`--rect ${values.rect}: diode or sync`);
  else if (topology && !topology.rectifiers.includes(rect))
    problems.push(`--rect ${rect}: ${topology.id} offers ${topology.rectifiers.join(', ')}`);
  const pins = parsePins(values.set, problems);
  if (problems.length) throw new UsageError(problems);

  const loaded = loadSpecFile(positionals[0]);
  if (!loaded.ok)
    throw new UsageError(loaded.issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)));
  const spec = loaded.spec;
  let tech: ReturnType<typeof loadTechnology>;
  try {
    tech = loadTechnology(values.tech ?? spec.technology);
  } catch (error) {
    throw new UsageError([`--tech: ${(error as Error).message}`]);
  }
  const params = { topology: topology!.id, fswHz: fsw!, ripple, rect };
  const pinProblems = checkPins(createDesign(topology!, spec, params, tech), pins);
  if (pinProblems.length) throw new UsageError(pinProblems);
  const ev = evaluateCandidate(spec, params, tech, pins);
  if (values.json) {
    const { corners, ...rest } = ev;
    return `${JSON.stringify({ ...rest, corners, caution: SAFETY_CAUTION }, null, 2)}\n`;
  }
  return renderEvaluationText(spec, ev);
}
