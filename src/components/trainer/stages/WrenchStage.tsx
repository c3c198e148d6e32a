import { useState, type FormEvent } from 'react';
import { TORQUE_UNIT_IDS, type TorqueUnit } from '../../../lib/procedure/schema';
import type { PublicWrenchTask } from '../../../lib/procedure/public-view';
import { formatNumber, roundToResolution } from '../../../lib/torque';
import { ApiError, calculateWrenchSetting, type WrenchCalcAnswer } from '../api';
import { useTrainer } from '../context';
import { NumberField } from '../NumberField';

// Wrench: read the spec, look at the wrench on the bench, and dial the setting. The unit is the
// learner's to choose, because setting the right number in the wrong unit is the mistake to catch.

/** One click of the dial: the marks a common click wrench has in each unit. */
const DIAL_STEP: Record<TorqueUnit, number> = { 'in·lbf': 1, 'ft·lbf': 0.5, 'N·m': 0.5, 'kgf·m': 0.05 };

export function extensionWords(task: Pick<PublicWrenchTask, 'extension' | 'lengthUnit' | 'direction'>): string {
  if (task.extension <= 0) return 'No extension: the socket goes straight on the drive';
  const size = `${formatNumber(task.extension)} ${task.lengthUnit}`;
  return task.direction === 'back' ? `${size} adapter pointing back toward the handle` : `${size} extension pointing forward`;
}

export default function WrenchStage() {
  const task = useTrainer((s) => s.procedure.wrench);
  const draft = useTrainer((s) => s.drafts.wrench);
  const setWrench = useTrainer((s) => s.setWrench);
  if (!task) return <p>This procedure has no wrench setting to work out.</p>;

  const step = DIAL_STEP[draft.unit];
  const nudge = (direction: 1 | -1) => setWrench(Math.max(0, roundToResolution((draft.setting ?? 0) + direction * step, step)));

  return (
    <div className="space-y-6">
      <section aria-labelledby="spec-heading" className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-lg border border-steel-200 bg-steel-50 p-3">
          <h3 id="spec-heading" className="text-sm font-semibold uppercase tracking-wide text-steel-600">
            The spec
          </h3>
          <p className="text-2xl font-bold text-steel-900">
            {formatNumber(task.spec.value)} {task.spec.unit}
          </p>
          <p className="text-sm text-steel-700">± {task.spec.tolerancePct} %</p>
        </div>
        <div className="rounded-lg border border-steel-200 bg-steel-50 p-3">
          <h3 className="text-sm font-semibold uppercase tracking-wide text-steel-600">On the bench</h3>
          <p className="font-semibold text-steel-900">
            Click wrench, {formatNumber(task.wrenchLength)} {task.lengthUnit} long (grip to drive)
          </p>
          <p className="text-steel-800">{extensionWords(task)}</p>
          <p className="text-steel-800">
            Its dial reads in <strong>{task.dialUnit}</strong>
          </p>
        </div>
      </section>

      <section aria-labelledby="dial-heading">
        <h3 id="dial-heading" className="text-lg font-bold">
          Set the dial
        </h3>
        <div className="mt-2 flex flex-wrap items-end gap-3">
          <div>
            <label htmlFor="dial-setting" className="field-label">
              Setting
            </label>
            <div className="flex items-center gap-2">
              <button type="button" className="btn-quiet min-w-touch px-0 text-xl" aria-label={`Down ${step} ${draft.unit}`} onClick={() => nudge(-1)}>
                −
              </button>
              <NumberField id="dial-setting" value={draft.setting} min={0} step={step} onChange={(v) => setWrench(v)} className="field-input w-28 text-right text-lg" />
              <button type="button" className="btn-quiet min-w-touch px-0 text-xl" aria-label={`Up ${step} ${draft.unit}`} onClick={() => nudge(1)}>
                +
              </button>
            </div>
          </div>
          <UnitSelect label="Unit" id="dial-unit" className="w-32" value={draft.unit} onChange={(e) => setWrench(draft.setting, e.target.value as TorqueUnit)} />
        </div>
        <p className="mt-2 text-steel-800">
          The dial shows:{' '}
          <strong className="font-mono text-lg">{draft.setting === null ? '—' : `${formatNumber(draft.setting, 6)} ${draft.unit}`}</strong>
        </p>
      </section>

      <Calculator />

      <p className="flex gap-2 rounded-lg border border-brass-300 bg-brass-50 p-3 text-sm text-brass-900">
        <span aria-hidden="true">⚠</span>
        <span>
          <span className="sr-only">Caution: </span>
          On a real engine the engine maker's figure rules, not this drill's demo number, and the torque wrench must be in calibration.
        </span>
      </p>
    </div>
  );
}

