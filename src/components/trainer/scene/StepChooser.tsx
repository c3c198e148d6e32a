import { useEffect, useId, useRef, type RefObject, type SyntheticEvent } from 'react';
import { Html } from '@react-three/drei';
import { useThree } from '@react-three/fiber';
import type { PublicProcedure, PublicStep } from '~/lib/procedure/public-view';
import { useTrainer } from '../context';
import type { SceneLayout } from './layout';
import { scenePoint } from './points';

// The Order stage on the model: a click on a part opens this small card beside it, listing the steps
// on that part not yet in the learner's order. Its buttons are real DOM buttons, so it works by keyboard.

/** Steps that name the part and are not in the order yet, in the order the pile shows them. */
export function unplacedStepsFor(procedure: PublicProcedure, sequence: readonly string[], partKey: string): PublicStep[] {
  return procedure.steps.filter((s) => s.parts.includes(partKey) && !sequence.includes(s.key));
}

/** Gap between the point on the part and the card, CSS pixels. */
const GAP_PX = 14;

interface StepChooserProps {
  layout: SceneLayout;
  /** The part whose steps are offered. */
  part: string;
  /** Key of what was clicked (the part, or one bolt of it): the card sits beside it. */
  at: string;
  onPlace: (stepKey: string) => void;
  onClose: () => void;
}

export function StepChooser({ layout, part, at, onPlace, onClose }: StepChooserProps) {
  const procedure = useTrainer((s) => s.procedure);
  const stage = useTrainer((s) => s.stage);
  const explode = useTrainer((s) => s.explode);
  const sequence = useTrainer((s) => s.drafts.order.sequence);
  const placements = useTrainer((s) => s.drafts.pins.placements);
  const camera = useThree((s) => s.camera);
  const box = useRef<HTMLDivElement>(null);

  // Escape, or a press anywhere outside the card (canvas or page), puts it away.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') onClose();
    };
    const onPress = (e: PointerEvent) => {
      if (!box.current?.contains(e.target as Node)) onClose();
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('pointerdown', onPress, true);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('pointerdown', onPress, true);
    };
  }, [onClose]);

  const point = scenePoint(procedure, layout, { stage, explode, sequence, placements }, at);
  if (!point) return null;

  // The card opens towards the middle of the view, so the canvas edge does not cut it off.
  camera.updateMatrixWorld();
  const ndc = point.clone().project(camera);
  const dx = ndc.x > 0.2 ? `calc(-100% - ${GAP_PX}px)` : `${GAP_PX}px`;
  const dy = ndc.y > 0.4 ? '0%' : ndc.y < -0.4 ? '-100%' : '-50%';

  const partName = procedure.parts.find((p) => p.key === part)?.name ?? part;
  const steps = unplacedStepsFor(procedure, sequence, part);
  const named = procedure.steps.some((s) => s.parts.includes(part));
  const note = named ? `All steps for ${partName} are placed.` : `No step in this procedure acts on ${partName}.`;

  return (
    <Html position={point} zIndexRange={[60, 50]}>
      <ChooserCard
        box={box}
        title={`Steps for ${partName}`}
        steps={steps}
        note={note}
        shift={`translate(${dx}, ${dy})`}
        onPlace={onPlace}
        onClose={onClose}
      />
    </Html>
  );
}

interface ChooserCardProps {
  box: RefObject<HTMLDivElement | null>;
  title: string;
  steps: PublicStep[];
  note: string;
  shift: string;
  onPlace: (stepKey: string) => void;
  onClose: () => void;
}

/** Rendered in the overlay's own React root: plain props only, no trainer context. */
function ChooserCard({ box, title, steps, note, shift, onPlace, onClose }: ChooserCardProps) {
  const first = useRef<HTMLButtonElement>(null);
  const noteId = useId();
  // No scrolling on focus: the canvas box clips overflow, and scrolling it would shift the whole view.
  useEffect(() => first.current?.focus({ preventScroll: true }), []);

  // Presses on the card are the card's: the canvas behind must not pick a part or start an orbit.
  const keep = (e: SyntheticEvent) => e.stopPropagation();

  return (
    <div
      ref={box}
      role="dialog"
      aria-label={title}
      aria-describedby={steps.length === 0 ? noteId : undefined}
      data-step-chooser=""
      className="panel w-max max-w-xs p-3 text-sm sm:p-3"
      style={{ transform: shift }}
      onPointerDown={keep}
      onPointerUp={keep}
      onPointerMove={keep}
      onClick={keep}
      onDoubleClick={keep}
      onContextMenu={keep}
      onWheel={keep}
    >
      <p className="mb-2 font-semibold text-steel-900">{title}</p>
      {steps.length === 0 ? (
        <>
          <p id={noteId} className="mb-2 whitespace-normal text-steel-700">
            {note}
          </p>
          <button ref={first} type="button" className="btn-quiet min-h-touch px-3 text-sm" onClick={onClose}>
            Close
          </button>
        </>
      ) : (
        <ul className="space-y-2">
          {steps.map((step, i) => (
            <li key={step.key}>
              <button
                ref={i === 0 ? first : undefined}
                type="button"
                className="btn-quiet min-h-touch w-full justify-start whitespace-normal px-3 py-2 text-left text-sm"
                onClick={() => onPlace(step.key)}
              >
                <span>
                  <span className="font-semibold">Place:</span> {step.text}
                </span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
