/**
 * The rail-spec form. Every field shows its unit and accepts engineering notation; every message sits
 * beside its field (all at once); what was typed is shown back as typed. htmx re-runs the study as the
 * user types (debounced) and swaps only the results and the message slots, so focus and caret stay put.
 * Without JavaScript it is a plain POST form.
 */
import type { FC } from 'hono/jsx';
import type { SpecIssue } from '../src/spec/errors.ts';
import { OBJECTIVE_WORDS } from '../src/study/objectives.ts';
import { OBJECTIVE_KEYS } from '../src/study/options.ts';
import { messageBesideField } from '../src/web/spec-codec.ts';
import { type FieldDef, type FormValues, isFieldPath, specFieldGroups } from '../src/web/spec-fields.ts';
import type { SweepText } from '../src/web/view-state.ts';

const SWEEP_PATHS = ['fp', 'rp', 'obj', ...OBJECTIVE_KEYS.map((k) => `w.${k}`)];

export const slotId = (path: string) => `err-${path === '' ? 'form' : path.replace(/[^a-zA-Z0-9]/g, '-')}`;
const inputId = (path: string) => `f-${path.replace(/[^a-zA-Z0-9]/g, '-')}`;

/** Messages by field path; anything without a field of its own goes to '' (top of the form). */
export function issuesByField(issues: readonly SpecIssue[]): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const issue of issues) {
    const known = isFieldPath(issue.path) || SWEEP_PATHS.includes(issue.path);
    const path = known ? issue.path : '';
    out.set(path, [...(out.get(path) ?? []), known ? messageBesideField(issue) : issue.message]);
  }
  return out;
}

/** The message slot of one field; `oob` marks it for an htmx out-of-band swap. */
export const FieldMessages: FC<{ path: string; messages?: string[]; oob?: boolean }> = ({
  path,
  messages,
  oob,
}) => (
  <div class="field-error" id={slotId(path)} aria-live="polite" hx-swap-oob={oob ? 'true' : undefined}>
    {(messages ?? []).map((m) => (
      <p>{m}</p>
    ))}
  </div>
);

/** Every message slot, for the edit response: slots without a message are cleared. */
export const AllFieldMessages: FC<{ issues: readonly SpecIssue[] }> = ({ issues }) => {
  const by = issuesByField(issues);
  const paths = ['', ...specFieldGroups([]).flatMap((g) => g.fields.map((f) => f.path)), ...SWEEP_PATHS];
  return (
    <>
      {paths.map((p) => (
        <FieldMessages path={p} messages={by.get(p)} oob={true} />
      ))}
    </>
  );
};

const Field: FC<{ def: FieldDef; value: string; messages?: string[] }> = ({ def, value, messages }) => {
  const id = inputId(def.path);
  const invalid = messages !== undefined && messages.length > 0;
  const describedBy = `${slotId(def.path)}${def.hint ? ` ${id}-hint` : ''}`;
  let control: unknown;
  if (def.kind === 'checkbox') {
    control = (
      <input type="checkbox" id={id} name={def.path} checked={value !== ''} aria-describedby={describedBy} />
    );
  } else if (def.kind === 'select') {
    control = (
      <select
        id={id}
        name={def.path}
        aria-invalid={invalid ? 'true' : undefined}
        aria-describedby={describedBy}
      >
        <option value="">{def.path === 'technology' ? 'default' : 'from the voltage sign'}</option>
        {(def.options ?? []).map((o) => (
          <option value={o} selected={o === value}>
            {o}
          </option>
        ))}
      </select>
    );
  } else {
    control = (
      <input
        type="text"
        id={id}
        name={def.path}
        value={value}
        inputmode={def.kind === 'quantity' ? 'decimal' : undefined}
        autocomplete="off"
        spellcheck={false}
        aria-invalid={invalid ? 'true' : undefined}
        aria-describedby={describedBy}
      />
    );
  }
  return (
    <div class={`field field-${def.kind}`}>
      <label for={id}>{def.label}</label>
      <span class="control">
        {control}
        {def.unit ? <span class="unit">{def.unit}</span> : null}
      </span>
      {def.hint ? (
        <small class="hint" id={`${id}-hint`}>
          {def.hint}
        </small>
      ) : null}
      <FieldMessages path={def.path} messages={messages} />
    </div>
  );
};

const SweepFields: FC<{ sweep: SweepText; by: Map<string, string[]> }> = ({ sweep, by }) => {
  const chosen = sweep.obj.length > 0 ? sweep.obj : ['parts', 'lossW', 'stress'];
  return (
    <fieldset class="sweep">
      <legend>Study</legend>
      <div class="field">
        <label for="f-fp">Frequency points</label>
        <span class="control">
          <input
            type="text"
            id="f-fp"
            name="fp"
            value={sweep.fp}
            inputmode="numeric"
            aria-describedby={slotId('fp')}
          />
          <span class="unit">on a log grid over the band</span>
        </span>
        <FieldMessages path="fp" messages={by.get('fp')} />
      </div>
      <div class="field">
        <label for="f-rp">Ripple ratios</label>
        <span class="control">
          <input
            type="text"
            id="f-rp"
            name="rp"
            value={sweep.rp}
            placeholder="0.2, 0.3, 0.4, 0.6"
            aria-describedby={slotId('rp')}
          />
          <span class="unit">ΔI/I</span>
        </span>
        <FieldMessages path="rp" messages={by.get('rp')} />
      </div>
      <fieldset class="objectives" id="weights">
        <legend>Objectives for the front, and their weights in the recommendation</legend>
        {OBJECTIVE_KEYS.map((k) => (
          <div class="objective">
            <label>
              <input type="checkbox" name="obj" value={k} checked={chosen.includes(k)} />{' '}
              {OBJECTIVE_WORDS[k].noun}
            </label>
            <label class="weight">
              weight{' '}
              <input
                type="text"
                name={`w.${k}`}
                value={sweep.w[k] ?? ''}
                placeholder="1"
                size={3}
                inputmode="decimal"
                aria-describedby={slotId(`w.${k}`)}
              />
            </label>
            <FieldMessages path={`w.${k}`} messages={by.get(`w.${k}`)} />
          </div>
        ))}
        <FieldMessages path="obj" messages={by.get('obj')} />
      </fieldset>
    </fieldset>
  );
};

export interface RailFormProps {
  values: FormValues;
  sweep: SweepText;
  issues: readonly SpecIssue[];
  technologies: readonly string[];
}

export const RailForm: FC<RailFormProps> = ({ values, sweep, issues, technologies }) => {
  const by = issuesByField(issues);
  return (
    <form
      id="rail-form"
      class="rail-form"
      method="post"
      action="/study"
      hx-post="/study"
      hx-trigger="input delay:500ms, submit"
      hx-target="#results"
      hx-sync="this:replace"
      novalidate
    >
      <FieldMessages path="" messages={by.get('')} />
      {specFieldGroups(technologies).map((group) => (
        <fieldset>
          <legend>{group.legend}</legend>
          {group.fields.map((def) => (
            <Field def={def} value={values[def.path] ?? ''} messages={by.get(def.path)} />
          ))}
        </fieldset>
      ))}
      <SweepFields sweep={sweep} by={by} />
      <p class="form-actions">
        <button type="submit">Run study</button>
        <small> Values accept engineering notation: 4.7u, 500k, 50 mV, 1 MHz.</small>
      </p>
    </form>
  );
};
