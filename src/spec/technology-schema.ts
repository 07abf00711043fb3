/**
 * zod schema for a technology preset (data/technology/*.json). It mirrors the Technology type of
 * src/parts/technology.ts exactly (a compile-time check below fails if they drift apart), bounds every
 * number to what the part models can use, and requires every number to be covered by a provenance entry.
 */
import { z } from 'zod';
import type { Technology } from '../parts/technology.ts';
import { type SpecIssue, toSpecIssues } from './errors.ts';
import { SPEC_LIMITS } from './limits.ts';

const positive = () => z.number().positive();
const nonNegative = () => z.number().nonnegative();
const fraction = () => z.number().positive().max(1);

/** A list of rating classes, strictly ascending in `key` so "smallest class that fits" is a scan. */
function ascendingClasses<T extends z.ZodObject>(item: T, key: string) {
  return z
    .array(item)
    .min(1)
    .superRefine((classes, ctx) => {
      for (let i = 1; i < classes.length; i++) {
        const [prev, next] = [classes[i - 1] as Record<string, number>, classes[i] as Record<string, number>];
        if (!(next[key] > prev[key])) {
          ctx.addIssue({
            code: 'custom',
            path: [i, key],
            message: `${next[key]} must be above the previous class (${prev[key]}): classes are listed in ascending ${key}`,
          });
        }
      }
    });
}

const mosfetClass = z.strictObject({
  vdsV: positive(),
  ronSpecOhmMm2: nonNegative(),
  qgSpecCPerMm2: nonNegative(),
  qswSpecCPerMm2: nonNegative(),
  qossSpecCPerMm2: nonNegative(),
});
const diodeClass = z.strictObject({
  vrV: positive(),
  vfV: nonNegative(),
  rdOhmA: nonNegative(),
  cjFPerA: nonNegative(),
});
const ceramicClass = z.strictObject({
  ratedV: positive(),
  unitF: positive(),
  esrOhm: nonNegative(),
  irmsA: positive(),
  volumeMm3: positive(),
});

/** Provenance must say where a value comes from, in one of these forms (see data/technology/README.md). */
export const PROVENANCE_KINDS = ['source:', 'common practice', 'from memory', 'definition:'] as const;

export const technologySchema = z
  .strictObject({
    name: z.string().regex(SPEC_LIMITS.technologyPattern),
    description: z.string().min(1),
    ideal: z.boolean(),
    mosfet: z.strictObject({
      classes: ascendingClasses(mosfetClass, 'vdsV'),
      minAreaMm2: positive(),
      maxAreaMm2: positive(),
      ronTempCoeffPerK: nonNegative(),
      junctionRiseK: nonNegative(),
      gateDriveV: positive(),
      gateCurrentA: positive(),
      deadTimeS: nonNegative(),
      bodyDiodeVfV: nonNegative(),
      voltageDerating: fraction(),
    }),
    diode: z.strictObject({
      classes: ascendingClasses(diodeClass, 'vrV'),
      currentMargin: z.number().min(1),
      voltageDerating: fraction(),
    }),
    inductor: z.strictObject({
      material: z.strictObject({
        name: z.string().min(1),
        k: nonNegative(),
        alpha: positive(),
        beta: positive(),
        bMaxT: positive(),
      }),
      currentDensityApm2: positive(),
      windowFill: fraction(),
      volumeCoeff: positive(),
      coreFraction: fraction(),
      copperFraction: fraction(),
      copperResistivityOhmM: nonNegative(),
      coupling: fraction(),
    }),
    capacitor: z.strictObject({
      ceramic: ascendingClasses(ceramicClass, 'ratedV'),
      dcBiasA: nonNegative(),
      voltageDerating: fraction(),
      esrShare: z.number().nonnegative().lt(1),
      maxUnits: z.number().int().min(1),
      electrolyticMm3PerUfV: positive(),
      electrolyticMinMm3: positive(),
      electrolyticEsrOhm: nonNegative(),
    }),
    sense: z.strictObject({
      thresholdV: nonNegative(),
      limitMargin: z.number().min(1),
      volumeMm3: nonNegative(),
    }),
    controller: z.strictObject({
      quiescentA: nonNegative(),
      minOnS: nonNegative(),
      minOffS: nonNegative(),
      maxDuty: fraction(),
      volumeMm3: nonNegative(),
    }),
    busMargin: z.number().nonnegative().lt(1),
    provenance: z.record(z.string(), z.string()),
  })
  .superRefine((tech, ctx) => {
    if (tech.mosfet.maxAreaMm2 < tech.mosfet.minAreaMm2) {
      ctx.addIssue({
        code: 'custom',
        path: ['mosfet', 'maxAreaMm2'],
        message: 'must be at least minAreaMm2',
      });
    }
    if (tech.inductor.coreFraction + tech.inductor.copperFraction > 1) {
      ctx.addIssue({
        code: 'custom',
        path: ['inductor', 'copperFraction'],
        message: 'coreFraction + copperFraction must not exceed 1 (they share one box volume)',
      });
    }
    for (const issue of checkProvenance(tech)) ctx.addIssue({ code: 'custom', ...issue });
  });

// Compile-time mirror check: this line stops compiling if the schema and the Technology type drift apart.
type Same<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
export const SCHEMA_MIRRORS_TECHNOLOGY: Same<z.output<typeof technologySchema>, Technology> = true;

/** Dotted paths of every number in a preset (array items collapse to their list: mosfet.classes). */
export function numericPaths(value: unknown, prefix = ''): string[] {
  if (typeof value === 'number') return [prefix];
  if (Array.isArray(value)) return [...new Set(value.flatMap((item) => numericPaths(item, prefix)))];
  if (typeof value !== 'object' || value === null) return [];
  return Object.entries(value).flatMap(([key, item]) =>
    key === 'provenance' && prefix === '' ? [] : numericPaths(item, prefix === '' ? key : `${prefix}.${key}`),
  );
}

/** Every number covered by a provenance key (itself or a group above it); every key real and well-formed. */
function checkProvenance(tech: Technology): { path: string[]; message: string }[] {
  const issues: { path: string[]; message: string }[] = [];
  const keys = Object.keys(tech.provenance);
  const paths = numericPaths(tech);
  const covers = (key: string, path: string) => path === key || path.startsWith(`${key}.`);
  for (const path of paths) {
    if (!keys.some((key) => covers(key, path)))
      issues.push({ path: ['provenance'], message: `no entry covers ${path}` });
  }
  for (const key of keys) {
    if (!paths.some((path) => covers(key, path))) {
      issues.push({ path: ['provenance', key], message: 'names no number of this preset' });
    }
    const text = tech.provenance[key].trim();
    if (!PROVENANCE_KINDS.some((kind) => text.startsWith(kind))) {
      issues.push({
        path: ['provenance', key],
        message: `must start with one of: ${PROVENANCE_KINDS.join(', ')}`,
      });
    }
  }
  return issues;
}

export type TechnologyResult = { ok: true; technology: Technology } | { ok: false; issues: SpecIssue[] };

/** Validate a parsed preset document. */
export function parseTechnology(input: unknown): TechnologyResult {
  const result = technologySchema.safeParse(input, { reportInput: true });
  if (result.success) return { ok: true, technology: result.data };
  return { ok: false, issues: toSpecIssues(result.error.issues) };
}
