import { useEffect, useRef, useState } from 'react';
import { Controller, useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { DndContext, closestCenter, type DragEndEvent } from '@dnd-kit/core';
import { SortableContext, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { applyMarks, marksFromSteps, moveItem } from '../../lib/editor/ordering';
import { newStepKey } from '../../lib/editor/keys';
import type { EditorValues } from '../../lib/editor/values';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { PrecedenceGraph } from './PrecedenceGraph';
import { Section } from './Section';
import { stepListAccessibility, useStepListSensors } from '../step-list-dnd';

// Steps as learners read them, in order. Drag a step (or use the buttons, or pick it up with Space and move
// it with the arrows); mark a step that may come in any order with the one before it. The list and marks are
// stored as `after` constraints, drawn below as a graph.

export function StepsSection() {
  const { control, getValues, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'steps' });
  const customOrder = useWatch({ control, name: 'customOrder' });
  const [focus, setFocus] = useState<string | null>(null);
  const targets = useRef(new Map<string, HTMLElement>());
  const register = (id: string) => (el: HTMLElement | null) => {
    if (el) targets.current.set(id, el);
    else targets.current.delete(id);
  };
  useEffect(() => {
    if (!focus) return;
    targets.current.get(focus)?.focus();
    setFocus(null);
  }, [focus]);

  /** Rewrites every step's `after` from the list and marks (not while custom constraints are kept). */
  const rewrite = (marks = getValues('anyOrder')) => {
    if (getValues('customOrder')) return;
    const steps = applyMarks(getValues('steps'), marks);
    steps.forEach((s, i) => setValue(`steps.${i}.after`, s.after, { shouldDirty: true }));
  };
  const moveStep = (from: number, to: number) => {
    if (to < 0 || to >= fields.length) return;
    move(from, to);
    const marks = moveItem(getValues('anyOrder'), from, to);
    setValue('anyOrder', marks);
    setValue('customOrder', false);
    rewrite(marks);
  };
  const addStep = () => {
    const keys = getValues('steps').map((s) => s.key);
    append({ key: newStepKey(keys), text: '', parts: [], caution: '', after: [] });
    const marks = [...getValues('anyOrder').slice(0, keys.length), false];
    setValue('anyOrder', marks);
    rewrite(marks);
  };
  const removeStep = (index: number) => {
    const key = getValues(`steps.${index}.key`);
    remove(index);
    const marks = getValues('anyOrder').filter((_, i) => i !== index);
    setValue('anyOrder', marks);
    if (getValues('customOrder')) {
      getValues('steps').forEach((s, i) => setValue(`steps.${i}.after`, s.after.filter((k) => k !== key)));
    } else rewrite(marks);
  };
  const setMark = (index: number, on: boolean) => {
    const marks = getValues('anyOrder').map((m, i) => (i === index ? on : m));
    setValue('anyOrder', marks);
    setValue('customOrder', false);
    rewrite(marks);
  };
  const useListOrder = () => {
    const { anyOrder } = marksFromSteps(getValues('steps'));
    setValue('customOrder', false);
    setValue('anyOrder', anyOrder);
    rewrite(anyOrder);
  };

  const sensors = useStepListSensors();
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over || active.id === over.id) return;
    const from = fields.findIndex((f) => f.id === active.id);
    const to = fields.findIndex((f) => f.id === over.id);
    if (from >= 0 && to >= 0) moveStep(from, to);
  };
  const position = (id: string | number) => fields.findIndex((f) => f.id === id) + 1;
  // By the step's key, which never changes, so the words are right whether or not the list has moved yet.
  const short = (id: string | number) => {
    const key = fields.find((f) => f.id === id)?.key;
    return getValues('steps').find((s) => s.key === key)?.text || 'a step with no text yet';
  };
  const accessibility = stepListAccessibility(position, short);

  return (
    <Section
      id="steps"
      title="Steps"
      intro="Write each step as a learner reads it, without giving the order away. Put them in order; tick “any order with the previous step” where the class may swap them."
    >
      {customOrder && (
        <div className="rounded-lg border border-brass-500 bg-brass-50 p-3 text-brass-900" role="note">
          <p>
            <span aria-hidden="true">⚠ </span>This procedure keeps finer constraints than the list and its marks can say (each step's “waits
            for” list below). They stay as they are until you reorder the steps or change a mark.
          </p>
          <button type="button" className="btn-quiet mt-2" onClick={useListOrder}>
            Use the list order and marks instead
          </button>
        </div>
      )}
      <FieldIssue path="steps" />
      {fields.length > 0 && (
        <DndContext
          sensors={sensors}
          collisionDetection={closestCenter}
          onDragEnd={onDragEnd}
          accessibility={accessibility}
        >
          <SortableContext items={fields.map((f) => f.id)} strategy={verticalListSortingStrategy}>
            <ol className="space-y-3" aria-label="Steps in order">
              {fields.map((field, index) => (
                <StepRow
                  key={field.id}
                  id={field.id}
                  index={index}
                  count={fields.length}
                  register={register}
                  onMove={(to) => {
                    moveStep(index, to);
                    setFocus(`${to < index ? (to === 0 ? 'down' : 'up') : to === fields.length - 1 ? 'up' : 'down'}:${field.id}`);
                  }}
                  onRemove={() => removeStep(index)}
                  onMark={(on) => setMark(index, on)}
                />
              ))}
            </ol>
          </SortableContext>
        </DndContext>
      )}
      <button type="button" className="btn-primary" onClick={addStep}>
        Add a step
      </button>
      <PrecedenceGraph />
    </Section>
  );
}

