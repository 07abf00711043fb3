/**
 * `straddle study SPEC [--objectives parts,lossW,stress] [--frequencies 32] [--ripple 0.2,0.3,0.4,0.6]
 *  [--weights 1,1,1] [--band MIN,MAX] [--epsilon E] [--max-candidates N] [--tech NAME] [--format json|csv|md]`
 * Bad options exit 2 (UsageError) with every problem named by its option; large sweeps run on worker
 * threads; a progress bar goes to stderr when stderr is a terminal.
 */
import type { Writable } from 'node:stream';
import { parseArgs } from 'node:util';
import { renderStudyCsv } from '../report/study-csv.ts';
import { renderStudyJson } from '../report/study-json.ts';
import { renderStudyMarkdown } from '../report/study-markdown.ts';
import { loadSpecFile, loadTechnology } from '../spec/load.ts';
import { type OptionIssue, resolveStudyOptions, type StudyOptionsInput } from '../study/options.ts';
import { runStudyParallel } from '../study/parallel.ts';
import type { Study, StudyOptions } from '../study/types.ts';
import { quantityOption, UsageError } from './args.ts';

const FORMATS: Record<string, (study: Study) => string> = {
  json: renderStudyJson,
  csv: renderStudyCsv,
  md: renderStudyMarkdown,
};

/** The command-line flag of each study option, for messages. */
const FLAGS: Record<keyof StudyOptions, string> = {
  objectives: '--objectives',
  frequencyPoints: '--frequencies',
  band: '--band',
  ripples: '--ripple',
  weights: '--weights',
  epsilon: '--epsilon',
  maxCandidates: '--max-candidates',
};

export async function studyCommand(argv: string[], err: Writable): Promise<string> {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      objectives: { type: 'string' },
      frequencies: { type: 'string' },
      ripple: { type: 'string' },
      weights: { type: 'string' },
      band: { type: 'string' },
      epsilon: { type: 'string' },
      'max-candidates': { type: 'string' },
      tech: { type: 'string' },
      format: { type: 'string' },
    },
  });
  const problems: string[] = [];
  if (positionals.length !== 1) problems.push('study takes exactly one SPEC file');
  const format = values.format ?? 'json';
  if (!FORMATS[format]) problems.push(`--format ${format}: one of ${Object.keys(FORMATS).join(', ')}`);
  const input: StudyOptionsInput = {};
  if (values.objectives !== undefined) input.objectives = list(values.objectives);
  if (values.frequencies !== undefined)
    input.frequencyPoints = numberOption('frequencies', values.frequencies, problems);
  if (values.ripple !== undefined) input.ripples = numberList('ripple', values.ripple, problems);
  if (values.weights !== undefined) input.weights = numberList('weights', values.weights, problems);
  if (values.epsilon !== undefined) input.epsilon = numberOption('epsilon', values.epsilon, problems);
  if (values['max-candidates'] !== undefined)
    input.maxCandidates = numberOption('max-candidates', values['max-candidates'], problems);
  if (values.band !== undefined) {
    const parts = values.band.split(',');
    if (parts.length !== 2) problems.push(`--band ${values.band}: expected MIN,MAX, e.g. 200k,800k`);
    else {
      const [minHz, maxHz] = parts.map((p) => quantityOption('band', p.trim(), 'Hz', problems));
      if (minHz !== undefined && maxHz !== undefined) input.band = { minHz, maxHz };
    }
  }
  if (problems.length > 0) throw new UsageError(problems);

  const loaded = loadSpecFile(positionals[0]);
  if (!loaded.ok) throw new UsageError(loaded.issues.map((i) => i.message));
  const spec = loaded.spec;
  let tech: ReturnType<typeof loadTechnology>;
  try {
    tech = loadTechnology(values.tech ?? spec.technology);
  } catch (error) {
    throw new UsageError([`--tech: ${(error as Error).message}`]);
  }
  const resolved = resolveStudyOptions(spec, input);
  if (!resolved.ok) throw new UsageError(resolved.issues.map((i) => issueMessage(i, input)));

  const bar = (err as { isTTY?: boolean }).isTTY ? progressBar(err) : undefined;
  try {
    const study = await runStudyParallel(spec, tech, input, { onProgress: bar?.update });
    return FORMATS[format](study);
  } finally {
    bar?.clear();
  }
}

function issueMessage(issue: OptionIssue, input: StudyOptionsInput): string {
  if (issue.option === 'band' && input.band === undefined)
    return `switching band of the spec (or --band): ${issue.message}`;
  return `${FLAGS[issue.option]}: ${issue.message}`;
}

function list(raw: string): string[] {
  return raw.split(',').map((s) => s.trim());
}

function numberOption(name: string, raw: string, problems: string[]): number | undefined {
  const value = raw.trim() === '' ? Number.NaN : Number(raw);
  if (Number.isNaN(value)) {
    problems.push(`--${name} ${raw}: not a number`);
    return undefined;
  }
  return value;
}

function numberList(name: string, raw: string, problems: string[]): number[] | undefined {
  const out: number[] = [];
  for (const item of list(raw)) {
    const v = numberOption(name, item, problems);
    if (v === undefined) return undefined;
    out.push(v);
  }
  return out;
}

/** A one-line bar redrawn in place with a carriage return, at most once per percent. */
function progressBar(err: Writable, width = 30) {
  let shown = -1;
  return {
    update(done: number, total: number) {
      const percent = Math.floor((100 * done) / total);
      if (percent === shown) return;
      shown = percent;
      const filled = Math.round((width * done) / total);
      err.write(
        `\r[${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${percent} % ${done}/${total} candidates`,
      );
    },
    clear() {
      if (shown >= 0) err.write('\r\x1b[K');
    },
  };
}
