import { useEffect, useRef, useState } from 'react';
import { useTrainer } from '../context';
import { holeLabel, pinSize } from '../labels';

// Pins: pick a pin or sleeve from the tray, then the hole it goes in. The scene does the same by pointer.

const PIN_KINDS = new Set(['dowel-pin', 'sleeve']);
const HOLE_KINDS = new Set(['locating-hole', 'threaded-hole']);

export default function PinsStage() {
  const parts = useTrainer((s) => s.procedure.parts);
  const anchors = useTrainer((s) => s.procedure.anchors);
  const placements = useTrainer((s) => s.drafts.pins.placements);
  const selectedPin = useTrainer((s) => s.selectedPin);
  const selectPin = useTrainer((s) => s.selectPin);
  const placePin = useTrainer((s) => s.placePin);
  const removePin = useTrainer((s) => s.removePin);
  const announce = useTrainer((s) => s.announce);

  const pins = parts.filter((p) => PIN_KINDS.has(p.kind));
  // Locating holes first: two of them are easier to find above a row of eight bolt holes.
  const holes = anchors.filter((a) => HOLE_KINDS.has(a.kind)).sort((a, b) => Number(b.kind === 'locating-hole') - Number(a.kind === 'locating-hole'));
  const partOf = new Map(parts.map((p) => [p.key, p] as const));
  const inHole = new Map(placements.map((p) => [p.anchor, p.part] as const));
  const left = (key: string) => (partOf.get(key)?.count ?? 1) - placements.filter((p) => p.part === key).length;
  const describe = (key: string) => {
    const part = partOf.get(key);
    return part ? `${part.name}${part.pin ? ` (${pinSize(part)})` : ''}` : key;
  };

  // "Put pin here" turns into "Take out" and back: focus stays on the hole's button.
  const buttons = useRef(new Map<string, HTMLButtonElement>());
  const [focusHole, setFocusHole] = useState<string | null>(null);
  useEffect(() => {
    if (focusHole) buttons.current.get(focusHole)?.focus();
    setFocusHole(null);
  }, [focusHole]);

  const put = (anchor: string) => {
    if (!selectedPin) {
      announce('Pick a pin from the tray first.');
      return;
    }
    placePin(anchor);
    setFocusHole(anchor);
  };

  return (
    <div className="space-y-6">
      <section aria-labelledby="tray-heading">
        <h3 id="tray-heading" className="text-lg font-bold">
          Tray
        </h3>
        <p className="text-sm text-steel-600">Pick a pin, then the hole it goes in. Not every pin in the kit is for this job.</p>
        <div className="mt-2 flex flex-wrap gap-2">
          {pins.map((pin) => {
            const remaining = left(pin.key);
            const picked = selectedPin === pin.key;
            return (
              <button
                key={pin.key}
                type="button"
                aria-pressed={picked}
                disabled={remaining <= 0 && !picked}
                onClick={() => selectPin(picked ? null : pin.key)}
                className={[
                  'flex min-h-touch flex-col items-start rounded-lg border-2 px-4 py-2 text-left disabled:cursor-not-allowed disabled:opacity-50',
                  picked ? 'border-brass-500 bg-brass-100' : 'border-steel-300 bg-white hover:bg-steel-100',
                ].join(' ')}
              >
                <span className="font-semibold">
                  {picked && <span aria-hidden="true">✋ </span>}
                  {pin.name}
                </span>
                <span className="text-sm text-steel-700">
                  {pinSize(pin)} · {remaining > 0 ? `${remaining} in the tray` : 'none left'}
                </span>
              </button>
            );
          })}
        </div>
        <p className="mt-2 text-sm font-medium text-steel-800" aria-hidden="true">
          {selectedPin ? `Holding: ${describe(selectedPin)}. Now choose a hole.` : 'Nothing picked.'}
        </p>
      </section>

      <section aria-labelledby="holes-heading">
        <h3 id="holes-heading" className="text-lg font-bold">
          Holes
        </h3>
        <ul className="mt-2 space-y-2">
          {holes.map((hole) => {
            const pin = inHole.get(hole.key);
            const labelId = `hole-${hole.key}`;
            return (
              <li key={hole.key} className="flex flex-wrap items-center gap-3 rounded-lg border border-steel-200 bg-steel-50 p-3">
                <div className="min-w-0 flex-1" id={labelId}>
                  <p className="font-semibold text-steel-900">{holeLabel(hole)}</p>
                  <p className="text-sm text-steel-700">{pin ? `Holds: ${describe(pin)}` : 'Empty'}</p>
                </div>
                {pin ? (
                  <button
                    type="button"
                    ref={(el) => void (el ? buttons.current.set(hole.key, el) : buttons.current.delete(hole.key))}
                    className="btn-quiet px-3"
                    aria-describedby={labelId}
                    onClick={() => {
                      removePin(hole.key);
                      setFocusHole(hole.key);
                    }}
                  >
                    Take out
                  </button>
                ) : (
                  <button
                    type="button"
                    ref={(el) => void (el ? buttons.current.set(hole.key, el) : buttons.current.delete(hole.key))}
                    // aria-disabled keeps it focusable, so the keyboard path and its hint never vanish.
                    aria-disabled={!selectedPin}
                    className={`btn-quiet px-3 ${selectedPin ? '' : 'opacity-60'}`}
                    aria-describedby={labelId}
                    onClick={() => put(hole.key)}
                  >
                    Put pin here
                  </button>
                )}
              </li>
            );
          })}
        </ul>
      </section>

      <section aria-labelledby="placed-heading">
        <h3 id="placed-heading" className="text-lg font-bold">
          Placed pins
        </h3>
        {placements.length === 0 ? (
          <p className="mt-1 text-steel-700">None yet.</p>
        ) : (
          <ul className="mt-1 list-disc space-y-1 pl-5">
            {placements.map((p) => {
              const hole = anchors.find((a) => a.key === p.anchor);
              return (
                <li key={p.anchor}>
                  {describe(p.part)} in {hole ? holeLabel(hole) : p.anchor}
                </li>
              );
            })}
          </ul>
        )}
      </section>
    </div>
  );
}
