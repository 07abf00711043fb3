/**
 * The spec in a URL: `s` = base64url of the deflated compact JSON of the form text, an array with one
 * entry per form field in FIELD_PATHS order (append-only, so old links keep working), so every page is
 * bookmarkable and what the user typed survives the round trip (the demo spec is about 200 characters). A spec can also come as plain
 * query fields (`/study?input.min=10&input.nom=12.8&...`), from a demo file, or from a form body.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { deflateRawSync, inflateRawSync } from 'node:zlib';
import { parse as parseYaml } from 'yaml';
import type { SpecIssue } from '../spec/errors.ts';
import { listTechnologies } from '../spec/load.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { parseRailSpec } from '../spec/schema.ts';
import { WebError } from './errors.ts';
import {
  cleanFormValues,
  documentFromFormValues,
  FIELD_PATHS,
  type FormValues,
  formValuesFromDocument,
} from './spec-fields.ts';

/** Longest accepted encoded spec (characters): a full form is about 600. */
export const MAX_ENCODED_SPEC = 4096;

/** Largest inflated spec accepted (bytes), so a crafted link cannot inflate into megabytes. */
const MAX_INFLATED_SPEC = 16 * 1024;

export function encodeSpec(values: FormValues): string {
  const clean = cleanFormValues(values);
  const list = FIELD_PATHS.map((path) => clean[path] ?? '');
  while (list.length > 0 && list[list.length - 1] === '') list.pop();
  return deflateRawSync(Buffer.from(JSON.stringify(list), 'utf8')).toString('base64url');
}

export function decodeSpec(encoded: string): FormValues {
  if (encoded.length > MAX_ENCODED_SPEC || !/^[A-Za-z0-9_-]*$/.test(encoded)) {
    throw new WebError(400, 'The spec in this link is damaged (not base64url, or too long).');
  }
  let doc: unknown;
  try {
    const inflated = inflateRawSync(Buffer.from(encoded, 'base64url'), {
      maxOutputLength: MAX_INFLATED_SPEC,
    });
    doc = JSON.parse(inflated.toString('utf8'));
  } catch (cause) {
    throw new WebError(400, 'The spec in this link is damaged (it does not decode).', { cause });
  }
  if (!Array.isArray(doc) || doc.length > FIELD_PATHS.length) {
    throw new WebError(400, 'The spec in this link is damaged (not a list of fields).');
  }
  return cleanFormValues(Object.fromEntries(doc.map((v, i) => [FIELD_PATHS[i], v])));
}

const SPEC_DIR = new URL('../../data/specs/', import.meta.url);

/** The demo scenarios shipped in data/specs/, by file stem. */
export const DEMO_SPECS = [
  'marine-lifepo4-12v',
  'usb-pd-bench-tool-12v',
  'vehicle-bus-cold-crank-12v',
  'industrial-24v-negative-12v',
] as const;
export const DEFAULT_DEMO = 'marine-lifepo4-12v';

const demoCache = new Map<string, FormValues>();

/** Form text of a demo scenario, as its YAML file writes it. */
export function demoFormValues(name: string): FormValues {
  const cached = demoCache.get(name);
  if (cached) return cached;
  if (!(DEMO_SPECS as readonly string[]).includes(name)) {
    throw new WebError(404, `No demo scenario named "${name}".`);
  }
  const text = readFileSync(fileURLToPath(new URL(`${name}.yaml`, SPEC_DIR)), 'utf8');
  const values = formValuesFromDocument(parseYaml(text) as Record<string, unknown>);
  demoCache.set(name, values);
  return values;
}

/**
 * The form text a GET request carries: `s`, else plain field parameters, else `demo`, else the default
 * demo. Never throws for bad values (those are issues); throws WebError 400 for a damaged `s`.
 */
export function formValuesFromQuery(query: Record<string, string>): FormValues {
  if (query.s !== undefined) return decodeSpec(query.s);
  if (FIELD_PATHS.some((path) => query[path] !== undefined)) return cleanFormValues(query);
  return demoFormValues(query.demo ?? DEFAULT_DEMO);
}

export type SpecCheck =
  | { ok: true; spec: RailSpec; values: FormValues }
  | { ok: false; issues: SpecIssue[]; values: FormValues };

/** Validate form text with the spec schema, and the technology name against the presets on disk. */
export function checkFormValues(values: FormValues): SpecCheck {
  const result = parseRailSpec(documentFromFormValues(values));
  const issues: SpecIssue[] = result.ok ? [] : [...result.issues];
  const technology = values.technology;
  const available = listTechnologies();
  if (
    technology !== undefined &&
    !issues.some((i) => i.path === 'technology') &&
    !available.includes(technology)
  ) {
    issues.push({
      path: 'technology',
      message: `technology: no preset named "${technology}" (available: ${available.join(', ')})`,
    });
  }
  if (issues.length > 0 || !result.ok) return { ok: false, issues, values };
  return { ok: true, spec: result.spec, values };
}

/** A message without its leading "path: ", for showing beside the field it belongs to. */
export function messageBesideField(issue: SpecIssue): string {
  const prefix = `${issue.path}: `;
  return issue.path !== '' && issue.message.startsWith(prefix)
    ? issue.message.slice(prefix.length)
    : issue.message;
}
