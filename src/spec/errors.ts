/**
 * Problems found at the spec boundary, as data: every problem of an input is collected, each naming
 * its field path, the offending value and the allowed range. Plus the typed error of the preset loader.
 */
import type { z } from 'zod';

/** One problem with one field. `path` is dotted (`input.min`, `switching.max`); '' means the whole document. */
export interface SpecIssue {
  path: string;
  message: string;
}

/** One issue per line, as a CLI prints them. */
export function formatIssues(issues: readonly SpecIssue[]): string {
  return issues.map((issue) => issue.message).join('\n');
}

/** Prefix a message with its field path, the form every SpecIssue message takes. */
export function issueAt(path: string, text: string): SpecIssue {
  return { path, message: path === '' ? text : `${path}: ${text}` };
}

/** Show a raw input value the way the user wrote it. */
export function showValue(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return String(value);
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'an object';
  return String(value);
}

/**
 * Turn zod issues into SpecIssues. `allowedKeys(path)` names the fields allowed at an object path, so an
 * unknown key can be answered with the known ones. Parse with `reportInput: true` so values can be shown.
 */
export function toSpecIssues(
  issues: readonly z.core.$ZodIssue[],
  allowedKeys: (path: string) => readonly string[] = () => [],
): SpecIssue[] {
  const out: SpecIssue[] = [];
  for (const issue of issues) {
    const path = issue.path.map(String).join('.');
    switch (issue.code) {
      case 'unrecognized_keys':
        for (const key of issue.keys) {
          const allowed = allowedKeys(path);
          const hint = allowed.length > 0 ? ` (allowed: ${allowed.join(', ')})` : '';
          out.push(issueAt(path === '' ? key : `${path}.${key}`, `unknown field${hint}`));
        }
        break;
      case 'invalid_type':
        out.push(
          issueAt(
            path,
            issue.input === undefined
              ? 'is required'
              : `expected ${issue.expected}, got ${showValue(issue.input)}`,
          ),
        );
        break;
      case 'invalid_value':
        out.push(
          issueAt(path, `${showValue(issue.input)} is not one of ${issue.values.map(String).join(', ')}`),
        );
        break;
      default:
        out.push(issueAt(path, issue.message));
    }
  }
  return dedupe(out);
}

function dedupe(issues: SpecIssue[]): SpecIssue[] {
  const seen = new Set<string>();
  return issues.filter((issue) => {
    const key = `${issue.path}\u0000${issue.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** A technology preset that cannot be used: unknown name or invalid file. Carries what the caller needs. */
export class TechnologyError extends Error {
  readonly preset: string;
  readonly available: readonly string[];
  readonly issues: readonly SpecIssue[];

  constructor(
    message: string,
    details: {
      preset: string;
      available?: readonly string[];
      issues?: readonly SpecIssue[];
      cause?: unknown;
    },
  ) {
    super(message, { cause: details.cause });
    this.name = 'TechnologyError';
    this.preset = details.preset;
    this.available = details.available ?? [];
    this.issues = details.issues ?? [];
  }
}