interface StepRowProps {
  id: string;
  index: number;
  count: number;
  register: (id: string) => (el: HTMLElement | null) => void;
  onMove: (to: number) => void;
  onRemove: () => void;
  onMark: (on: boolean) => void;
}

function StepRow({ id, index, count, register: registerTarget, onMove, onRemove, onMark }: StepRowProps) {
  const { register, control, setValue } = useFormContext<EditorValues>();
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id });
  const parts = useWatch({ control, name: 'parts' });
  const steps = useWatch({ control, name: 'steps' });
  const mark = useWatch({ control, name: `anyOrder.${index}` }) ?? false;
  const step = steps[index];
  const at = `steps.${index}`;
  const textIssue = useIssueProps(`${at}.text`);
  const cautionIssue = useIssueProps(`${at}.caution`);
  // For the one render between a step's removal and its row's, there is nothing to show.
  if (!step) return null;
  const label = `Step ${index + 1}`;
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-lg border bg-white p-3 ${isDragging ? 'relative z-10 border-brass-500 shadow-lg' : 'border-steel-200'}`}
    >
      <fieldset aria-label={label}>
        <div className="flex items-start gap-3">
          <button
            type="button"
            ref={setActivatorNodeRef}
            {...attributes}
            {...listeners}
            aria-label={`Drag step ${index + 1} to a new place`}
            className="flex min-h-touch min-w-touch shrink-0 cursor-grab touch-none items-center justify-center rounded-lg border border-steel-300 bg-steel-50 text-lg font-bold text-steel-800 active:cursor-grabbing"
          >
            <span aria-hidden="true">⠿ {index + 1}</span>
          </button>
          <div className="min-w-0 flex-1 space-y-3">
            <div>
              <label htmlFor={`${at}-text`} className="field-label">{label}: what the learner does</label>
              <textarea id={`${at}-text`} rows={2} className="field-input py-2" {...register(`steps.${index}.text`)} {...textIssue} />
              <FieldIssue path={`${at}.text`} />
              <FieldIssue path={`${at}.key`} />
            </div>
            <Controller
              control={control}
              name={`steps.${index}.parts`}
              render={({ field }) => (
                <fieldset>
                  <legend className="field-label">Parts it uses</legend>
                  {parts.length === 0 ? (
                    <p className="text-sm text-steel-500">Add parts to the kit first.</p>
                  ) : (
                    <ul className="flex flex-wrap gap-x-4">
                      {parts.map((part) => (
                        <li key={part.key}>
                          <label className="flex min-h-touch items-center gap-2">
                            <input
                              type="checkbox"
                              className="h-5 w-5"
                              checked={field.value.includes(part.key)}
                              onChange={(e) =>
                                field.onChange(e.target.checked ? [...field.value, part.key] : field.value.filter((k) => k !== part.key))
                              }
                            />
                            {part.name || part.key}
                          </label>
                        </li>
                      ))}
                    </ul>
                  )}
                  {field.value.map((_, j) => (
                    <FieldIssue key={j} path={`${at}.parts.${j}`} />
                  ))}
                </fieldset>
              )}
            />
            <div>
              <label htmlFor={`${at}-caution`} className="field-label">Caution for this step (optional)</label>
              <input id={`${at}-caution`} className="field-input" {...register(`steps.${index}.caution`)} {...cautionIssue} />
              <FieldIssue path={`${at}.caution`} />
            </div>
            {index > 0 && (
              <label className="flex min-h-touch items-center gap-3">
                <input type="checkbox" className="h-5 w-5" checked={mark} onChange={(e) => onMark(e.target.checked)} />
                May come in any order with the previous step
              </label>
            )}
            <details>
              <summary className="cursor-pointer text-sm font-semibold text-steel-700">
                Waits for: {step.after.length === 0 ? 'nothing' : step.after.map((k) => stepNumber(steps, k)).join(', ')}
              </summary>
              <Controller
                control={control}
                name={`steps.${index}.after`}
                render={({ field }) => (
                  <fieldset className="mt-2">
                    <legend className="text-sm text-steel-600">Steps that must be done before this one (changing these keeps your own constraints).</legend>
                    <ul>
                      {steps.map((other, j) =>
                        j === index ? null : (
                          <li key={other.key}>
                            <label className="flex min-h-touch items-center gap-2">
                              <input
                                type="checkbox"
                                className="h-5 w-5"
                                checked={field.value.includes(other.key)}
                                onChange={(e) => {
                                  setValue('customOrder', true);
                                  field.onChange(e.target.checked ? [...field.value, other.key] : field.value.filter((k) => k !== other.key));
                                }}
                              />
                              Step {j + 1}: {other.text || '(no text yet)'}
                            </label>
                          </li>
                        ),
                      )}
                    </ul>
                  </fieldset>
                )}
              />
            </details>
            <FieldIssue path={`${at}.after`} />
            {step.after.map((_, j) => (
              <FieldIssue key={j} path={`${at}.after.${j}`} />
            ))}
          </div>
        </div>
        <div className="mt-2 flex flex-wrap justify-end gap-2">
          <button type="button" ref={registerTarget(`up:${id}`)} className="btn-quiet px-3 text-sm" disabled={index === 0} onClick={() => onMove(index - 1)}>
            <span aria-hidden="true">↑</span> Up<span className="sr-only">: move step {index + 1} up</span>
          </button>
          <button type="button" ref={registerTarget(`down:${id}`)} className="btn-quiet px-3 text-sm" disabled={index === count - 1} onClick={() => onMove(index + 1)}>
            <span aria-hidden="true">↓</span> Down<span className="sr-only">: move step {index + 1} down</span>
          </button>
          <button type="button" className="btn-quiet px-3 text-sm" onClick={onRemove}>
            <span aria-hidden="true">✕</span> Remove<span className="sr-only"> step {index + 1}</span>
          </button>
        </div>
      </fieldset>
    </li>
  );
}

function stepNumber(steps: readonly { key: string }[], key: string): string {
  const i = steps.findIndex((s) => s.key === key);
  return i >= 0 ? `step ${i + 1}` : `${key} (missing)`;
}
