import { useTrainer } from '../context';
import { NumberField } from '../NumberField';
import { BINDING_MESSAGE, allowedCrankDelta, crankBinds } from '../scene/crank';

// Final check: account for every fastener and turn the crankshaft over. The button is the keyboard
// path for the crank; the scene lets the learner drag it round.

const FASTENER_KINDS = new Set(['bolt', 'nut']);
const QUARTERS = ['', '¼', '½', '¾'];

/** To the nearest quarter: 1.75 → '1¾ turns', 0.25 → '¼ turn' (a drag can leave any fraction). */
export function turnsWords(turns: number): string {
  const quarters = Math.round(turns * 4);
  const whole = Math.floor(quarters / 4);
  const rest = QUARTERS[quarters % 4]!;
  const amount = whole === 0 && rest ? rest : `${whole}${rest}`;
  return `${amount} ${quarters <= 4 ? 'turn' : 'turns'}`;
}

export default function FinalCheckStage() {
  const parts = useTrainer((s) => s.procedure.parts);
  const draft = useTrainer((s) => s.drafts['final-check']);
  const binds = useTrainer((s) => crankBinds(s.results));
  const announce = useTrainer((s) => s.announce);
  const setFastenersCounted = useTrainer((s) => s.setFastenersCounted);
  const setLeftover = useTrainer((s) => s.setLeftover);
  const addCrankTurn = useTrainer((s) => s.addCrankTurn);

  const fasteners = parts.filter((p) => FASTENER_KINDS.has(p.kind));
  const kitCount = fasteners.reduce((sum, p) => sum + p.count, 0);
  // Same rule as dragging in the scene: a binding crank stops, and says why.
  const turn = () => {
    const delta = allowedCrankDelta(draft.crankTurns, 0.25, binds);
    if (delta > 0) addCrankTurn(delta);
    else announce(BINDING_MESSAGE);
  };

  return (
    <div className="space-y-6">
      <section aria-labelledby="count-heading">
        <h3 id="count-heading" className="text-lg font-bold">
          Count the fasteners
        </h3>
        <p className="text-steel-700">
          The kit held {kitCount} {kitCount === 1 ? 'fastener' : 'fasteners'}
          {fasteners.length > 0 && `: ${fasteners.map((p) => `${p.count} × ${p.name}`).join(', ')}`}.
        </p>
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <div>
            <label htmlFor="fasteners-counted" className="field-label">
              Fasteners installed
            </label>
            <NumberField id="fasteners-counted" integer min={0} value={draft.fastenersCounted} onChange={setFastenersCounted} />
          </div>
          <div>
            <label htmlFor="fasteners-leftover" className="field-label">
              Left over in the tray
            </label>
            <NumberField id="fasteners-leftover" integer min={0} value={draft.leftover} onChange={setLeftover} />
          </div>
        </div>
      </section>

      <section aria-labelledby="crank-heading">
        <h3 id="crank-heading" className="text-lg font-bold">
          Turn the crankshaft
        </h3>
        <p className="text-steel-700">Turn it over by hand to feel that nothing binds. Drag the crankshaft in the 3D view, or use the button.</p>
        <div className="mt-3 flex flex-wrap items-center gap-4">
          <button type="button" className="btn-quiet" onClick={turn} aria-describedby="crank-turns">
            <span aria-hidden="true">↻</span> Turn crankshaft ¼ turn
          </button>
          <p id="crank-turns" className="text-lg font-semibold">
            Turned so far: {draft.crankTurns === 0 ? 'not yet' : turnsWords(draft.crankTurns)}
          </p>
        </div>
        {binds && (
          <p className="mt-3 flex gap-2 rounded-lg border border-signal-500 bg-signal-50 p-3 font-medium text-signal-700">
            <span aria-hidden="true">⚠</span>
            <span>{BINDING_MESSAGE}</span>
          </p>
        )}
      </section>
    </div>
  );
}
