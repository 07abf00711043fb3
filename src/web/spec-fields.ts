/**
 * The rail-spec form: its fields (one per spec path, with unit and hint), and the conversions
 * form text ⇄ spec input. The form keeps what the user typed as text, keyed by dotted path
 * (`input.min`), so an invalid value is re-rendered exactly as typed beside its message.
 */

import { SPEC_DEFAULTS } from '../spec/limits.ts';
import { POLARITIES } from '../spec/schema.ts';

/** What the user typed, by dotted spec path. */
export type FormValues = Record<string, string>;

export interface FieldDef {
  path: string;
  label: string;
  /** Unit shown beside the box; the box accepts engineering notation with or without it. */
  unit: string;
  kind: 'quantity' | 'text' | 'select' | 'checkbox';
  required: boolean;
  hint?: string;
  options?: readonly string[];
}

export interface FieldGroup {
  legend: string;
  fields: FieldDef[];
}

const q = (path: string, label: string, unit: string, required: boolean, hint?: string): FieldDef => ({
  path,
  label,
  unit,
  kind: 'quantity',
  required,
  hint,
});

/** The form, group by group, in the order it is shown. */
export function specFieldGroups(technologies: readonly string[]): FieldGroup[] {
  return [
    { legend: 'Rail', fields: [{ path: 'name', label: 'Name', unit: '', kind: 'text', required: false }] },
    {
      legend: 'Input voltage',
      fields: [
        q('input.min', 'Minimum', 'V', true, 'lowest source voltage at full load'),
        q('input.nom', 'Nominal', 'V', true),
        q('input.max', 'Maximum', 'V', true),
      ],
    },
    {
      legend: 'Output',
      fields: [
        q('output.voltage', 'Voltage', 'V', true, 'magnitude; a negative value means a negative rail'),
        {
          path: 'output.polarity',
          label: 'Polarity',
          unit: '',
          kind: 'select',
          required: false,
          options: POLARITIES,
        },
      ],
    },
    {
      legend: 'Load current',
      fields: [
        q('load.max', 'Maximum', 'A', true),
        q('load.min', 'Minimum', 'A', false, `blank: ${SPEC_DEFAULTS.loadMinFraction * 100} % of maximum`),
        {
          path: 'load.ccm',
          label: 'Require CCM at minimum load',
          unit: '',
          kind: 'checkbox',
          required: false,
        },
      ],
    },
    {
      legend: 'Ripple limits (peak-to-peak)',
      fields: [q('ripple.output', 'Output', 'V', true), q('ripple.input', 'Input', 'V', false, 'optional')],
    },
    {
      legend: 'Switching-frequency band',
      fields: [q('switching.min', 'Lowest', 'Hz', true), q('switching.max', 'Highest', 'Hz', true)],
    },
    {
      legend: 'Conditions',
      fields: [
        q('ambient', 'Ambient', '°C', false, `blank: ${SPEC_DEFAULTS.ambientC} °C`),
        {
          path: 'technology',
          label: 'Technology preset',
          unit: '',
          kind: 'select',
          required: false,
          options: technologies,
        },
      ],
    },
    {
      legend: 'Input step (optional)',
      fields: [
        q('step.from', 'From', 'V', false),
        q('step.to', 'To', 'V', false),
        q('step.rise', 'Rise time', 's', false),
      ],
    },
  ];
}

/** Every field path the form knows. The spec codec stores fields by position here: only ever append. */
export const FIELD_PATHS: readonly string[] = specFieldGroups([]).flatMap((g) => g.fields.map((f) => f.path));
const FIELD_SET = new Set(FIELD_PATHS);

export function isFieldPath(path: string): boolean {
  return FIELD_SET.has(path);
}

const text = (v: unknown): string => (v === undefined || v === null ? '' : String(v));

/** Form text from a spec document (YAML/JSON input format), expanding the scalar shorthands. */
export function formValuesFromDocument(doc: Record<string, unknown>): FormValues {
  const out: FormValues = {};
  const put = (path: string, v: unknown) => {
    if (v !== undefined && v !== null && text(v) !== '')
      out[path] = typeof v === 'boolean' ? (v ? 'on' : '') : text(v);
  };
  const section = (key: string, scalarKeys: string[], keys: string[]) => {
    const v = doc[key];
    if (v === undefined) return;
    if (typeof v !== 'object' || v === null) {
      for (const k of scalarKeys) put(`${key}.${k}`, v);
      return;
    }
    for (const k of keys) put(`${key}.${k}`, (v as Record<string, unknown>)[k]);
  };
  put('name', doc.name);
  section('input', ['min', 'nom', 'max'], ['min', 'nom', 'max']);
  section('output', ['voltage'], ['voltage', 'polarity']);
  section('load', ['max'], ['max', 'min', 'ccm']);
  section('ripple', ['output'], ['output', 'input']);
  section('switching', ['min', 'max'], ['min', 'max']);
  section('step', [], ['from', 'to', 'rise']);
  put('ambient', doc.ambient);
  put('technology', doc.technology);
  return out;
}

/** Keep only known field paths with non-blank text (trimmed, length-capped). */
export function cleanFormValues(raw: Record<string, unknown>): FormValues {
  const out: FormValues = {};
  for (const path of FIELD_PATHS) {
    const v = raw[path];
    const s = typeof v === 'string' ? v.trim().slice(0, 200) : '';
    if (s !== '') out[path] = s;
  }
  return out;
}

/**
 * The spec input document for the schema. A blank required field becomes absent, so the schema says
 * "is required" beside it; a blank optional field is left out; the step section exists only when one
 * of its fields is filled in.
 */
export function documentFromFormValues(values: FormValues): Record<string, unknown> {
  const get = (path: string) => (values[path]?.trim() ? values[path].trim() : undefined);
  const pick = (prefix: string, keys: string[]) => {
    const out: Record<string, unknown> = {};
    for (const k of keys) {
      const v = get(`${prefix}.${k}`);
      if (v !== undefined) out[k] = v;
    }
    return out;
  };
  const doc: Record<string, unknown> = {
    input: pick('input', ['min', 'nom', 'max']),
    output: pick('output', ['voltage', 'polarity']),
    load: { ...pick('load', ['max', 'min']), ...(get('load.ccm') ? { ccm: true } : {}) },
    ripple: pick('ripple', ['output', 'input']),
    switching: pick('switching', ['min', 'max']),
  };
  if (get('name')) doc.name = get('name');
  if (get('ambient')) doc.ambient = get('ambient');
  if (get('technology')) doc.technology = get('technology');
  const step = pick('step', ['from', 'to', 'rise']);
  if (Object.keys(step).length > 0) doc.step = step;
  return doc;
}
