import { boltMap, type BoltSpot } from '../bolt-map';
import { useTrainer } from '../context';
import { boltLabel } from '../labels';
import { NumberField } from '../NumberField';
import { patternUnit } from '../store';

// Pattern: pass by pass, tap the bolts in the order you would tighten them and give the pass's torque.

const boltNumber = (key: string) => Number(/(\d+)$/.exec(key)?.[1] ?? Number.NaN);

export default function PatternStage() {
  const procedure = useTrainer((s) => s.procedure);
  const pattern = useTrainer((s) => s.drafts.pattern);
  const tapBolt = useTrainer((s) => s.tapBolt);
  const undoBolt = useTrainer((s) => s.undoBolt);
  const clearPass = useTrainer((s) => s.clearPass);
  const setActivePass = useTrainer((s) => s.setActivePass);
  const setPassTorque = useTrainer((s) => s.setPassTorque);

  const group = procedure.fastenerGroups.find((g) => g.key === pattern.group) ?? procedure.fastenerGroups[0];
  if (!group) return <p>This procedure has no bolt pattern to set.</p>;

  const unit = patternUnit(procedure);
  const spots = boltMap(group.bolts, group.axis);
  const spotOf = new Map(spots.map((s) => [s.key, s] as const));
  // Numbered as the part is (the server shuffles the list so its order gives nothing away).
  const bolts = [...group.bolts].sort((a, b) => boltNumber(a.key) - boltNumber(b.key) || a.key.localeCompare(b.key));
  const active = pattern.activePass;
  const pass = pattern.passes[active] ?? { torque: null, sequence: [] };
  const torqueId = `pass-torque-${active}`;

  return (
    <div className="space-y-6">
      <p className="text-steel-700">
        {group.name}: {group.bolts.length} bolts, {pattern.passes.length} {pattern.passes.length === 1 ? 'pass' : 'passes'}.
        {group.torque ? ` Final torque ${group.torque.value} ${group.torque.unit}.` : ''}
      </p>

      <div role="group" aria-label="Pass" className="flex flex-wrap gap-2">
        {pattern.passes.map((p, i) => (
          <button
            key={i}
            type="button"
            aria-pressed={i === active}
            onClick={() => setActivePass(i)}
            className={[
              'flex min-h-touch flex-col items-start justify-center rounded-lg border-2 px-4 text-left',
              i === active ? 'border-brass-500 bg-brass-50' : 'border-steel-300 bg-white hover:bg-steel-100',
            ].join(' ')}
          >
            <span className="font-semibold">
              Pass {i + 1} of {pattern.passes.length}
            </span>
            <span className="text-sm text-steel-700">
              {p.sequence.length}/{group.bolts.length} bolts · {p.torque === null ? 'no torque yet' : `${p.torque} ${unit}`}
            </span>
          </button>
        ))}
      </div>

      <div>
        <label htmlFor={torqueId} className="field-label">
          Torque for pass {active + 1} ({unit})
        </label>
        <div className="flex max-w-[12rem] items-center gap-2">
          <NumberField key={torqueId} id={torqueId} value={pass.torque} min={0} onChange={(v) => setPassTorque(active, v)} />
          <span className="font-semibold text-steel-700">{unit}</span>
        </div>
      </div>

      <section aria-labelledby="bolts-heading">
        <h3 id="bolts-heading" className="text-lg font-bold">
          Bolts <span className="text-sm font-normal text-steel-600">(seen from the bolt heads; tap in tightening order)</span>
        </h3>
        <ul className="mt-2 grid grid-cols-[repeat(auto-fill,minmax(8.5rem,1fr))] gap-2">
          {bolts.map((bolt) => {
            const spot = spotOf.get(bolt.key)!;
            const order = pass.sequence.indexOf(bolt.key);
            const done = order >= 0;
            return (
              <li key={bolt.key}>
                <button
                  type="button"
                  aria-disabled={done}
                  aria-label={`${boltLabel(bolt.key)}, at ${spot.hour} o'clock${done ? `, number ${order + 1} in pass ${active + 1}` : ''}`}
                  onClick={() => (done ? undefined : tapBolt(bolt.key))}
                  className={[
                    'flex min-h-touch w-full items-center gap-2 rounded-lg border-2 px-2 py-1 text-left',
                    done ? 'border-steel-300 bg-steel-100 text-steel-600' : 'border-steel-300 bg-white hover:bg-brass-50',
                  ].join(' ')}
                >
                  <ClockFace spots={spots} highlight={bolt.key} />
                  <span className="whitespace-nowrap font-semibold">{boltLabel(bolt.key)}</span>
                  {done && (
                    <span className="ml-auto rounded-full bg-steel-800 px-2 text-sm font-bold text-white" aria-hidden="true">
                      #{order + 1}
                    </span>
                  )}
                </button>
              </li>
            );
          })}
        </ul>
      </section>

      <section aria-labelledby="sequence-heading" className="grid gap-4 sm:grid-cols-[auto_1fr]">
        <BoltOrderMap spots={spots} sequence={pass.sequence} pass={active + 1} />
        <div>
          <h3 id="sequence-heading" className="text-lg font-bold">
            Pass {active + 1} so far
          </h3>
          {pass.sequence.length === 0 ? (
            <p className="mt-1 text-steel-700">No bolts yet.</p>
          ) : (
            <ol className="mt-1 list-decimal space-y-0.5 pl-6">
              {pass.sequence.map((key) => (
                <li key={key}>
                  {boltLabel(key)} <span className="text-steel-600">({spotOf.get(key)?.hour ?? '?'} o'clock)</span>
                </li>
              ))}
            </ol>
          )}
          <div className="mt-3 flex flex-wrap gap-2">
            <button type="button" className="btn-quiet" disabled={pass.sequence.length === 0} onClick={undoBolt}>
              <span aria-hidden="true">↶</span> Undo
            </button>
            <button type="button" className="btn-quiet" disabled={pass.sequence.length === 0} onClick={clearPass}>
              Clear pass {active + 1}
            </button>
          </div>
        </div>
      </section>
    </div>
  );
}

/** A small dial: every bolt as a faint dot, this one solid with a hand from the centre. */
function ClockFace({ spots, highlight }: { spots: BoltSpot[]; highlight: string }) {
  const r = 15;
  const at = (angle: number, radius: number) => {
    const rad = (angle * Math.PI) / 180;
    return { x: 20 + radius * Math.sin(rad), y: 20 - radius * Math.cos(rad) };
  };
  const me = spots.find((s) => s.key === highlight);
  const tip = me ? at(me.angle, r) : null;
  return (
    <svg width="40" height="40" viewBox="0 0 40 40" aria-hidden="true" className="shrink-0">
      <circle cx="20" cy="20" r="18" fill="white" stroke="currentColor" strokeOpacity="0.35" />
      {spots.map((s) => {
        const p = at(s.angle, r);
        return <circle key={s.key} cx={p.x} cy={p.y} r="2" fill="currentColor" fillOpacity="0.3" />;
      })}
      {tip && (
        <>
          <line x1="20" y1="20" x2={tip.x} y2={tip.y} stroke="#a96818" strokeWidth="2" />
          <circle cx={tip.x} cy={tip.y} r="4" fill="#a96818" />
        </>
      )}
    </svg>
  );
}

/** The group as it lies, with this pass's order numbers on the bolts. */
function BoltOrderMap({ spots, sequence, pass }: { spots: BoltSpot[]; sequence: string[]; pass: number }) {
  const size = 160;
  const pad = 20;
  const extent = Math.max(1e-9, ...spots.flatMap((s) => [Math.abs(s.x), Math.abs(s.y)]));
  const k = (size / 2 - pad) / extent;
  return (
    <svg
      width={size}
      height={size}
      viewBox={`0 0 ${size} ${size}`}
      role="img"
      aria-label={`Map of the bolts seen from the bolt heads with your pass ${pass} order`}
      className="rounded-lg border border-steel-200 bg-steel-50"
    >
      {spots.map((s) => {
        const n = sequence.indexOf(s.key);
        const cx = size / 2 + s.x * k;
        const cy = size / 2 - s.y * k;
        return (
          <g key={s.key}>
            <circle cx={cx} cy={cy} r="11" fill={n >= 0 ? '#2c3d4a' : 'white'} stroke="#517188" strokeWidth="1.5" />
            <text x={cx} y={cy + 4} textAnchor="middle" fontSize="11" fontWeight="700" fill={n >= 0 ? 'white' : '#6f8da2'}>
              {n >= 0 ? n + 1 : '·'}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
