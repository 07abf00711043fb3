/**
 * The rail-spec boundary: YAML/JSON/form input → RailSpec (SI units, defaults applied).
 * Every problem is collected, never just the first: field checks live in each quantity, cross-field
 * checks run even when other fields failed (they only look at fields that parsed), and unknown keys
 * are reported beside them. Limits and defaults come from SPEC_LIMITS / SPEC_DEFAULTS.
 */
import { z } from 'zod';
import { formatSiShort } from '../units/format.ts';
import { issueAt, type SpecIssue, showValue, toSpecIssues } from './errors.ts';
import { SPEC_DEFAULTS, SPEC_LIMITS } from './limits.ts';
import { optionalQuantity, quantity } from './quantity-schema.ts';
import type { Polarity, RailSpec } from './rail-spec.ts';

/** A quantity as written: a number in SI or an engineering-notation string ('50 mV', '500k'). */
export type QuantityInput = number | string;

/** The input format, as a YAML file or a form writes it. Scalars are shorthands (see each field). */
export interface RailSpecInput {
  name?: string;
  /** A single value means one input voltage (min = nom = max). */
  input: QuantityInput | { min: QuantityInput; nom: QuantityInput; max: QuantityInput };
  /** A negative voltage implies negative polarity unless polarity says 'either'. */
  output: { voltage: QuantityInput; polarity?: Polarity };
  /** A single value is the maximum; min defaults to 10 % of max. */
  load: QuantityInput | { max: QuantityInput; min?: QuantityInput; ccm?: boolean };
  /** A single value is the output ripple (V peak-to-peak). */
  ripple: QuantityInput | { output: QuantityInput; input?: QuantityInput };
  /** A single value fixes the switching frequency. */
  switching: QuantityInput | { min: QuantityInput; max: QuantityInput };
  ambient?: QuantityInput;
  technology?: string;
  step?: { from: QuantityInput; to: QuantityInput; rise: QuantityInput };
}

export const POLARITIES = ['positive', 'negative', 'either'] as const satisfies readonly Polarity[];

const L = SPEC_LIMITS;
const inputVoltage = () => quantity('V', L.inputV);

const inputObject = z.strictObject({ min: inputVoltage(), nom: inputVoltage(), max: inputVoltage() });
const outputObject = z.strictObject({
  voltage: quantity('V', { ...L.outputV, magnitude: true }),
  polarity: z.enum(POLARITIES).optional(),
});
const loadObject = z.strictObject({
  max: quantity('A', { above: 0, max: L.loadA.max }),
  min: optionalQuantity('A', { min: 0, max: L.loadA.max }),
  ccm: z.boolean().optional(),
});
const rippleObject = z.strictObject({
  output: quantity('V', { above: 0 }),
  input: optionalQuantity('V', { above: 0 }),
});
const switchingObject = z.strictObject({
  min: quantity('Hz', { ...L.switchingHz, noun: 'band' }),
  max: quantity('Hz', { ...L.switchingHz, noun: 'band' }),
});
const stepObject = z.strictObject({
  from: inputVoltage(),
  to: inputVoltage(),
  rise: quantity('s', { above: 0, max: L.stepRiseS.max }),
});

const isScalar = (raw: unknown): raw is QuantityInput => typeof raw === 'number' || typeof raw === 'string';
/** Accept a scalar shorthand for an object section. */
const scalarOr = <T extends z.ZodType>(toObject: (raw: QuantityInput) => object, schema: T) =>
  z.preprocess((raw) => (isScalar(raw) ? toObject(raw) : raw), schema);

const shape = {
  name: z.string().trim().min(1, 'must not be empty').max(L.nameLength).optional(),
  input: scalarOr((v) => ({ min: v, nom: v, max: v }), inputObject),
  output: outputObject,
  load: scalarOr((v) => ({ max: v }), loadObject),
  ripple: scalarOr((v) => ({ output: v }), rippleObject),
  switching: scalarOr((v) => ({ min: v, max: v }), switchingObject),
  ambient: optionalQuantity('°C', L.ambientC),
  technology: z
    .string()
    .regex(L.technologyPattern, {
      error: (issue) =>
        `${showValue(issue.input)} is not a preset name (lower-case letters, digits, hyphens)`,
    })
    .optional(),
  step: stepObject.optional(),
};

/** Field names allowed at each object path, for "unknown field" messages. */
const ALLOWED_KEYS: Readonly<Record<string, readonly string[]>> = {
  '': Object.keys(shape),
  input: Object.keys(inputObject.shape),
  output: Object.keys(outputObject.shape),
  load: Object.keys(loadObject.shape),
  ripple: Object.keys(rippleObject.shape),
  switching: Object.keys(switchingObject.shape),
  step: Object.keys(stepObject.shape),
};

type Parsed = z.output<z.ZodObject<typeof shape>>;
type AddIssue = (path: string, message: string) => void;

/** Read a field that parsed as a finite number; anything else already carries its own issue. */
function num(section: unknown, key: string): number | undefined {
  if (typeof section !== 'object' || section === null) return undefined;
  const value = (section as Record<string, unknown>)[key];
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}

const v = (x: number) => formatSiShort(x, 'V');

