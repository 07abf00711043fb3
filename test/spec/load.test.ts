import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { formatIssues } from '../../src/spec/errors.ts';
import { loadSpecFile, loadSpecText } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';

const SPECS_DIR = new URL('../../data/specs/', import.meta.url);
const specPath = (file: string) => fileURLToPath(new URL(file, SPECS_DIR));

function loaded(file: string): RailSpec {
  const result = loadSpecFile(specPath(file));
  if (!result.ok) throw new Error(`${file}:\n${formatIssues(result.issues)}`);
  return result.spec;
}

describe('demo specs in data/specs', () => {
  const files = readdirSync(SPECS_DIR).filter((file) => file.endsWith('.yaml'));

  it('are the four invented scenarios, each described in the README', () => {
    expect(files.sort()).toEqual([
      'industrial-24v-negative-12v.yaml',
      'marine-lifepo4-12v.yaml',
      'usb-pd-bench-tool-12v.yaml',
      'vehicle-bus-cold-crank-12v.yaml',
    ]);
    const readme = readFileSync(new URL('README.md', SPECS_DIR), 'utf8');
    for (const file of files) expect(readme).toContain(file);
  });

  it.each(files)('%s loads as a valid rail spec', (file) => {
    expect(loaded(file).name.length).toBeGreaterThan(0);
  });

  it('gives the marine demo rail: a 4-cell LiFePO4 pack around a 12 V output', () => {
    // common practice: LiFePO4 cell 2.5 V empty, 3.2 V plateau, 3.65 V full charge; four cells in series.
    expect(loaded('marine-lifepo4-12v.yaml')).toEqual({
      name: 'Marine instrument 12 V rail',
      input: { minV: 4 * 2.5, nomV: 4 * 3.2, maxV: 4 * 3.65 },
      output: { voltageV: 12, polarity: 'positive' },
      load: { maxA: 2, minA: 0.2, ccmRequired: false },
      ripple: { outputVpp: 0.05, inputVpp: 0.2 },
      switching: { minHz: 100e3, maxHz: 1e6 },
      ambientC: 40,
      technology: 'default',
      step: { fromV: 12.8, toV: 14.6, riseS: 1e-6 },
    } satisfies RailSpec);
  });

  it('has every buck-boost scenario straddle its output, and the negative one ask for negative polarity', () => {
    for (const file of [
      'marine-lifepo4-12v.yaml',
      'usb-pd-bench-tool-12v.yaml',
      'vehicle-bus-cold-crank-12v.yaml',
    ]) {
      const spec = loaded(file);
      expect(spec.input.minV).toBeLessThan(spec.output.voltageV);
      expect(spec.input.maxV).toBeGreaterThan(spec.output.voltageV);
    }
    expect(loaded('industrial-24v-negative-12v.yaml').output).toEqual({ voltageV: 12, polarity: 'negative' });
  });

  it('covers the USB-PD fixed voltages and the vehicle cold crank', () => {
    // common practice: USB Power Delivery fixed supplies of 5, 9, 15 and 20 V.
    const pd = loaded('usb-pd-bench-tool-12v.yaml');
    expect([pd.input.minV, pd.input.maxV]).toEqual([5, 20]);
    // common practice: a 12 V vehicle bus dips to about 6 V in a cold crank; a jump start can apply 24 V.
    const vehicle = loaded('vehicle-bus-cold-crank-12v.yaml');
    expect([vehicle.input.minV, vehicle.input.maxV]).toEqual([6, 24]);
  });
});

describe('loadSpecText', () => {
  it('reads JSON as well as YAML', () => {
    const json = JSON.stringify({
      input: 12,
      output: { voltage: 5 },
      load: 1,
      ripple: '10m',
      switching: '500k',
    });
    const result = loadSpecText(json, 'spec.json');
    expect(result.ok && result.spec.output).toEqual({ voltageV: 5, polarity: 'positive' });
  });

  it('reports a syntax error as an issue with the file name and line', () => {
    const result = loadSpecText('name: x\ninput: { min: 10\noutput: 12\n', 'broken.yaml');
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues).toHaveLength(1);
      expect(result.issues[0].message).toMatch(/^broken\.yaml: not valid YAML or JSON \(line \d+\)/);
    }
  });

  it('reports duplicate keys instead of silently keeping one', () => {
    const result = loadSpecText('input: 12\ninput: 24\n');
    expect(result.ok).toBe(false);
  });

  it('passes every validation problem through', () => {
    const result = loadSpecText('input: { min: 20, nom: 12, max: 14 }\noutput: { voltage: 1 MV }\n');
    expect(result.ok).toBe(false);
    if (!result.ok) {
      const paths = result.issues.map((issue) => issue.path);
      expect(paths).toEqual(
        expect.arrayContaining(['input.min', 'output.voltage', 'load', 'ripple', 'switching']),
      );
    }
  });

  it('rejects a technology with no preset behind it, listing the available ones', () => {
    const text = readFileSync(specPath('marine-lifepo4-12v.yaml'), 'utf8').replace(
      'technology: default',
      'technology: unobtainium',
    );
    const result = loadSpecText(text);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues).toEqual([
        {
          path: 'technology',
          message: expect.stringMatching(/no preset named "unobtainium" \(available: .*default/),
        },
      ]);
    }
  });
});

describe('loadSpecFile', () => {
  it('reports a missing file as an issue', () => {
    const result = loadSpecFile(specPath('no-such-spec.yaml'));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0].message).toMatch(/cannot read .*no-such-spec\.yaml/);
  });
});
