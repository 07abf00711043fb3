import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatIssues, type SpecIssue } from '../../src/spec/errors.ts';
import { SPEC_DEFAULTS, SPEC_LIMITS } from '../../src/spec/limits.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { parseRailSpec } from '../../src/spec/schema.ts';

/** The marine demo rail, written the way a YAML file would give it. */
function marine(): Record<string, unknown> {
  return {
    name: 'Marine instrument 12 V rail',
    input: { min: 10, nom: 12.8, max: 14.6 },
    output: { voltage: 12, polarity: 'positive' },
    load: { max: 2, min: 0.2 },
    ripple: { output: '50m', input: '200 mV' },
    switching: { min: '100k', max: '1 MHz' },
    ambient: 40,
    technology: 'default',
    step: { from: 12, to: 18, rise: '1u' },
  };
}

function specOf(input: unknown): RailSpec {
  const result = parseRailSpec(input);
  if (!result.ok) throw new Error(`expected a valid spec, got:\n${formatIssues(result.issues)}`);
  return result.spec;
}

function issuesOf(input: unknown): SpecIssue[] {
  const result = parseRailSpec(input);
  if (result.ok) throw new Error('expected the spec to be rejected');
  return result.issues;
}

/** The single issue at `path`; fails if there is none or more than one. */
function issueAt(input: unknown, path: string): string {
  const found = issuesOf(input).filter((issue) => issue.path === path);
  expect(found, `issues at ${path}`).toHaveLength(1);
  return found[0].message;
}

const with_ = (patch: Record<string, unknown>) => ({ ...marine(), ...patch });

