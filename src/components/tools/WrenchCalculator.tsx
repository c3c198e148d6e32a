import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { TORQUE_UNIT_IDS } from '../../lib/procedure/schema';
import { wrenchPlanFormSchema, type WrenchPlanForm } from '../../lib/schemas/wrench-plan';
import { formatNumber } from '../../lib/torque';
import { planWrench } from '../../lib/tools/wrench-plan';

// Everything is worked out in the browser with the same pure code the server scores with,
// so the calculator answers as you type and works without a connection.

type Field = keyof WrenchPlanForm;

const PRESETS = [
  { label: '30 · 60 · 100 %', value: '30, 60, 100' },
  { label: '70 · 100 %', value: '70, 100' },
  { label: '20 · 50 · 100 %', value: '20, 50, 100' },
  { label: 'One pass', value: '100' },
];

const START: WrenchPlanForm = {
  torque: '', unit: 'ft·lbf', dialUnit: 'in·lbf', wrenchLength: '', extension: '',
  lengthUnit: 'in', direction: 'forward', passes: '30, 60, 100', dialResolution: '',
};

// A field's error also shows once the field that causes it is touched (an extension needs a length).
const CAUSED_BY: Partial<Record<Field, Field[]>> = { wrenchLength: ['extension'], extension: ['wrenchLength', 'direction'] };

