import { useEffect, useRef, useState } from 'react';
import { DndContext, closestCenter, type DragEndEvent } from '@dnd-kit/core';
import { SortableContext, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import type { PublicStep } from '../../../lib/procedure/public-view';
import { useTrainer } from '../context';
import { stepListAccessibility, useStepListSensors } from '../../step-list-dnd';

// Order: take steps from the pile one by one, then fix the order by drag, by keyboard (the handle
// picks up with Space and moves with the arrows) or with the move buttons.

type Focus = { key: string; action: 'place' | 'up' | 'down' | 'remove' | 'handle' } | { key: 'heading'; action: 'order' | 'pile' };

export default function OrderStage() {
  const steps = useTrainer((s) => s.procedure.steps);
  const sequence = useTrainer((s) => s.drafts.order.sequence);
  const placeStep = useTrainer((s) => s.placeStep);
  const moveStep = useTrainer((s) => s.moveStep);
  const removeStep = useTrainer((s) => s.removeStep);

  const byKey = new Map(steps.map((s) => [s.key, s] as const));
  const remaining = steps.filter((s) => !sequence.includes(s.key));
  const placed = sequence.map((key) => byKey.get(key) ?? { key, text: key, parts: [] });

  // Buttons vanish or move when the lists change; focus follows to where the learner's next press goes.
  const targets = useRef(new Map<string, HTMLElement>());
  const [focus, setFocus] = useState<Focus | null>(null);
  const register = (id: string) => (el: HTMLElement | null) => {
    if (el) targets.current.set(id, el);
    else targets.current.delete(id);
  };
  useEffect(() => {
    if (!focus) return;
    targets.current.get(`${focus.action}:${focus.key}`)?.focus();
    setFocus(null);
  }, [focus]);

  const place = (key: string) => {
    const index = remaining.findIndex((s) => s.key === key);
    const after = remaining.filter((s) => s.key !== key);
    placeStep(key);
    const next = after[Math.min(index, after.length - 1)];
    setFocus(next ? { key: next.key, action: 'place' } : { key: 'heading', action: 'order' });
  };
  const move = (key: string, to: number) => {
    const from = sequence.indexOf(key);
    moveStep(from, to);
    const last = sequence.length - 1;
    // A button that just became disabled cannot hold focus: use its partner.
    const action = to < from ? (to === 0 ? 'down' : 'up') : to === last ? 'up' : 'down';
    setFocus({ key, action });
  };
  const remove = (key: string) => {
    const index = sequence.indexOf(key);
    const after = sequence.filter((k) => k !== key);
    removeStep(key);
    const next = after[Math.min(index, after.length - 1)];
    setFocus(next ? { key: next, action: 'remove' } : { key: 'heading', action: 'pile' });
  };

  const sensors = useStepListSensors();
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over || active.id === over.id) return;
    const from = sequence.indexOf(String(active.id));
    const to = sequence.indexOf(String(over.id));
    if (from >= 0 && to >= 0) moveStep(from, to);
  };
  const position = (id: string | number) => sequence.indexOf(String(id)) + 1;
  const short = (id: string | number) => byKey.get(String(id))?.text ?? String(id);
  const accessibility = stepListAccessibility(position, short);

  return (
    <div className="space-y-6">
      <section aria-labelledby="pile-heading">
        <h3 id="pile-heading" ref={register('pile:heading')} tabIndex={-1} className="text-lg font-bold">
          Steps to place <span className="font-normal text-steel-600">({remaining.length} left)</span>
        </h3>
        {remaining.length === 0 ? (
          <p className="mt-2 text-steel-700">Every step is in your order. Check the order, then check the stage.</p>
        ) : (
          <ul className="mt-2 space-y-2">
            {remaining.map((step) => (
              <li key={step.key} className="flex items-start gap-3 rounded-lg border border-steel-200 bg-steel-50 p-3">
                <StepText step={step} id={`pile-text-${step.key}`} />
                <button
                  type="button"
                  ref={register(`place:${step.key}`)}
                  className="btn-quiet shrink-0 px-3"
                  aria-describedby={`pile-text-${step.key}`}
                  onClick={() => place(step.key)}
                >
                  Place next
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="order-heading">
        <h3 id="order-heading" ref={register('order:heading')} tabIndex={-1} className="text-lg font-bold">
          Your order <span className="font-normal text-steel-600">({sequence.length} placed)</span>
        </h3>
        {sequence.length === 0 ? (
          <p className="mt-2 text-steel-700">Nothing placed yet: press “Place next” on the step you would do first.</p>
        ) : (
          <DndContext
            sensors={sensors}
            collisionDetection={closestCenter}
            onDragEnd={onDragEnd}
            accessibility={accessibility}
          >
            <SortableContext items={sequence} strategy={verticalListSortingStrategy}>
              <ol className="mt-2 space-y-2">
                {placed.map((step, index) => (
                  <SortableStep
                    key={step.key}
                    step={step}
                    index={index}
                    count={sequence.length}
                    register={register}
                    onUp={() => move(step.key, index - 1)}
                    onDown={() => move(step.key, index + 1)}
                    onRemove={() => remove(step.key)}
                  />
                ))}
              </ol>
            </SortableContext>
          </DndContext>
        )}
      </section>
    </div>
  );
}

function StepText({ step, id }: { step: PublicStep; id: string }) {
  return (
    <div id={id} className="min-w-0 flex-1">
      <p className="text-steel-900">{step.text}</p>
      {step.caution && (
        <p className="mt-1 flex gap-1 text-sm font-medium text-brass-800">
          <span aria-hidden="true">⚠</span>
          <span>
            <span className="sr-only">Caution: </span>
            {step.caution}
          </span>
        </p>
      )}
    </div>
  );
}

interface SortableStepProps {
  step: PublicStep;
  index: number;
  count: number;
  register: (id: string) => (el: HTMLElement | null) => void;
  onUp: () => void;
  onDown: () => void;
  onRemove: () => void;
}

function SortableStep({ step, index, count, register, onUp, onDown, onRemove }: SortableStepProps) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: step.key });
  const textId = `order-text-${step.key}`;
  const handleRef = register(`handle:${step.key}`);
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-lg border bg-white p-3 ${isDragging ? 'relative z-10 border-brass-500 shadow-lg' : 'border-steel-200'}`}
    >
      <div className="flex items-start gap-3">
        <button
          type="button"
          ref={(el) => {
            setActivatorNodeRef(el);
            handleRef(el);
          }}
          {...attributes}
          {...listeners}
          aria-label={`Drag step ${index + 1} to a new place`}
          aria-describedby={`${attributes['aria-describedby']} ${textId}`}
          className="flex min-h-touch min-w-touch shrink-0 cursor-grab touch-none items-center justify-center rounded-lg border border-steel-300 bg-steel-50 text-lg font-bold text-steel-800 active:cursor-grabbing"
        >
          <span aria-hidden="true">⠿ {index + 1}</span>
        </button>
        <StepText step={step} id={textId} />
      </div>
      <div className="mt-2 flex flex-wrap justify-end gap-2">
        <button type="button" ref={register(`up:${step.key}`)} className="btn-quiet px-3 text-sm" disabled={index === 0} aria-describedby={textId} onClick={onUp}>
          <span aria-hidden="true">↑</span> <span className="sr-only">Move </span>Up
        </button>
        <button type="button" ref={register(`down:${step.key}`)} className="btn-quiet px-3 text-sm" disabled={index === count - 1} aria-describedby={textId} onClick={onDown}>
          <span aria-hidden="true">↓</span> <span className="sr-only">Move </span>Down
        </button>
        <button type="button" ref={register(`remove:${step.key}`)} className="btn-quiet px-3 text-sm" aria-describedby={textId} onClick={onRemove}>
          <span aria-hidden="true">✕</span> Remove
        </button>
      </div>
    </li>
  );
}