describe('parseRailSpec: accepted input', () => {
  it('turns the demo rail into SI units', () => {
    expect(specOf(marine())).toEqual({
      name: 'Marine instrument 12 V rail',
      input: { minV: 10, nomV: 12.8, maxV: 14.6 },
      output: { voltageV: 12, polarity: 'positive' },
      load: { maxA: 2, minA: 0.2, ccmRequired: false },
      ripple: { outputVpp: 0.05, inputVpp: 0.2 },
      switching: { minHz: 100e3, maxHz: 1e6 },
      ambientC: 40,
      technology: 'default',
      step: { fromV: 12, toV: 18, riseS: 1e-6 },
    } satisfies RailSpec);
  });

  it('reads engineering notation with or without the unit in every field', () => {
    const spec = specOf({
      input: { min: '10 V', nom: '12.8', max: 14.6 },
      output: { voltage: '12V' },
      load: { max: '2 A', min: '200m' },
      ripple: { output: '50 mV' },
      switching: { min: '100 kHz', max: '1M' },
      ambient: '40 °C',
      step: { from: '12 V', to: '18', rise: '1 µs' },
    });
    expect(spec.input).toEqual({ minV: 10, nomV: 12.8, maxV: 14.6 });
    expect(spec.load).toEqual({ maxA: 2, minA: 0.2, ccmRequired: false });
    expect(spec.switching).toEqual({ minHz: 100e3, maxHz: 1e6 });
    expect(spec.step).toEqual({ fromV: 12, toV: 18, riseS: 1e-6 });
    expect(spec.ambientC).toBe(40);
  });

  it('applies the defaults: name, min load 10 % of max, 25 °C, default technology, no input ripple or step', () => {
    const spec = specOf({ input: 24, output: { voltage: 5 }, load: 3, ripple: '20m', switching: '400k' });
    expect(spec.name).toBe(SPEC_DEFAULTS.name);
    expect(spec.input).toEqual({ minV: 24, nomV: 24, maxV: 24 });
    expect(spec.load).toEqual({ maxA: 3, minA: 0.1 * 3, ccmRequired: false });
    expect(spec.ripple).toEqual({ outputVpp: 0.02 });
    expect(spec.switching).toEqual({ minHz: 400e3, maxHz: 400e3 });
    expect(spec.ambientC).toBe(25);
    expect(spec.technology).toBe('default');
    expect(spec).not.toHaveProperty('step');
    expect(spec.ripple).not.toHaveProperty('inputVpp');
  });

  it('treats a blank optional field (an empty form input) as absent', () => {
    const spec = specOf(
      with_({ ambient: '', load: { max: 2, min: ' ' }, ripple: { output: '50m', input: '' } }),
    );
    expect(spec.ambientC).toBe(SPEC_DEFAULTS.ambientC);
    expect(spec.load.minA).toBe(0.2);
    expect(spec.ripple).toEqual({ outputVpp: 0.05 });
  });

  it('still requires a blank required field', () => {
    expect(issueAt(with_({ output: { voltage: '' } }), 'output.voltage')).toBe('output.voltage: empty value');
  });

  it('passes ccm: true through as a requirement', () => {
    expect(specOf(with_({ load: { max: 2, ccm: true } })).load.ccmRequired).toBe(true);
  });

  it('reads a negative output voltage as negative polarity, magnitude positive', () => {
    expect(specOf(with_({ output: { voltage: '-12 V' } })).output).toEqual({
      voltageV: 12,
      polarity: 'negative',
    });
    expect(specOf(with_({ output: { voltage: -12, polarity: 'negative' } })).output).toEqual({
      voltageV: 12,
      polarity: 'negative',
    });
  });

  it('lets polarity say which sign is wanted for a positive voltage, and accepts either', () => {
    expect(specOf(with_({ output: { voltage: 12, polarity: 'negative' } })).output.polarity).toBe('negative');
    expect(specOf(with_({ output: { voltage: 12, polarity: 'either' } })).output.polarity).toBe('either');
    expect(specOf(with_({ output: { voltage: -12, polarity: 'either' } })).output).toEqual({
      voltageV: 12,
      polarity: 'either',
    });
  });

  it('accepts the limits themselves (they are inclusive)', () => {
    const spec = specOf(
      with_({
        input: { min: SPEC_LIMITS.inputV.min, nom: 12, max: SPEC_LIMITS.inputV.max },
        output: { voltage: SPEC_LIMITS.outputV.max },
        load: { max: SPEC_LIMITS.loadA.max, min: 0 },
        switching: { min: SPEC_LIMITS.switchingHz.min, max: SPEC_LIMITS.switchingHz.max },
        ambient: SPEC_LIMITS.ambientC.min,
        ripple: { output: 1 },
      }),
    );
    expect(spec.switching).toEqual({ minHz: 10e3, maxHz: 10e6 });
    expect(spec.load.minA).toBe(0);
  });

  it('accepts any in-range spec and keeps its numbers', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.5, max: 1000, noNaN: true }), { minLength: 3, maxLength: 3 }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.double({ min: 1e-3, max: 1000, noNaN: true }),
        fc.array(fc.double({ min: 10e3, max: 10e6, noNaN: true }), { minLength: 2, maxLength: 2 }),
        (volts, vout, loadA, band) => {
          const [min, nom, max] = [...volts].sort((a, b) => a - b);
          const [fMin, fMax] = [...band].sort((a, b) => a - b);
          const spec = specOf({
            input: { min, nom, max },
            output: { voltage: -vout },
            load: loadA,
            ripple: vout / 100,
            switching: { min: fMin, max: fMax },
          });
          expect(spec.input).toEqual({ minV: min, nomV: nom, maxV: max });
          expect(spec.output).toEqual({ voltageV: vout, polarity: 'negative' });
          expect(spec.switching).toEqual({ minHz: fMin, maxHz: fMax });
        },
      ),
    );
  });
});

