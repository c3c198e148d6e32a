import { useState } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { getModel } from '@models/index';
import { libraryModels, partFromModel } from '../../lib/editor/library';
import type { EditorValues } from '../../lib/editor/values';
import { pinSize } from '../trainer/labels';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { Section } from './Section';

// The kit, chosen from the part model library: each part is drawn with a model and named as the class says it.

const MODELS = libraryModels();

export function PartsSection() {
  const { control, getValues, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'parts' });
  const [choice, setChoice] = useState(MODELS[0]!.key);

  const add = () => {
    const model = getModel(choice);
    if (model) append(partFromModel(model, getValues('parts').map((p) => p.key)));
  };
  const removePart = (index: number) => {
    const key = getValues(`parts.${index}.key`);
    remove(index);
    // Its holes go with it; steps, seats and groups that still name it are reported at publish.
    setValue('anchors', getValues('anchors').filter((a) => a.part !== key));
  };

  return (
    <Section id="parts" title="Parts" intro="Choose the parts in the kit from the part library. Mark a decoy: it sits in the kit but must not be used.">
      <div className="flex flex-wrap items-end gap-2">
        <div className="min-w-64 flex-1">
          <label htmlFor="library-model" className="field-label">Part from the library</label>
          <select id="library-model" className="field-input" value={choice} onChange={(e) => setChoice(e.target.value)}>
            {MODELS.map((m) => (
              <option key={m.key} value={m.key}>
                {m.name} ({m.kind})
              </option>
            ))}
          </select>
        </div>
        <button type="button" className="btn-primary" onClick={add}>
          Add part
        </button>
      </div>
      <FieldIssue path="parts" />
      {fields.length === 0 ? (
        <p className="text-steel-600">No parts yet.</p>
      ) : (
        <ul className="space-y-3" aria-label="Parts in the kit">
          {fields.map((field, index) => (
            <PartRow key={field.id} index={index} onRemove={() => removePart(index)} />
          ))}
        </ul>
      )}
    </Section>
  );
}

function PartRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { register, control } = useFormContext<EditorValues>();
  const part = useWatch({ control, name: `parts.${index}` });
  const model = getModel(part.model);
  const label = model?.name ?? part.model;
  const at = `parts.${index}`;
  return (
    <li>
      <fieldset className="rounded-lg border border-steel-200 p-3">
        <legend className="px-1 font-semibold">{label}</legend>
        <p className="mb-2 text-sm text-steel-600">
          {part.kind}
          {part.pin && <> · {pinSize(part)}</>} · key <code>{part.key}</code>
        </p>
        <div className="grid gap-3 sm:grid-cols-[2fr_1fr_auto_auto] sm:items-end">
          <div>
            <label htmlFor={`${at}-name`} className="field-label">Name in class</label>
            <input id={`${at}-name`} className="field-input" {...register(`parts.${index}.name`)} {...useIssueProps(`${at}.name`)} />
          </div>
          <div>
            <label htmlFor={`${at}-count`} className="field-label">In the kit</label>
            <input
              id={`${at}-count`}
              type="number"
              min={1}
              max={64}
              className="field-input"
              {...register(`parts.${index}.count`, { valueAsNumber: true })}
              {...useIssueProps(`${at}.count`)}
            />
          </div>
          <label className="flex min-h-touch items-center gap-2">
            <input type="checkbox" className="h-5 w-5" {...register(`parts.${index}.decoy`)} />
            Decoy
          </label>
          <button type="button" className="btn-quiet px-3" onClick={onRemove}>
            <span aria-hidden="true">✕</span> Remove<span className="sr-only"> {label}</span>
          </button>
        </div>
        <FieldIssue path={`${at}.name`} />
        <FieldIssue path={`${at}.count`} />
        <FieldIssue path={`${at}.key`} />
        <FieldIssue path={`${at}.pin`} />
        <FieldIssue path={at} />
      </fieldset>
    </li>
  );
}
