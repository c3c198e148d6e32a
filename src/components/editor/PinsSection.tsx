import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { anchorsOfParts, withAnchors } from '../../lib/editor/library';
import type { EditorValues } from '../../lib/editor/values';
import { holeLabel, pinSize } from '../trainer/labels';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { Section } from './Section';

// Dowel pins and sleeves: which hole each one goes into, picked from the locating holes of the parts in
// the kit, and which other holes the learner is shown to choose from.

const PIN_KINDS = ['dowel-pin', 'sleeve'];

export function PinsSection() {
  const { control, getValues, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'pinSeats' });
  const parts = useWatch({ control, name: 'parts' });
  const anchors = useWatch({ control, name: 'anchors' });
  const seats = useWatch({ control, name: 'pinSeats' });
  const pins = parts.filter((p) => PIN_KINDS.includes(p.kind) && !p.decoy);
  const holes = anchorsOfParts(parts, ['locating-hole']);
  const shown = new Set(anchors.map((a) => a.key));
  const seated = new Set(seats.map((s) => s.anchor));

  const toggleHole = (key: string, on: boolean) => {
    const current = getValues('anchors');
    setValue('anchors', on ? withAnchors(current, [key], getValues('parts')) : current.filter((a) => a.key !== key), { shouldDirty: true });
  };

  return (
    <Section id="pins" title="Pins" intro="Pick the hole each dowel pin or sleeve goes into. Decoy pins get no hole.">
      {pins.length === 0 && <p className="text-steel-600">No dowel pins or sleeves in the kit (decoys aside).</p>}
      {holes.length === 0 && pins.length > 0 && <p className="text-steel-600">No part in the kit has locating holes: add the part the pins go into.</p>}
      <ul className="space-y-3" aria-label="Pin seats">
        {fields.map((field, index) => (
          <SeatRow key={field.id} index={index} onRemove={() => remove(index)} />
        ))}
      </ul>
      <button
        type="button"
        className="btn-quiet"
        disabled={pins.length === 0}
        onClick={() => append({ part: pins[0]?.key ?? '', anchor: '' })}
      >
        Add a pin seat
      </button>
      <FieldIssue path="pinSeats" />
      {holes.length > 0 && (
        <fieldset>
          <legend className="field-label">Holes the learner is shown</legend>
          <p className="mb-1 text-sm text-steel-500">Holes with a pin are always shown; add others to choose from.</p>
          <ul className="grid gap-x-4 sm:grid-cols-2">
            {holes.map(({ anchor }) => (
              <li key={anchor.key}>
                <label className="flex min-h-touch items-center gap-2">
                  <input
                    type="checkbox"
                    className="h-5 w-5"
                    checked={shown.has(anchor.key) || seated.has(anchor.key)}
                    disabled={seated.has(anchor.key)}
                    onChange={(e) => toggleHole(anchor.key, e.target.checked)}
                  />
                  {holeLabel(anchor)}
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
      )}
    </Section>
  );
}

function SeatRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { register, control, getValues, setValue } = useFormContext<EditorValues>();
  const parts = useWatch({ control, name: 'parts' });
  const seat = useWatch({ control, name: `pinSeats.${index}` });
  const pins = parts.filter((p) => PIN_KINDS.includes(p.kind));
  const holes = anchorsOfParts(parts, ['locating-hole']);
  const at = `pinSeats.${index}`;
  const pin = parts.find((p) => p.key === seat.part);
  return (
    <li>
      <fieldset className="rounded-lg border border-steel-200 p-3" aria-label={`Pin seat ${index + 1}`}>
        <div className="grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end">
          <div>
            <label htmlFor={`${at}-part`} className="field-label">Pin</label>
            <select id={`${at}-part`} className="field-input" {...register(`pinSeats.${index}.part`)} {...useIssueProps(`${at}.part`)}>
              <option value="">Choose a pin…</option>
              {pins.map((p) => (
                <option key={p.key} value={p.key}>
                  {p.name} {pinSize(p) && `(${pinSize(p)})`}
                  {p.decoy ? ' — decoy' : ''}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor={`${at}-anchor`} className="field-label">Hole</label>
            <select
              id={`${at}-anchor`}
              className="field-input"
              {...register(`pinSeats.${index}.anchor`, {
                // The hole joins the procedure's anchors, so the trainer draws it.
                onChange: (e) => setValue('anchors', withAnchors(getValues('anchors'), [e.target.value], getValues('parts'))),
              })}
              {...useIssueProps(`${at}.anchor`)}
            >
              <option value="">Choose a hole…</option>
              {holes.map(({ anchor }) => (
                <option key={anchor.key} value={anchor.key}>
                  {holeLabel(anchor)}
                  {pin?.pin && Math.abs(pin.pin.diameterMm - anchor.sizeMm) > 0.01 ? ' (other size)' : ''}
                </option>
              ))}
            </select>
          </div>
          <button type="button" className="btn-quiet px-3" onClick={onRemove}>
            <span aria-hidden="true">✕</span> Remove<span className="sr-only"> pin seat {index + 1}</span>
          </button>
        </div>
        <FieldIssue path={`${at}.part`} />
        <FieldIssue path={`${at}.anchor`} />
        <FieldIssue path={at} />
      </fieldset>
    </li>
  );
}
