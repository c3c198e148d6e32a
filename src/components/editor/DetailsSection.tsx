import { Controller, useFormContext, useWatch } from 'react-hook-form';
import { CAUTIONS } from '@models/procedures/cautions';
import { STAGES, type Stage } from '../../lib/procedure/schema';
import { slugify } from '../../lib/editor/slug';
import type { EditorValues } from '../../lib/editor/values';
import { STAGE_LABELS } from '../trainer/labels';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { Section } from './Section';

// Title, engine, summary, the cautions shown before the first stage, and which stages learners do.

const STAGE_HINTS: Record<Stage, string> = {
  order: 'put the steps in an order the constraints allow',
  pins: 'seat each pin in its hole',
  pattern: 'tighten the first fastener group by its rule, pass by pass',
  wrench: 'set the wrench for the spec',
  'final-check': 'count the fasteners and turn the crankshaft',
};

export function DetailsSection({ basedOn }: { basedOn: string | null }) {
  const { register, control, setValue, getValues } = useFormContext<EditorValues>();
  const slug = useWatch({ control, name: 'slug' });
  const title = useWatch({ control, name: 'title' });

  return (
    <Section id="details" title="Details" intro="What learners see before they start.">
      <div>
        <label htmlFor="field-title" className="field-label">Title</label>
        <input id="field-title" className="field-input" {...register('title')} {...useIssueProps('title')} />
        <p className="mt-1 text-sm text-steel-500">
          {basedOn ? (
            <>A new version of /train/{basedOn}</>
          ) : (
            <>Will be published at /train/{slug || slugify(title) || '…'} (or the next free address)</>
          )}
        </p>
        <FieldIssue path="title" />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="field-engine" className="field-label">Engine</label>
          <input
            id="field-engine"
            className="field-input"
            {...register('engine.name', { onChange: (e) => setValue('engine.key', slugify(e.target.value)) })}
            {...useIssueProps('engine.name')}
          />
          <FieldIssue path="engine.name" />
          <FieldIssue path="engine.key" />
        </div>
        <label className="flex min-h-touch items-center gap-3 self-end">
          <input type="checkbox" className="h-5 w-5" {...register('demoValues')} />
          <span>Demo values (numbers for practice only, shown with a warning)</span>
        </label>
      </div>
      <div>
        <label htmlFor="field-summary" className="field-label">Summary</label>
        <textarea id="field-summary" rows={3} className="field-input py-2" {...register('summary')} {...useIssueProps('summary')} />
        <FieldIssue path="summary" />
      </div>

      <Controller
        control={control}
        name="cautions"
        render={({ field }) => (
          <fieldset aria-describedby="cautions-hint">
            <legend className="field-label">Cautions</legend>
            <p id="cautions-hint" className="mb-2 text-sm text-steel-500">
              Shown beside the model before the first stage. Say what can hurt; the engine maker's data and local practice rule.
            </p>
            <ol className="space-y-2">
              {field.value.map((text, i) => (
                <CautionRow
                  key={i}
                  index={i}
                  text={text}
                  onChange={(value) => field.onChange(field.value.map((t, j) => (j === i ? value : t)))}
                  onRemove={() => field.onChange(field.value.filter((_, j) => j !== i))}
                />
              ))}
            </ol>
            <div className="mt-2 flex flex-wrap gap-2">
              <button type="button" className="btn-quiet" onClick={() => field.onChange([...field.value, ''])}>
                Add a caution
              </button>
              <button
                type="button"
                className="btn-quiet"
                onClick={() => field.onChange([...field.value, ...Object.values(CAUTIONS).filter((c) => !field.value.includes(c))])}
              >
                Add the standard cautions
              </button>
            </div>
            <FieldIssue path="cautions" />
          </fieldset>
        )}
      />

      <Controller
        control={control}
        name="stages"
        render={({ field }) => (
          <fieldset>
            <legend className="field-label">Stages learners do</legend>
            <ul className="grid gap-1 sm:grid-cols-2">
              {STAGES.map((stage) => (
                <li key={stage}>
                  <label className="flex min-h-touch items-center gap-3">
                    <input
                      type="checkbox"
                      className="h-5 w-5"
                      checked={field.value.includes(stage)}
                      onChange={(e) => {
                        const on = e.target.checked;
                        field.onChange(STAGES.filter((s) => (s === stage ? on : field.value.includes(s))));
                        // A stage's task is part of the document exactly while the stage is chosen.
                        if (stage === 'wrench') setValue('hasWrench', on);
                        if (stage === 'final-check') setValue('hasFinalCheck', on);
                        if (stage === 'wrench' && on && !getValues('wrench.group')) setValue('wrench.group', getValues('fastenerGroups.0.key') ?? '');
                      }}
                    />
                    <span>
                      <span className="font-semibold">{STAGE_LABELS[stage]}</span>
                      <span className="text-steel-600"> — {STAGE_HINTS[stage]}</span>
                    </span>
                  </label>
                </li>
              ))}
            </ul>
            <FieldIssue path="stages" />
            {field.value.map((_, i) => (
              <FieldIssue key={i} path={`stages.${i}`} />
            ))}
          </fieldset>
        )}
      />
    </Section>
  );
}

function CautionRow({ index, text, onChange, onRemove }: { index: number; text: string; onChange: (text: string) => void; onRemove: () => void }) {
  const path = `cautions.${index}`;
  return (
    <li className="flex items-start gap-2">
      <div className="flex-1">
        <textarea
          rows={2}
          aria-label={`Caution ${index + 1}`}
          className="field-input py-2"
          value={text}
          onChange={(e) => onChange(e.target.value)}
          {...useIssueProps(path)}
        />
        <FieldIssue path={path} />
      </div>
      <button type="button" className="btn-quiet px-3" onClick={onRemove}>
        <span aria-hidden="true">✕</span> Remove<span className="sr-only"> caution {index + 1}</span>
      </button>
    </li>
  );
}