/** Disclosure with the server's calculator; it works with the learner's own numbers, not the task's. */
function Calculator() {
  const [form, setForm] = useState({ torque: '', unit: 'N·m', toUnit: 'N·m', wrenchLength: '', extension: '', lengthUnit: 'in', direction: 'forward' });
  const [answer, setAnswer] = useState<WrenchCalcAnswer | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const field = (name: keyof typeof form) => ({
    id: `calc-${name}`,
    value: form[name],
    onChange: (e: { target: { value: string } }) => setForm({ ...form, [name]: e.target.value }),
  });
  const number = (text: string) => (text.trim() === '' ? undefined : Number(text.replace(',', '.')));

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setBusy(true);
    setError(null);
    try {
      setAnswer(
        await calculateWrenchSetting({
          torque: number(form.torque) ?? Number.NaN,
          unit: form.unit,
          toUnit: form.toUnit,
          wrenchLength: number(form.wrenchLength),
          extension: number(form.extension),
          lengthUnit: form.lengthUnit as 'in' | 'mm',
          direction: form.direction as 'forward' | 'back',
        }),
      );
    } catch (err) {
      setAnswer(null);
      setError(err instanceof ApiError ? err.message : 'The calculator could not answer.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <details className="group rounded-lg border border-steel-200 bg-white">
      <summary className="flex min-h-touch cursor-pointer list-none items-center gap-2 px-4 font-semibold">
        <span aria-hidden="true" className="transition-transform group-open:rotate-90">▸</span>
        Calculator <span className="font-normal text-steel-600">(work a setting out from your own numbers)</span>
      </summary>
      <form className="grid gap-3 border-t border-steel-200 p-4 sm:grid-cols-2" onSubmit={(e) => void submit(e)}>
        <div>
          <label className="field-label" htmlFor="calc-torque">Torque spec</label>
          <input type="number" step="any" min="0" inputMode="decimal" className="field-input" required {...field('torque')} />
        </div>
        <UnitSelect label="Spec unit" {...field('unit')} />
        <UnitSelect label="Dial unit" {...field('toUnit')} />
        <div>
          <label className="field-label" htmlFor="calc-wrenchLength">Wrench length (optional)</label>
          <input type="number" step="any" min="0" inputMode="decimal" className="field-input" {...field('wrenchLength')} />
        </div>
        <div>
          <label className="field-label" htmlFor="calc-extension">Extension or adapter (optional)</label>
          <input type="number" step="any" min="0" inputMode="decimal" className="field-input" {...field('extension')} />
        </div>
        <div>
          <label className="field-label" htmlFor="calc-lengthUnit">Length unit</label>
          <select className="field-input" {...field('lengthUnit')}>
            <option value="in">in</option>
            <option value="mm">mm</option>
          </select>
        </div>
        <div className="sm:col-span-2">
          <label className="field-label" htmlFor="calc-direction">Extension points</label>
          <select className="field-input" {...field('direction')}>
            <option value="forward">forward (lengthens the wrench)</option>
            <option value="back">back toward the handle (shortens it)</option>
          </select>
        </div>
        <div className="sm:col-span-2">
          <button type="submit" className="btn-quiet" disabled={busy}>
            {busy ? 'Working…' : 'Work it out'}
          </button>
        </div>
        <div className="sm:col-span-2" aria-live="polite">
          {error && (
            <p className="field-error">
              <span aria-hidden="true">⚠</span> {error}
            </p>
          )}
          {answer && (
            <div>
              <p className="font-semibold">
                Setting: {formatNumber(answer.setting)} {answer.unit}
              </p>
              <ol className="mt-1 list-decimal space-y-1 pl-5 text-sm text-steel-800">
                {answer.steps.map((s, i) => (
                  <li key={i}>{s}</li>
                ))}
              </ol>
            </div>
          )}
        </div>
      </form>
    </details>
  );
}

function UnitSelect({
  label,
  id,
  value,
  onChange,
  className = '',
}: {
  label: string;
  id: string;
  value: string;
  onChange: (e: { target: { value: string } }) => void;
  className?: string;
}) {
  return (
    <div>
      <label className="field-label" htmlFor={id}>
        {label}
      </label>
      <select id={id} className={`field-input ${className}`} value={value} onChange={onChange}>
        {TORQUE_UNIT_IDS.map((u) => (
          <option key={u} value={u}>
            {u}
          </option>
        ))}
      </select>
    </div>
  );
}
