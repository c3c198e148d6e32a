import { STAGE_LABELS } from '../trainer/labels';
import type { ReworkItem } from './types';
import { dueWords, isSameDay } from './when';

// What is due today and what is coming, as plain lists (the due date in the learner's own time zone).

function ItemRow({ item, now }: { item: ReworkItem; now: Date }) {
  const due = new Date(item.due);
  const ready = due.getTime() <= now.getTime();
  return (
    <li className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-3" data-testid="rework-item" data-item-id={item.id} data-due={item.due}>
      <div className="min-w-0 flex-1">
        <p className="font-semibold text-steel-900">{item.label}</p>
        <p className="text-sm text-steel-600">
          {item.procedure.title} · {STAGE_LABELS[item.stage]} · {item.missWords}
          {item.missCount > 1 ? ` · missed ${item.missCount} times` : ''}
        </p>
      </div>
      <p className={`text-sm font-semibold ${ready ? 'text-brass-800' : 'text-steel-700'}`}>
        {ready ? 'Due now' : `Due ${dueWords(due, now)}`}
      </p>
    </li>
  );
}

export function ItemLists({ due, upcoming, now }: { due: ReworkItem[]; upcoming: ReworkItem[]; now: Date }) {
  const laterToday = upcoming.filter((i) => isSameDay(new Date(i.due), now));
  const later = upcoming.filter((i) => !isSameDay(new Date(i.due), now));
  const today = [...due, ...laterToday];
  return (
    <div className="grid gap-6 md:grid-cols-2">
      <section className="panel" aria-labelledby="today-heading">
        <h2 id="today-heading" className="text-xl font-bold">
          Due today ({today.length})
        </h2>
        {today.length === 0 ? (
          <p className="mt-2 text-steel-600">Nothing is due today.</p>
        ) : (
          <ul className="mt-2 divide-y divide-steel-100" data-testid="due-today">
            {today.map((item) => (
              <ItemRow key={item.id} item={item} now={now} />
            ))}
          </ul>
        )}
      </section>
      <section className="panel" aria-labelledby="coming-heading">
        <h2 id="coming-heading" className="text-xl font-bold">
          Coming up ({later.length})
        </h2>
        {later.length === 0 ? (
          <p className="mt-2 text-steel-600">Nothing is scheduled after today yet.</p>
        ) : (
          <ul className="mt-2 divide-y divide-steel-100" data-testid="coming-up">
            {later.map((item) => (
              <ItemRow key={item.id} item={item} now={now} />
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
