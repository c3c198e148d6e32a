import { useEffect, useState } from 'react';
import { STAGE_LABELS } from '../trainer/labels';
import { ScoreChart } from './ScoreChart';
import type { ProgressJson } from './types';

// A learner's progress: streak of days practised (in the viewer's time zone), rework items mastered
// against due, and per procedure the scores over time as a chart with the same numbers in a table.

function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

export default function Progress({ endpoint, own }: { endpoint: string; own: boolean }) {
  const [data, setData] = useState<ProgressJson | null>(null);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    fetch(`${endpoint}?tz=${encodeURIComponent(browserTimeZone())}`, { credentials: 'same-origin', headers: { Accept: 'application/json' } })
      .then(async (res) => {
        const body = await res.json().catch(() => null);
        if (!res.ok) throw new Error((body as { error?: string } | null)?.error ?? `The server refused this (${res.status}).`);
        if (live) setData(body as ProgressJson);
      })
      .catch((e: unknown) => live && setError(e instanceof Error && e.message !== 'Failed to fetch' ? e.message : 'No connection to the server: progress could not load.'));
    return () => {
      live = false;
    };
  }, [endpoint]);

  if (error) {
    return (
      <p role="alert" className="panel field-error">
        <span aria-hidden="true">⚠</span> {error}
      </p>
    );
  }
  if (!data) return <p className="panel text-steel-600">Loading progress…</p>;

  const { streak, rework } = data;
  const who = own ? 'You' : data.learner.name;
  return (
    <div className="space-y-6" data-testid="progress">
      <div className="grid gap-4 sm:grid-cols-3">
        <section className="panel" aria-labelledby="streak-heading" data-testid="streak">
          <h2 id="streak-heading" className="text-sm font-semibold uppercase tracking-wide text-steel-600">
            Streak
          </h2>
          <p className="text-3xl font-bold">
            {streak.current} {streak.current === 1 ? 'day' : 'days'}
          </p>
          <p className="text-sm text-steel-700">
            {streak.practisedToday ? '✓ Practised today' : streak.current > 0 ? 'Not yet today: practise to keep it going' : 'No practice yet today'}
          </p>
          <p className="text-sm text-steel-600">
            Longest: {streak.longest} · {streak.days.length} {streak.days.length === 1 ? 'day' : 'days'} in all · days in {data.timeZone}
          </p>
        </section>
        <section className="panel sm:col-span-2" aria-labelledby="steps-heading" data-testid="rework-standing">
          <h2 id="steps-heading" className="text-sm font-semibold uppercase tracking-wide text-steel-600">
            Missed steps in rework
          </h2>
          {rework.total === 0 ? (
            <p className="mt-1 text-steel-700">{own ? 'No missed steps yet: each step you miss in the trainer comes back in Rework.' : 'No missed steps yet.'}</p>
          ) : (
            <>
              <p className="mt-1 text-lg">
                <strong className="text-go-700">{rework.mastered} mastered</strong> · <strong className="text-brass-800">{rework.due} due</strong> ·{' '}
                <strong>{rework.learning} still learning</strong> <span className="text-steel-600">of {rework.total}</span>
              </p>
              <div className="mt-2 flex h-4 overflow-hidden rounded-full bg-steel-100" aria-hidden="true">
                <div className="bg-go-500" style={{ width: `${(100 * rework.mastered) / rework.total}%` }} />
                <div className="bg-brass-400" style={{ width: `${(100 * rework.due) / rework.total}%` }} />
                <div className="bg-steel-400" style={{ width: `${(100 * rework.learning) / rework.total}%` }} />
              </div>
              <p className="mt-1 text-sm text-steel-600">Mastered: answered right until it is a week or more away.</p>
              {own && rework.due > 0 && (
                <a href="/rework" className="btn-primary mt-3">
                  Answer the {rework.due} due
                </a>
              )}
            </>
          )}
        </section>
      </div>

      {data.procedures.length === 0 ? (
        <p className="panel text-steel-700">{own ? 'No attempts yet. Scores appear here once you check a stage in the trainer.' : `${who} has no attempts yet.`}</p>
      ) : (
        data.procedures.map((p) => (
          <section key={p.slug} className="panel" aria-labelledby={`proc-${p.slug}`} data-testid="procedure-progress">
            <h2 id={`proc-${p.slug}`} className="text-xl font-bold">
              {p.title}
            </h2>
            <p className="mb-3 text-sm text-steel-600">
              Rework: {p.rework.mastered} mastered · {p.rework.due} due · {p.rework.learning} learning
            </p>
            {p.stages.length > 0 && <ScoreChart procedure={p} />}
            <table className="mt-4 w-full text-left text-sm">
              <caption className="sr-only">Scores for {p.title} by stage</caption>
              <thead className="border-b border-steel-200 text-steel-600">
                <tr>
                  <th className="py-2 pr-4 font-semibold">Stage</th>
                  <th className="py-2 pr-4 font-semibold">Attempts</th>
                  <th className="py-2 pr-4 font-semibold">Latest</th>
                  <th className="py-2 font-semibold">Best</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-steel-100">
                {p.stages.map((s) => (
                  <tr key={s.stage}>
                    <td className="py-2 pr-4 font-medium">{STAGE_LABELS[s.stage]}</td>
                    <td className="py-2 pr-4">{s.attempts.length}</td>
                    <td className="py-2 pr-4">{s.latest} %</td>
                    <td className="py-2">
                      {s.best} % {s.best === 100 && <span className="text-go-700">✓ full marks</span>}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
        ))
      )}
    </div>
  );
}
