/**
 * Pinned values and parasitics: `L1=22u`, `Cs=4.7u`, `L1.dcr=20m`, `Cout.esr=5m`, `Q1.ron=10m`,
 * `D1.vf=0.4`. A bare name pins the part's value (H, F or Ω); a suffix pins one parasitic.
 */
import type { Design, PartDesign } from './design.ts';

export const PIN_FIELDS: Record<
  string,
  { field: (keyof PartDesign & string) | 'coupling'; unit: string; what: string }
> = {
  '': { field: 'value', unit: '', what: 'value' },
  dcr: { field: 'dcrOhm', unit: 'Ω', what: 'winding resistance' },
  esr: { field: 'esrOhm', unit: 'Ω', what: 'equivalent series resistance' },
  ron: { field: 'ronOhm', unit: 'Ω', what: 'on-resistance' },
  vf: { field: 'vfV', unit: 'V', what: 'forward drop' },
  rd: { field: 'rdOhm', unit: 'Ω', what: 'diode dynamic resistance' },
  cj: { field: 'cjF', unit: 'F', what: 'diode junction capacitance' },
  qg: { field: 'qgC', unit: 'C', what: 'gate charge' },
  qsw: { field: 'qswC', unit: 'C', what: 'switching charge' },
  qoss: { field: 'qossC', unit: 'C', what: 'output charge' },
  /** Coupling coefficient of a two-winding part (a property of the pair; pinned on its first winding). */
  k: { field: 'coupling', unit: '', what: 'coupling coefficient' },
};

/** Which suffixes make sense for which roles. */
const ALLOWED: Record<string, string[]> = {
  switch: ['ron', 'qg', 'qsw', 'qoss'],
  sync: ['ron', 'qg', 'qoss'],
  diode: ['vf', 'rd', 'cj'],
  inductor: ['', 'dcr'],
  'coupled-inductor': ['', 'dcr', 'k'],
  capacitor: ['', 'esr'],
  'damping-capacitor': ['', 'esr'],
  sense: [''],
  'damping-resistor': [''],
  controller: [],
};

/** Validate pin names against a design's components; returns one message per bad pin. */
export function checkPins(d: Pick<Design, 'parts'>, pins: Record<string, number>): string[] {
  const problems: string[] = [];
  for (const [key, value] of Object.entries(pins)) {
    const [name, suffix = ''] = key.split('.', 2);
    const part = d.parts.find((p) => p.name === name);
    if (!part) {
      problems.push(
        `--set ${key}: no component ${name} in this topology (have ${d.parts.map((p) => p.name).join(', ')})`,
      );
      continue;
    }
    const allowed = ALLOWED[part.role] ?? [];
    if (!allowed.includes(suffix)) {
      const list = allowed.map((s) => (s ? `${name}.${s}` : name)).join(', ') || 'nothing';
      problems.push(`--set ${key}: cannot pin that on ${name} (${part.role}); pinnable: ${list}`);
      continue;
    }
    if (suffix === 'k' && !(value > 0 && value <= 1)) {
      problems.push(`--set ${key}: coupling ${value} must lie in (0, 1]`);
      continue;
    }
    if (!Number.isFinite(value) || value < 0 || (suffix === '' && value === 0)) {
      problems.push(
        `--set ${key}: ${value} is not a valid ${PIN_FIELDS[suffix].what} (must be ${suffix === '' ? '> 0' : '≥ 0'})`,
      );
    }
  }
  return problems;
}

export function applyPins(d: Design, pins: Record<string, number>): void {
  for (const [key, value] of Object.entries(pins)) {
    const [name, suffix = ''] = key.split('.', 2);
    const part = d.parts.find((p) => p.name === name);
    const f = PIN_FIELDS[suffix];
    if (!part || !f) continue;
    if (suffix === 'k') {
      d.coupling = value;
      continue;
    }
    (part as unknown as Record<string, number>)[f.field] = value;
    // unpinned parts share the read-only NO_PINS set: give this one its own before adding
    part.pinned = new Set(part.pinned).add(f.field);
  }
}
