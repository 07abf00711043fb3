import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Technology } from '../../src/parts/technology.ts';
import { TechnologyError } from '../../src/spec/errors.ts';
import { listTechnologies, loadTechnology } from '../../src/spec/load.ts';
import { numericPaths, parseTechnology } from '../../src/spec/technology-schema.ts';

/** A fresh, mutable copy of a preset file, for breaking on purpose. */
function rawPreset(name: string): Technology {
  return JSON.parse(readFileSync(new URL(`../../data/technology/${name}.json`, import.meta.url), 'utf8'));
}

function issuePaths(input: unknown): string[] {
  const result = parseTechnology(input);
  if (result.ok) throw new Error('expected the preset to be rejected');
  return result.issues.map((issue) => issue.path);
}

describe('technology presets', () => {
  it('lists the presets in data/technology', () => {
    expect(listTechnologies()).toEqual(expect.arrayContaining(['default', 'ideal', 'wide-bandgap']));
  });

  it.each(listTechnologies())('loads and validates %s', (name) => {
    const technology = loadTechnology(name);
    expect(technology.name).toBe(name);
    expect(technology.mosfet.classes.length).toBeGreaterThan(0);
  });

  it('returns the same frozen object on every load (cached, shared safely)', () => {
    const first = loadTechnology('default');
    expect(loadTechnology('default')).toBe(first);
    expect(Object.isFrozen(first.mosfet.classes[0])).toBe(true);
  });

  it('rejects an unknown preset with an error listing the available ones', () => {
    let caught: unknown;
    try {
      loadTechnology('unobtainium');
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(TechnologyError);
    const error = caught as TechnologyError;
    expect(error.message).toMatch(/unknown technology preset "unobtainium"; available: .*default.*ideal/);
    expect(error.available).toEqual(listTechnologies());
    expect(error.preset).toBe('unobtainium');
  });

  it('refuses names that would leave the preset folder', () => {
    expect(() => loadTechnology('../specs/README')).toThrow(TechnologyError);
  });
});

describe('the default preset', () => {
  const tech = loadTechnology('default');

  it('makes higher-voltage MOSFET classes worse in specific on-resistance', () => {
    // Specific on-resistance of a silicon drift region rises steeply (about Vbr^2.5) with breakdown voltage:
    // B. J. Baliga, Fundamentals of Power Semiconductor Devices, Springer, 2008, ch. 6.
    const ron = tech.mosfet.classes.map((c) => c.ronSpecOhmMm2);
    for (let i = 1; i < ron.length; i++) expect(ron[i]).toBeGreaterThan(ron[i - 1]);
  });

  it('gives higher-voltage Schottky classes a higher knee voltage', () => {
    // common practice: a higher-voltage Schottky uses a higher barrier and a thicker drift layer.
    const vf = tech.diode.classes.map((c) => c.vfV);
    for (let i = 1; i < vf.length; i++) expect(vf[i]).toBeGreaterThan(vf[i - 1]);
  });

  it('uses the resistivity of copper near 100 °C', () => {
    // 1.7241e-8 Ω·m at 20 °C and 0.00393 /K: IEC 60028, International standard of resistance for copper, 1925.
    const expected = 1.7241e-8 * (1 + 0.00393 * (100 - 20));
    const rtol = 0.03; // the preset rounds to two digits
    expect(Math.abs(tech.inductor.copperResistivityOhmM - expected) / expected).toBeLessThan(rtol);
  });

  it('keeps a class-II ceramic at about a third of its capacitance at rated voltage', () => {
    // from memory: X7R-class parts keep roughly 30–40 % at rated DC bias in small bodies.
    const kept = 1 / (1 + tech.capacitor.dcBiasA);
    expect(kept).toBeGreaterThan(0.3);
    expect(kept).toBeLessThan(0.4);
  });

  it('marks every provenance as from memory or common practice (no invented sources)', () => {
    for (const text of Object.values(tech.provenance)) expect(text).toMatch(/^(from memory|common practice)/);
  });
});

describe('the ideal preset', () => {
  const ideal = loadTechnology('ideal');
  const real = loadTechnology('default');

  it('is marked ideal, and the default preset is not', () => {
    expect(ideal.ideal).toBe(true);
    expect(real.ideal).toBe(false);
  });

  it('has no loss mechanism left', () => {
    for (const c of ideal.mosfet.classes) {
      expect([c.ronSpecOhmMm2, c.qgSpecCPerMm2, c.qswSpecCPerMm2, c.qossSpecCPerMm2]).toEqual([0, 0, 0, 0]);
    }
    for (const c of ideal.diode.classes) expect([c.vfV, c.rdOhmA, c.cjFPerA]).toEqual([0, 0, 0]);
    for (const c of ideal.capacitor.ceramic) expect(c.esrOhm).toBe(0);
    expect(ideal.mosfet.deadTimeS).toBe(0);
    expect(ideal.mosfet.bodyDiodeVfV).toBe(0);
    expect(ideal.inductor.material.k).toBe(0);
    expect(ideal.inductor.copperResistivityOhmM).toBe(0);
    // coupling is not a loss: the ideal preset keeps the default's physical coupling
    expect(ideal.inductor.coupling).toBe(real.inductor.coupling);
    expect(ideal.capacitor.dcBiasA).toBe(0);
    expect(ideal.capacitor.electrolyticEsrOhm).toBe(0);
    expect(ideal.sense.thresholdV).toBe(0);
    expect(ideal.controller).toMatchObject({ quiescentA: 0, minOnS: 0, minOffS: 0, maxDuty: 1 });
  });

  it('keeps the ratings of the default preset, so the same classes resolve', () => {
    expect(ideal.mosfet.classes.map((c) => c.vdsV)).toEqual(real.mosfet.classes.map((c) => c.vdsV));
    expect(ideal.diode.classes.map((c) => c.vrV)).toEqual(real.diode.classes.map((c) => c.vrV));
    expect(ideal.capacitor.ceramic.map((c) => [c.ratedV, c.unitF])).toEqual(
      real.capacitor.ceramic.map((c) => [c.ratedV, c.unitF]),
    );
    expect(ideal.mosfet.voltageDerating).toBe(real.mosfet.voltageDerating);
  });
});

describe('technologySchema', () => {
  it('accepts the preset files as they are', () => {
    for (const name of listTechnologies()) expect(parseTechnology(rawPreset(name)).ok).toBe(true);
  });

  it('requires a provenance entry for every number', () => {
    const tech = rawPreset('default');
    delete tech.provenance.busMargin;
    const result = parseTechnology(tech);
    expect(result.ok).toBe(false);
    if (!result.ok)
      expect(result.issues).toContainEqual({
        path: 'provenance',
        message: 'provenance: no entry covers busMargin',
      });
  });

  it('rejects a provenance entry that names nothing, or gives no kind of source', () => {
    const tech = rawPreset('default');
    tech.provenance['mosfet.gateDriveVolts'] = 'from memory: typo in the key';
    tech.provenance.busMargin = 'seemed right';
    expect(issuePaths(tech)).toEqual(['provenance.busMargin', 'provenance.mosfet.gateDriveVolts'].sort());
  });

  it('rejects classes out of ascending order, negative losses, fractions above 1 and unknown fields, all at once', () => {
    const tech = rawPreset('default') as unknown as Record<string, Record<string, unknown>>;
    const classes = tech.mosfet.classes as Record<string, number>[];
    [classes[0], classes[1]] = [classes[1], classes[0]];
    (tech.diode.classes as Record<string, number>[])[0].vfV = -0.1;
    tech.controller.maxDuty = 1.2;
    tech.sense.colour = 'red';
    expect(issuePaths(tech).sort()).toEqual(
      ['controller.maxDuty', 'diode.classes.0.vfV', 'mosfet.classes.1.vdsV', 'sense.colour'].sort(),
    );
  });

  it('rejects core and copper fractions that overfill the box', () => {
    const tech = rawPreset('default');
    tech.inductor.coreFraction = 0.8;
    expect(issuePaths(tech)).toEqual(['inductor.copperFraction']);
  });

  it('lists the numbers that need provenance, collapsing class lists', () => {
    const paths = numericPaths(rawPreset('default'));
    expect(paths).toContain('mosfet.classes.vdsV');
    expect(paths).toContain('inductor.material.k');
    expect(paths).toContain('busMargin');
    expect(paths.some((path) => path.startsWith('provenance'))).toBe(false);
  });
});
