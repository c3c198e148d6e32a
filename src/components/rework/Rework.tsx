import { useCallback, useEffect, useState } from 'react';
import { loadRework } from './api';
import { ItemLists } from './ItemLists';
import { QuestionCard } from './QuestionCard';
import type { ReworkItem, ReworkList } from './types';
import { dueWords } from './when';

// The rework island: the questions due now, one at a time with the server's verdict after each, and the
// lists of what is due today and what is coming. The page hands over the list it rendered with.

export default function Rework({ initial }: { initial: ReworkList }) {
  const [list, setList] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  // Items answered in this run: they leave the queue until the learner starts again.
  const [answered, setAnswered] = useState<string[]>([]);
  // The question on screen keeps its item even after the refreshed list has moved it on.
  const [asking, setAsking] = useState<{ item: ReworkItem; index: number } | null>(null);
  const [runSize, setRunSize] = useState(0);
  const [now, setNow] = useState(() => new Date());

  const refresh = useCallback(async () => {
    try {
      setList(await loadRework());
      setNow(new Date());
      setError(null);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The list could not be loaded.');
    }
  }, []);

  // Items come due while the page is open (a missed one returns in a minute): look again now and then.
  useEffect(() => {
    const timer = window.setInterval(() => void refresh(), 60_000);
    return () => window.clearInterval(timer);
  }, [refresh]);

  const queue = list.due.filter((i) => i.question && !answered.includes(i.id));
  const current = asking?.item ?? null;

  const start = () => {
    setAnswered([]);
    setRunSize(queue.length);
    setAsking(queue[0] ? { item: queue[0], index: 0 } : null);
  };
  const next = () => {
    const following = queue.find((i) => i.id !== asking?.item.id);
    if (following && asking) setAsking({ item: following, index: asking.index + 1 });
    else {
      // The run is over: items answered wrong come back into the queue once they are due again.
      setAsking(null);
      setAnswered([]);
    }
  };

  const nextDue = list.upcoming[0];
  return (
    <div className="space-y-6">
      {error && (
        <p role="alert" className="field-error">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
      {current ? (
        <QuestionCard
          key={current.id}
          item={current}
          position={{ index: asking!.index, total: Math.max(runSize, asking!.index + 1) }}
          onAnswered={(result) => {
            setAnswered((a) => [...a, result.itemId]);
            void refresh();
          }}
          onNext={next}
        />
      ) : (
        <section className="panel" aria-labelledby="start-heading">
          <h2 id="start-heading" className="text-xl font-bold">
            {queue.length > 0 ? `${queue.length} ${queue.length === 1 ? 'question is' : 'questions are'} ready` : 'Nothing to answer right now'}
          </h2>
          <p className="mt-1 text-steel-700">
            {queue.length > 0
              ? 'Short questions on the steps you missed, built from the procedure. Each answer sets when the step comes back.'
              : nextDue
                ? `The next one is due ${dueWords(new Date(nextDue.due), now)}.`
                : 'Steps you miss in the trainer come here to practise again.'}
          </p>
          {queue.length > 0 && (
            <button type="button" className="btn-primary mt-4" onClick={start}>
              Start rework
            </button>
          )}
          {queue.length === 0 && (
            <a href="/train" className="btn-quiet mt-4">
              Practise a procedure
            </a>
          )}
        </section>
      )}
      <ItemLists due={list.due} upcoming={list.upcoming} now={now} />
    </div>
  );
}
