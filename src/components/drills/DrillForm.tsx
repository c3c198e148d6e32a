import { useId, useState, type FormEvent, type ReactNode } from 'react';
import type { Stage } from '../../lib/procedure/schema';
import { fromDateTimeLocal } from '../../lib/local-time';
import { STAGE_LABELS } from '../trainer/labels';
import type { Saved } from './drill-api';

// One form for assigning a drill and for editing one. The browser reads the due date in the
// instructor's own time zone and sends the instant; the server's field errors show beside each field.

export interface ProcedureChoice {
  slug: string;
  title: string;
  version: number;
  stages: Stage[];
}

export interface DrillFormValues {
  procedure: string;
  stages: Stage[];
  /** datetime-local value, in the browser's zone. */
  due: string;
  passMark: string;
  attemptLimit: string;
  answersAfterDue: boolean;
}

interface Props {
  /** Procedures to pick from when assigning; absent when editing (the version stays pinned). */
  procedures?: ProcedureChoice[];
  /** The stages the pinned procedure offers, when editing. */
  offeredStages?: Stage[];
  initial: DrillFormValues;
  submitLabel: string;
  /** Builds the request body from the values and sends it. */
  onSave(values: DrillFormValues, dueAt: string | undefined): Promise<Saved>;
  onCancel?(): void;
  /** The form's own heading level content, for its accessible name. */
  label: string;
}

const timeZone = () => {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone;
  } catch {
    return 'this device';
  }
};