export default function WrenchCalculator() {
  const [form, setForm] = useState<WrenchPlanForm>(START);
  const [touched, setTouched] = useState<Set<Field>>(new Set());
  const [copyStatus, setCopyStatus] = useState('');
  const formRef = useRef<HTMLFormElement>(null);

  // The form is served as HTML first: keep whatever was typed before the script took over.
  useEffect(() => {
    const elements = formRef.current?.elements;
    if (!elements) return;
    const typed = (Object.keys(START) as Field[]).filter((name) => {
      const el = elements.namedItem(name) as HTMLInputElement | HTMLSelectElement | null;
      return el && el.value !== START[name];
    });
    if (typed.length === 0) return;
    setForm((f) => ({ ...f, ...Object.fromEntries(typed.map((name) => [name, (elements.namedItem(name) as HTMLInputElement).value])) }));
    setTouched(new Set(typed));
  }, []);

  const parsed = useMemo(() => wrenchPlanFormSchema.safeParse(form), [form]);
  const errors = parsed.success ? {} : (parsed.error.flatten().fieldErrors as Partial<Record<Field, string[]>>);
  const plan = useMemo(() => {
    if (!parsed.success) return null;
    const f = parsed.data;
    return planWrench({
      torque: f.torque!, unit: f.unit, dialUnit: f.dialUnit, wrenchLength: f.wrenchLength, extension: f.extension,
      lengthUnit: f.lengthUnit, direction: f.direction, passPercents: f.passes, dialResolution: f.dialResolution,
    });
  }, [parsed]);

  const set = (name: Field, value: string) => {
    setForm((f) => ({ ...f, [name]: value }));
    setTouched((t) => new Set(t).add(name));
    setCopyStatus('');
  };
  const shownError = (name: Field) =>
    touched.has(name) || CAUSED_BY[name]?.some((cause) => touched.has(cause)) ? errors[name]?.[0] : undefined;
  const input = (name: Field) => ({
    id: `wrench-${name}`,
    name,
    value: form[name],
    'aria-invalid': shownError(name) ? true : undefined,
    'aria-describedby': shownError(name) ? `wrench-${name}-error` : undefined,
    onChange: (e: { target: { value: string } }) => set(name, e.target.value),
  });

  const copy = async () => {
    if (!plan) return;
    try {
      await navigator.clipboard.writeText(plan.summary);
      setCopyStatus('Copied to the clipboard.');
    } catch {
      setCopyStatus('The browser would not copy; select the text below and copy it by hand.');
    }
  };
  const dial = (value: number, mark: number | null) => `${formatNumber(mark ?? value)} ${plan?.unit}`;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
      <form
        ref={formRef}
        className="panel space-y-4"
        aria-label="Your numbers"
        onSubmit={(e) => {
          e.preventDefault();
          setTouched(new Set(Object.keys(form) as Field[]));
        }}
      >
        <fieldset className="grid grid-cols-2 gap-3">
          <legend className="mb-2 text-lg font-bold">The spec</legend>
          <Labelled name="torque" label="Torque spec" error={shownError('torque')}>
            <input type="text" inputMode="decimal" autoComplete="off" className="field-input" {...input('torque')} />
          </Labelled>
          <Labelled name="unit" label="Spec unit">
            <UnitOptions {...input('unit')} />
          </Labelled>
        </fieldset>

        <fieldset className="grid grid-cols-2 gap-3">
          <legend className="mb-2 text-lg font-bold">Your wrench</legend>
          <Labelled name="dialUnit" label="Dial reads in">
            <UnitOptions {...input('dialUnit')} />
          </Labelled>
          <Labelled name="dialResolution" label="Smallest mark (optional)" error={shownError('dialResolution')}>
            <input type="text" inputMode="decimal" placeholder="e.g. 1" className="field-input" {...input('dialResolution')} />
          </Labelled>
          <Labelled name="wrenchLength" label="Length, grip to drive" error={shownError('wrenchLength')}>
            <input type="text" inputMode="decimal" placeholder="only with an extension" className="field-input" {...input('wrenchLength')} />
          </Labelled>
          <Labelled name="lengthUnit" label="Length unit">
            <select className="field-input" {...input('lengthUnit')}>
              <option value="in">in</option>
              <option value="mm">mm</option>
            </select>
          </Labelled>
          <Labelled name="extension" label="Extension or adapter" error={shownError('extension')}>
            <input type="text" inputMode="decimal" placeholder="blank for none" className="field-input" {...input('extension')} />
          </Labelled>
          <Labelled name="direction" label="It points">
            <select className="field-input" {...input('direction')}>
              <option value="forward">forward</option>
              <option value="back">back to the handle</option>
            </select>
          </Labelled>
        </fieldset>

        <fieldset>
          <legend className="mb-2 text-lg font-bold">Passes</legend>
          <div className="mb-2 flex flex-wrap gap-2" role="group" aria-label="Common schedules">
            {PRESETS.map((p) => (
              <button key={p.value} type="button" className="btn-quiet px-3 text-sm" aria-pressed={form.passes === p.value} onClick={() => set('passes', p.value)}>
                {p.label}
              </button>
            ))}
          </div>
          <Labelled name="passes" label="Percent of the spec for each pass" error={shownError('passes')}>
            <input type="text" className="field-input" {...input('passes')} />
          </Labelled>
        </fieldset>
        <button type="submit" className="btn-primary w-full">
          Work it out
        </button>
      </form>

      <section aria-labelledby="wrench-result-heading" aria-live="polite" className="space-y-4">
        <h2 id="wrench-result-heading" className="sr-only">
          Result
        </h2>
        {!plan ? (
          <p className="panel text-steel-600">Type the torque spec and your wrench; the setting and the working appear here.</p>
        ) : (
          <>
            <div className="panel">
              <p className="text-sm font-semibold uppercase tracking-wide text-steel-600">Set the dial to</p>
              <p className="text-4xl font-bold text-steel-900" data-testid="wrench-setting">
                {dial(plan.setting, plan.dialMark)}
              </p>
              {plan.dialMark !== null && <p className="text-sm text-steel-600">nearest mark to {formatNumber(plan.setting, 6)} {plan.unit}</p>}
              <h3 className="mt-4 font-bold">How it is worked out</h3>
              <ol className="mt-1 list-decimal space-y-1 pl-5 text-steel-800" data-testid="wrench-steps">
                {plan.steps.map((s, i) => (
                  <li key={i}>{s}</li>
                ))}
              </ol>
            </div>

            <div className="panel overflow-x-auto">
              <table className="w-full text-left" data-testid="wrench-passes">
                <caption className="mb-2 text-left font-bold">Pass schedule</caption>
                <thead className="text-sm text-steel-600">
                  <tr>
                    <th scope="col" className="py-1 pr-4">Pass</th>
                    <th scope="col" className="py-1 pr-4">Of the spec</th>
                    <th scope="col" className="py-1 pr-4">At the bolt</th>
                    <th scope="col" className="py-1">Set the dial</th>
                  </tr>
                </thead>
                <tbody>
                  {plan.passes.map((p, i) => (
                    <tr key={i} className="border-t border-steel-200">
                      <th scope="row" className="py-2 pr-4">{i + 1}</th>
                      <td className="py-2 pr-4">{formatNumber(p.percent)} %</td>
                      <td className="py-2 pr-4">{formatNumber(p.torque)} {plan.unit}</td>
                      <td className="py-2 font-semibold">{dial(p.setting, p.dialMark)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="mt-2 text-sm text-steel-600">Run the bolts down across the part on each pass, then check once more around at the full setting.</p>
            </div>

            <div className="panel overflow-x-auto">
              <table className="w-full text-left" data-testid="wrench-conversions">
                <caption className="mb-2 text-left font-bold">The spec in each unit</caption>
                <tbody>
                  {plan.conversions.map((c) => (
                    <tr key={c.unit} className="border-t border-steel-200">
                      <th scope="row" className="py-2 pr-4">{c.unit}</th>
                      <td className="py-2 pr-4 font-semibold">{formatNumber(c.value)}</td>
                      <td className="py-2 text-sm text-steel-600">
                        {c.factor === 1 ? 'as given' : `${form.unit} × ${formatNumber(c.factor, 7)}`}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>

            <div className="panel">
              <div className="flex flex-wrap items-center gap-3">
                <button type="button" className="btn-quiet" onClick={() => void copy()}>
                  Copy the result
                </button>
                <span role="status" className="text-sm text-steel-700">{copyStatus}</span>
              </div>
              <pre className="mt-3 whitespace-pre-wrap rounded-lg bg-steel-50 p-3 text-sm" data-testid="wrench-summary">{plan.summary}</pre>
            </div>
          </>
        )}
      </section>
    </div>
  );
}

function Labelled({ name, label, error, children }: { name: Field; label: string; error?: string; children: ReactNode }) {
  return (
    <div>
      <label className="field-label" htmlFor={`wrench-${name}`}>
        {label}
      </label>
      {children}
      {error && (
        <p id={`wrench-${name}-error`} className="field-error">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
}

function UnitOptions(props: { id: string; name: string; value: string; onChange: (e: { target: { value: string } }) => void }) {
  return (
    <select className="field-input" {...props}>
      {TORQUE_UNIT_IDS.map((u) => (
        <option key={u} value={u}>
          {u}
        </option>
      ))}
    </select>
  );
}