/** Checks that relate two fields. Each runs only when both of its fields parsed. */
function checkCrossFields(spec: Partial<Record<keyof Parsed, unknown>>, add: AddIssue): void {
  const [inMin, inNom, inMax] = [num(spec.input, 'min'), num(spec.input, 'nom'), num(spec.input, 'max')];
  if (inMin !== undefined && inMax !== undefined && inMin > inMax) {
    add('input.min', `${v(inMin)} is above input.max (${v(inMax)})`);
  }
  if (inNom !== undefined && inMin !== undefined && inNom < inMin) {
    add('input.nom', `${v(inNom)} is below input.min (${v(inMin)})`);
  }
  if (inNom !== undefined && inMax !== undefined && inNom > inMax) {
    add('input.nom', `${v(inNom)} is above input.max (${v(inMax)})`);
  }

  const vout = num(spec.output, 'voltage');
  const polarity = (spec.output as { polarity?: unknown } | undefined)?.polarity;
  if (vout !== undefined && vout < 0 && polarity === 'positive') {
    add(
      'output.polarity',
      `positive contradicts output.voltage ${v(vout)}; give a positive voltage or drop polarity`,
    );
  }

  const [loadMin, loadMax] = [num(spec.load, 'min'), num(spec.load, 'max')];
  if (loadMin !== undefined && loadMax !== undefined && loadMin > loadMax) {
    const a = (x: number) => formatSiShort(x, 'A');
    add('load.min', `${a(loadMin)} is above load.max (${a(loadMax)})`);
  }

  const rippleOut = num(spec.ripple, 'output');
  if (rippleOut !== undefined && vout !== undefined && rippleOut >= Math.abs(vout)) {
    add('ripple.output', `${v(rippleOut)} must be below the output voltage (${v(Math.abs(vout))})`);
  }
  const rippleIn = num(spec.ripple, 'input');
  if (rippleIn !== undefined && inMin !== undefined && rippleIn >= inMin) {
    add('ripple.input', `${v(rippleIn)} must be below input.min (${v(inMin)})`);
  }

  const [fMin, fMax] = [num(spec.switching, 'min'), num(spec.switching, 'max')];
  if (fMin !== undefined && fMax !== undefined && fMin > fMax) {
    const hz = (x: number) => formatSiShort(x, 'Hz');
    add('switching.min', `${hz(fMin)} is above switching.max (${hz(fMax)})`);
  }

  const [stepFrom, stepTo] = [num(spec.step, 'from'), num(spec.step, 'to')];
  if (stepFrom !== undefined && stepTo !== undefined && stepFrom === stepTo) {
    add('step.to', `${v(stepTo)} equals step.from: a step must change the input`);
  }
}

function toRailSpec(parsed: Parsed): RailSpec {
  const voltage = parsed.output.voltage;
  const polarity: Polarity = parsed.output.polarity ?? (voltage < 0 ? 'negative' : 'positive');
  const spec: RailSpec = {
    name: parsed.name ?? SPEC_DEFAULTS.name,
    input: { minV: parsed.input.min, nomV: parsed.input.nom, maxV: parsed.input.max },
    output: { voltageV: Math.abs(voltage), polarity },
    load: {
      maxA: parsed.load.max,
      minA: parsed.load.min ?? SPEC_DEFAULTS.loadMinFraction * parsed.load.max,
      ccmRequired: parsed.load.ccm ?? false,
    },
    ripple: { outputVpp: parsed.ripple.output },
    switching: { minHz: parsed.switching.min, maxHz: parsed.switching.max },
    ambientC: parsed.ambient ?? SPEC_DEFAULTS.ambientC,
    technology: parsed.technology ?? SPEC_DEFAULTS.technology,
  };
  if (parsed.ripple.input !== undefined) spec.ripple.inputVpp = parsed.ripple.input;
  if (parsed.step) spec.step = { fromV: parsed.step.from, toV: parsed.step.to, riseS: parsed.step.rise };
  return spec;
}

/** The zod schema: rail-spec input in, RailSpec out. */
export const railSpecSchema = z
  .strictObject(shape)
  .superRefine(
    (value, ctx) => {
      if (typeof value !== 'object' || value === null) return;
      checkCrossFields(value, (path, message) =>
        ctx.addIssue({ code: 'custom', path: path.split('.'), message, input: undefined }),
      );
    },
    // Run even when some fields failed, so the user sees every problem at once.
    { when: () => true },
  )
  .transform(toRailSpec);

export type RailSpecResult = { ok: true; spec: RailSpec } | { ok: false; issues: SpecIssue[] };

/** Parse and validate a rail spec from any source (parsed YAML/JSON, form fields). */
export function parseRailSpec(input: unknown): RailSpecResult {
  if (typeof input !== 'object' || input === null || Array.isArray(input)) {
    return {
      ok: false,
      issues: [issueAt('', `a rail spec must be an object of fields, got ${showValue(input)}`)],
    };
  }
  const result = railSpecSchema.safeParse(input, { reportInput: true });
  if (result.success) return { ok: true, spec: result.data };
  const scalarInput = isScalar((input as { input?: unknown }).input);
  // A scalar input voltage fans out to min/nom/max; report its problem once, at `input`.
  const issues = result.error.issues.map((issue) =>
    scalarInput && issue.path[0] === 'input' && issue.path.length === 2
      ? { ...issue, path: ['input'] }
      : issue,
  );
  return { ok: false, issues: toSpecIssues(issues, (path) => ALLOWED_KEYS[path] ?? []) };
}