export function DrillForm({ procedures, offeredStages, initial, submitLabel, onSave, onCancel, label }: Props) {
  const id = useId();
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const [saving, setSaving] = useState(false);

  const chosen = procedures?.find((p) => p.slug === values.procedure);
  const offered = offeredStages ?? chosen?.stages ?? [];
  const set = <K extends keyof DrillFormValues>(key: K, value: DrillFormValues[K]) => setValues((v) => ({ ...v, [key]: value }));

  const pickProcedure = (slug: string) => {
    const next = procedures?.find((p) => p.slug === slug);
    setValues((v) => ({ ...v, procedure: slug, stages: next ? [...next.stages] : [] }));
  };
  // In the procedure's order (the schema module's STAGES list would bring zod into this island).
  const toggleStage = (stage: Stage, on: boolean) => set('stages', offered.filter((s) => (s === stage ? on : values.stages.includes(s))));

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const dueAt = values.due === '' ? undefined : (fromDateTimeLocal(values.due) ?? values.due);
    setSaving(true);
    const saved = await onSave(values, dueAt);
    setSaving(false);
    if (saved.ok) {
      setErrors({});
      setMessage({ kind: 'success', text: procedures ? `Drill assigned: ${saved.drill.procedure.title}. Each learner gets an e-mail.` : 'Saved.' });
      if (procedures) setValues((v) => ({ ...initial, procedure: v.procedure, stages: v.stages }));
    } else {
      setErrors(saved.fields);
      setMessage({ kind: 'error', text: saved.error });
    }
  };

  const fieldId = (name: string) => `${id}-${name}`;
  /** aria-invalid and the ids of the field's hint and error, so a screen reader reads both with the field. */
  const described = (name: string, hint = false) => {
    const bad = Boolean(errors[name]?.length);
    const ids = [hint ? `${fieldId(name)}-hint` : null, bad ? `${fieldId(name)}-error` : null].filter(Boolean).join(' ');
    return { ...(bad ? { 'aria-invalid': true as const } : {}), ...(ids ? { 'aria-describedby': ids } : {}) };
  };

  return (
    <form onSubmit={(e) => void submit(e)} noValidate aria-label={label}>
      {message && (
        <p
          role={message.kind === 'error' ? 'alert' : 'status'}
          className={`mb-4 flex items-start gap-2 rounded-lg border px-4 py-3 font-medium ${
            message.kind === 'error' ? 'border-signal-500 bg-signal-50 text-signal-700' : 'border-go-500 bg-go-50 text-go-700'
          }`}
        >
          <span aria-hidden="true">{message.kind === 'error' ? '⚠' : '✓'}</span>
          <span>{message.text}</span>
        </p>
      )}

      {procedures && (
        <div className="mb-4">
          <label htmlFor={fieldId('procedure')} className="field-label">
            Procedure
          </label>
          <select
            id={fieldId('procedure')}
            className="field-input"
            value={values.procedure}
            onChange={(e) => pickProcedure(e.target.value)}
            {...described('procedure', true)}
          >
            {procedures.map((p) => (
              <option key={p.slug} value={p.slug}>
                {p.title} (version {p.version})
              </option>
            ))}
          </select>
          <p id={`${fieldId('procedure')}-hint`} className="mt-1 text-sm text-steel-500">
            The drill keeps this version, even when a newer one is published.
          </p>
          <FieldError id={fieldId('procedure')} errors={errors.procedure ?? errors.version} />
        </div>
      )}

      <fieldset className="mb-4" {...described('stages')}>
        <legend className="field-label">Stages</legend>
        <div className="flex flex-wrap gap-x-4">
          {offered.map((stage) => (
            <label key={stage} className="flex min-h-touch items-center gap-2">
              <input
                type="checkbox"
                className="h-5 w-5 accent-brass-500"
                checked={values.stages.includes(stage)}
                onChange={(e) => toggleStage(stage, e.target.checked)}
              />
              {STAGE_LABELS[stage]}
            </label>
          ))}
        </div>
        <FieldError id={fieldId('stages')} errors={errors.stages} />
      </fieldset>

      <div className="grid gap-x-4 sm:grid-cols-3">
        <Field id={fieldId('dueAt')} label="Due date and time" errors={errors.dueAt} hint={`In your time zone (${timeZone()}).`}>
          <input id={fieldId('dueAt')} type="datetime-local" className="field-input" value={values.due} onChange={(e) => set('due', e.target.value)} {...described('dueAt', true)} />
        </Field>
        <Field id={fieldId('passMarkPct')} label="Pass mark (%)" errors={errors.passMarkPct} hint="Each stage's best score must reach it.">
          <input
            id={fieldId('passMarkPct')}
            type="number"
            inputMode="numeric"
            min={1}
            max={100}
            className="field-input"
            value={values.passMark}
            onChange={(e) => set('passMark', e.target.value)}
            {...described('passMarkPct', true)}
          />
        </Field>
        <Field id={fieldId('attemptLimit')} label="Attempts per stage" errors={errors.attemptLimit} hint="Leave empty for no limit.">
          <input
            id={fieldId('attemptLimit')}
            type="number"
            inputMode="numeric"
            min={1}
            className="field-input"
            value={values.attemptLimit}
            onChange={(e) => set('attemptLimit', e.target.value)}
            {...described('attemptLimit', true)}
          />
        </Field>
      </div>

      <div className="mb-4">
        <label className="flex min-h-touch items-center gap-2">
          <input
            type="checkbox"
            className="h-5 w-5 accent-brass-500"
            checked={values.answersAfterDue}
            onChange={(e) => set('answersAfterDue', e.target.checked)}
          />
          Show the right answers only after the due date
        </label>
        <FieldError id={fieldId('answersAfterDue')} errors={errors.answersAfterDue} />
      </div>

      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={saving}>
          {saving ? 'Saving…' : submitLabel}
        </button>
        {onCancel && (
          <button type="button" className="btn-quiet" onClick={onCancel}>
            Cancel
          </button>
        )}
      </div>
    </form>
  );
}

function Field({ id, label, hint, errors, children }: { id: string; label: string; hint?: string; errors?: string[]; children: ReactNode }) {
  return (
    <div className="mb-4">
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-sm text-steel-500">
          {hint}
        </p>
      )}
      <FieldError id={id} errors={errors} />
    </div>
  );
}

function FieldError({ id, errors }: { id: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <p id={`${id}-error`} className="field-error" role="alert">
      <span aria-hidden="true">⚠</span> {errors.join(' ')}
    </p>
  );
}

/** The request fields the form's values stand for: numbers as numbers, an empty limit as no limit. */
export function drillFields(values: DrillFormValues, dueAt: string | undefined) {
  const number = (text: string) => (text.trim() === '' ? undefined : Number(text));
  return {
    stages: values.stages,
    dueAt,
    passMarkPct: number(values.passMark),
    attemptLimit: number(values.attemptLimit) ?? null,
    answersAfterDue: values.answersAfterDue,
  };
}