describe('parseRailSpec: rejected input, one issue per problem, each naming field, value and limit', () => {
  it('input.min above input.max', () => {
    expect(issueAt(with_({ input: { min: 20, nom: 12.8, max: 14.6 } }), 'input.min')).toBe(
      'input.min: 20 V is above input.max (14.6 V)',
    );
  });

  it('input.nom outside min…max', () => {
    expect(issueAt(with_({ input: { min: 10, nom: 9, max: 14.6 } }), 'input.nom')).toBe(
      'input.nom: 9 V is below input.min (10 V)',
    );
    expect(issueAt(with_({ input: { min: 10, nom: 15, max: 14.6 } }), 'input.nom')).toBe(
      'input.nom: 15 V is above input.max (14.6 V)',
    );
  });

  it('input voltages outside 0.5 V–1000 V', () => {
    expect(issueAt(with_({ input: { min: 0.4, nom: 12, max: 14 } }), 'input.min')).toMatch(
      /^input\.min: 400 mV is outside the allowed range 500 mV–1 kV$/,
    );
    expect(issueAt(with_({ input: { min: 10, nom: 12, max: '1.2 kV' } }), 'input.max')).toMatch(/1\.2 kV/);
  });

  it('a 1 MV output, or one too small to regulate', () => {
    expect(issueAt(with_({ output: { voltage: '1 MV' } }), 'output.voltage')).toBe(
      'output.voltage: 1 MV is outside the allowed magnitude range 500 mV–1 kV',
    );
    expect(issueAt(with_({ output: { voltage: '-12 kV' } }), 'output.voltage')).toMatch(/-12 kV is outside/);
    expect(issueAt(with_({ output: { voltage: 0 } }), 'output.voltage')).toMatch(/0 V is outside/);
  });

  it('zero or negative load', () => {
    expect(issueAt(with_({ load: { max: 0 } }), 'load.max')).toBe('load.max: 0 A must be greater than 0 A');
    expect(issueAt(with_({ load: -2 }), 'load.max')).toBe('load.max: -2 A must be greater than 0 A');
    expect(issueAt(with_({ load: { max: 2, min: -0.1 } }), 'load.min')).toMatch(
      /-100 mA is outside the allowed range 0 A–1 kA/,
    );
  });

  it('load above 1000 A, and minimum load above maximum', () => {
    expect(issueAt(with_({ load: { max: '2 kA' } }), 'load.max')).toMatch(/2 kA is above the maximum 1 kA/);
    expect(issueAt(with_({ load: { max: 2, min: 3 } }), 'load.min')).toBe(
      'load.min: 3 A is above load.max (2 A)',
    );
  });

  it('NaN and infinities', () => {
    expect(issueAt(with_({ load: { max: Number.NaN } }), 'load.max')).toBe('load.max: NaN is not a number');
    expect(issueAt(with_({ ambient: Number.POSITIVE_INFINITY }), 'ambient')).toMatch(/not a finite number/);
    expect(issueAt(with_({ ripple: { output: 'NaN' } }), 'ripple.output')).toMatch(
      /does not start with a number/,
    );
  });

  it('an unknown unit or prefix, or the wrong unit', () => {
    expect(issueAt(with_({ switching: { min: '100 KHz', max: '1M' } }), 'switching.min')).toMatch(
      /unknown prefix 'K'/,
    );
    expect(issueAt(with_({ ripple: { output: '50 mA' } }), 'ripple.output')).toMatch(
      /wrong unit 'A': expected V/,
    );
    expect(issueAt(with_({ output: { voltage: '12 furlongs' } }), 'output.voltage')).toMatch(/unknown/);
  });

  it('a switching band outside 10 kHz–10 MHz, or upside down', () => {
    expect(issueAt(with_({ switching: { min: '5k', max: '1M' } }), 'switching.min')).toBe(
      'switching.min: 5 kHz is outside the allowed band 10 kHz–10 MHz',
    );
    expect(issueAt(with_({ switching: { min: '100k', max: '20 MHz' } }), 'switching.max')).toBe(
      'switching.max: 20 MHz is outside the allowed band 10 kHz–10 MHz',
    );
    expect(issueAt(with_({ switching: { min: '1M', max: '100k' } }), 'switching.min')).toBe(
      'switching.min: 1 MHz is above switching.max (100 kHz)',
    );
  });

  it('ripple that is not positive or not below the output (or input) voltage', () => {
    expect(issueAt(with_({ ripple: 0 }), 'ripple.output')).toBe(
      'ripple.output: 0 V must be greater than 0 V',
    );
    expect(issueAt(with_({ ripple: 12 }), 'ripple.output')).toBe(
      'ripple.output: 12 V must be below the output voltage (12 V)',
    );
    expect(issueAt(with_({ ripple: { output: '50m', input: 10 } }), 'ripple.input')).toBe(
      'ripple.input: 10 V must be below input.min (10 V)',
    );
  });

  it('an ambient outside −55…125 °C', () => {
    expect(issueAt(with_({ ambient: -60 }), 'ambient')).toBe(
      'ambient: -60 °C is outside the allowed range -55 °C to 125 °C',
    );
    expect(issueAt(with_({ ambient: '130 C' }), 'ambient')).toMatch(/130 °C is outside/);
  });

  it('a contradictory polarity, or one not in the list', () => {
    expect(issueAt(with_({ output: { voltage: -12, polarity: 'positive' } }), 'output.polarity')).toMatch(
      /^output\.polarity: positive contradicts output\.voltage -12 V/,
    );
    expect(issueAt(with_({ output: { voltage: 12, polarity: 'sideways' } }), 'output.polarity')).toBe(
      'output.polarity: "sideways" is not one of positive, negative, either',
    );
  });

  it('a technology name that cannot be a preset file name', () => {
    expect(issueAt(with_({ technology: '../secret' }), 'technology')).toMatch(/is not a preset name/);
    expect(issueAt(with_({ technology: 'Default' }), 'technology')).toMatch(/"Default"/);
  });

  it('a step with a non-positive rise time or no change', () => {
    expect(issueAt(with_({ step: { from: 12, to: 18, rise: 0 } }), 'step.rise')).toMatch(
      /must be greater than 0 s/,
    );
    expect(issueAt(with_({ step: { from: 12, to: 12, rise: '1u' } }), 'step.to')).toMatch(
      /equals step\.from/,
    );
  });

  it('unknown keys at any level, naming the allowed ones', () => {
    expect(issueAt(with_({ colour: 'red' }), 'colour')).toMatch(
      /^colour: unknown field \(allowed: name, input,/,
    );
    expect(issueAt(with_({ output: { voltage: 12, volts: 12 } }), 'output.volts')).toBe(
      'output.volts: unknown field (allowed: voltage, polarity)',
    );
  });

  it('missing required sections and fields', () => {
    const paths = issuesOf({ name: 'x' }).map((issue) => issue.path);
    expect(paths.sort()).toEqual(['input', 'load', 'output', 'ripple', 'switching']);
    expect(issueAt(with_({ input: { min: 10, max: 14 } }), 'input.nom')).toBe('input.nom: is required');
  });

  it('values of the wrong type', () => {
    expect(issueAt(with_({ load: { max: true } }), 'load.max')).toMatch(/expected a number or a value like/);
    expect(issueAt(with_({ name: 42 }), 'name')).toMatch(/expected string, got 42/);
    expect(issueAt(with_({ load: { max: 2, ccm: 'yes' } }), 'load.ccm')).toMatch(/expected boolean/);
  });

  it('a scalar input voltage problem once, at input', () => {
    const issues = issuesOf(with_({ input: 'twelve' }));
    expect(issues).toEqual([{ path: 'input', message: 'input: "twelve" does not start with a number' }]);
  });

  it('a document that is not an object', () => {
    for (const input of [null, 12, 'input: 12', [marine()]]) {
      expect(issuesOf(input)).toEqual([{ path: '', message: expect.stringMatching(/must be an object/) }]);
    }
  });

  it('reports every problem of a spec with many, each with its field name', () => {
    const issues = issuesOf({
      name: 'Everything wrong',
      input: { min: 20, nom: 'abc', max: 14.6 },
      output: { voltage: '1 MV', polarity: 'sideways', colour: 'blue' },
      load: { max: -1, min: Number.NaN },
      ripple: { output: 0 },
      switching: { min: '5k', max: '20 MHz' },
      ambient: '200 C',
      technology: 'Not A Preset',
      step: { from: 12 },
      extra: true,
    });
    expect(issues.map((issue) => issue.path).sort()).toEqual(
      [
        'input.min', // above input.max (cross-field check still runs although input.nom failed)
        'input.nom', // not a number
        'output.voltage', // 1 MV
        'output.polarity', // not in the enum
        'output.colour', // unknown key
        'load.max', // negative
        'load.min', // NaN
        'ripple.output', // zero
        'switching.min', // below the band
        'switching.max', // above the band
        'ambient', // above 125 °C
        'technology', // not a preset name
        'step.to', // missing
        'step.rise', // missing
        'extra', // unknown key
      ].sort(),
    );
    for (const issue of issues) expect(issue.message.startsWith(`${issue.path}: `)).toBe(true);
    expect(formatIssues(issues).split('\n')).toHaveLength(issues.length);
  });

  it('reports every out-of-range input voltage it is given', () => {
    fc.assert(
      fc.property(
        fc.oneof(fc.double({ min: -1e6, max: 0.499, noNaN: true }), fc.double({ min: 1000.01, max: 1e9 })),
        fc.oneof(fc.double({ min: 10, max: 9e3, noNaN: true }), fc.double({ min: 10.01e6, max: 1e9 })),
        (badVolts, badHz) => {
          const paths = issuesOf(
            with_({ input: { min: badVolts, nom: 12, max: 14.6 }, switching: { min: 100e3, max: badHz } }),
          ).map((issue) => issue.path);
          expect(paths).toContain('input.min');
          expect(paths).toContain('switching.max');
        },
      ),
    );
  });
});

describe('formatIssues', () => {
  it('writes one issue per line', () => {
    expect(
      formatIssues([
        { path: 'a', message: 'a: one' },
        { path: 'b', message: 'b: two' },
      ]),
    ).toBe('a: one\nb: two');
  });
});
