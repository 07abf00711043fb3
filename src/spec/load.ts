/**
 * The file edge of the spec boundary: rail specs from YAML/JSON text or files, technology presets from
 * data/technology/<name>.json. Everything here may touch the file system; the engine never imports it.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parse as parseYaml, YAMLParseError } from 'yaml';
import type { Technology } from '../parts/technology.ts';
import { issueAt, TechnologyError } from './errors.ts';
import { SPEC_LIMITS } from './limits.ts';
import { parseRailSpec, type RailSpecResult } from './schema.ts';
import { parseTechnology } from './technology-schema.ts';

const TECHNOLOGY_DIR = new URL('../../data/technology/', import.meta.url);

/**
 * Parse a rail spec written as YAML or JSON (JSON is YAML), then validate it. Syntax errors come back as
 * issues like any other problem; so does a technology name with no preset behind it.
 */
export function loadSpecText(text: string, filename?: string): RailSpecResult {
  const where = filename === undefined ? '' : `${filename}: `;
  let document: unknown;
  try {
    document = parseYaml(text);
  } catch (error) {
    const line = error instanceof YAMLParseError && error.linePos ? ` (line ${error.linePos[0].line})` : '';
    const reason = error instanceof Error ? error.message.split('\n')[0] : String(error);
    return { ok: false, issues: [issueAt('', `${where}not valid YAML or JSON${line}: ${reason}`)] };
  }
  const result = parseRailSpec(document);
  const technology = result.ok ? result.spec.technology : undefined;
  if (technology !== undefined && !listTechnologies().includes(technology)) {
    const available = listTechnologies().join(', ');
    return {
      ok: false,
      issues: [issueAt('technology', `no preset named "${technology}" (available: ${available})`)],
    };
  }
  return result;
}

/** Read and validate a rail-spec file (.yaml, .yml or .json). */
export function loadSpecFile(path: string): RailSpecResult {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return { ok: false, issues: [issueAt('', `cannot read ${path}: ${reason}`)] };
  }
  return loadSpecText(text, path);
}

/** Names of the presets in data/technology/, sorted. */
export function listTechnologies(): string[] {
  return readdirSync(TECHNOLOGY_DIR)
    .filter((file) => file.endsWith('.json'))
    .map((file) => file.slice(0, -'.json'.length))
    .sort();
}

const cache = new Map<string, Technology>();

/**
 * Load a validated technology preset by name (cached). Throws TechnologyError for an unknown name
 * (listing the available presets) or an invalid file (with every issue).
 */
export function loadTechnology(name: string): Technology {
  const cached = cache.get(name);
  if (cached) return cached;
  const available = listTechnologies();
  // The pattern check also keeps the name from walking out of the preset folder.
  if (!SPEC_LIMITS.technologyPattern.test(name) || !available.includes(name)) {
    throw new TechnologyError(`unknown technology preset "${name}"; available: ${available.join(', ')}`, {
      preset: name,
      available,
    });
  }
  const file = fileURLToPath(new URL(`${name}.json`, TECHNOLOGY_DIR));
  let document: unknown;
  try {
    document = JSON.parse(readFileSync(file, 'utf8'));
  } catch (cause) {
    throw new TechnologyError(`technology preset "${name}" is not readable JSON`, {
      preset: name,
      available,
      cause,
    });
  }
  const result = parseTechnology(document);
  if (!result.ok) {
    const list = result.issues.map((issue) => `  ${issue.message}`).join('\n');
    throw new TechnologyError(`technology preset "${name}" is invalid:\n${list}`, {
      preset: name,
      available,
      issues: result.issues,
    });
  }
  if (result.technology.name !== name) {
    throw new TechnologyError(
      `technology preset file "${name}.json" declares name "${result.technology.name}"`,
      {
        preset: name,
        available,
      },
    );
  }
  // Frozen: every caller shares the cached object, so a stray write must fail loudly instead of leaking.
  const technology = deepFreeze(result.technology);
  cache.set(name, technology);
  return technology;
}

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null) {
    for (const item of Object.values(value)) deepFreeze(item);
    Object.freeze(value);
  }
  return value;
}
