import type { SignOffJson } from '../../lib/uploads/views';
import { PhotoTile } from './PhotoTile';

interface Props {
  signOffs: SignOffJson[];
  /** Learners read who signed them off; instructors read whom they signed off. */
  audience: 'learner' | 'instructor';
  empty: string;
}

const dateFormat = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeZone: 'UTC' });
const benchDay = (date: string) => dateFormat.format(new Date(`${date}T00:00:00Z`));

export function OutcomeBadge({ outcome }: { outcome: SignOffJson['outcome'] }) {
  return outcome === 'pass' ? (
    <span className="inline-flex items-center gap-1 rounded-full bg-go-50 px-3 py-0.5 text-sm font-bold text-go-700 ring-1 ring-go-500">
      <span aria-hidden="true">✓</span> Pass
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 rounded-full bg-signal-50 px-3 py-0.5 text-sm font-bold text-signal-700 ring-1 ring-signal-500">
      <span aria-hidden="true">↻</span> Redo
    </span>
  );
}

/** Bench sign-offs, newest first, each with its date, outcome, notes and photos. Rendered on the server. */
export default function SignOffList({ signOffs, audience, empty }: Props) {
  if (signOffs.length === 0) return <p className="text-steel-600">{empty}</p>;
  return (
    <ol className="divide-y divide-steel-100" data-testid="sign-off-list">
      {signOffs.map((s) => (
        <li key={s.id} className="py-4" data-testid="sign-off">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <OutcomeBadge outcome={s.outcome} />
            <time dateTime={s.benchDate} className="font-semibold">
              {benchDay(s.benchDate)}
            </time>
            {audience === 'instructor' ? (
              <span className="text-steel-700">
                <span className="font-semibold">{s.learnerName}</span> · {s.procedureTitle}
              </span>
            ) : (
              <span className="text-steel-600">
                signed off by {s.instructorName} · {s.className}
              </span>
            )}
          </div>
          {audience === 'instructor' && <p className="mt-1 text-sm text-steel-500">Recorded by {s.instructorName}</p>}
          {s.notes && <p className="mt-2 whitespace-pre-line text-steel-800">{s.notes}</p>}
          {s.photos.length > 0 && (
            <ul className="mt-3 flex flex-wrap gap-3" aria-label="Photos">
              {s.photos.map((p) => (
                <li key={p.id}>
                  <PhotoTile photo={p} />
                </li>
              ))}
            </ul>
          )}
        </li>
      ))}
    </ol>
  );
}
