import { Suspense, lazy, useEffect, useRef, useState, type ReactNode } from 'react';
import { SceneBoundary } from '../SceneBoundary';
import type { PublicProcedure } from '../../lib/procedure/public-view';
import { newClientId } from '../trainer/CheckStage';
import { STAGE_LABELS } from '../trainer/labels';
import type { Verdict } from '../trainer/scene/tones';
import { loadProcedure, sendAnswer } from './api';
import type { ReworkAnswerResult, ReworkItem } from './types';
import { dueWords, fromNow } from './when';
import { ResultLine } from '../ResultLine';

// One rework question: pick from the list (or on the model), optionally with a hint, and the server
// says right or wrong with its reasons and when the item comes back.

const QuestionScene = lazy(() => import('../trainer/scene/QuestionScene'));

/** Public views of procedures already fetched for the 3D view, by slug and version. */
const procedures = new Map<string, Promise<PublicProcedure>>();
function procedureFor(slug: string, version: number): Promise<PublicProcedure> {
  const key = `${slug}@${version}`;
  if (!procedures.has(key)) procedures.set(key, loadProcedure(slug, version).catch((e) => (procedures.delete(key), Promise.reject(e))));
  return procedures.get(key)!;
}

interface Props {
  item: ReworkItem;
  position: { index: number; total: number };
  onAnswered: (result: ReworkAnswerResult) => void;
  onNext: () => void;
}

export function QuestionCard({ item, position, onAnswered, onNext }: Props) {
  const question = item.question!;
  const [choice, setChoice] = useState<string | null>(null);
  const [hinted, setHinted] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [result, setResult] = useState<ReworkAnswerResult | null>(null);
  // One clientId per question, kept until the server answers: a retry after a lost reply never counts twice.
  const [clientId] = useState(newClientId);
  const verdictHeading = useRef<HTMLHeadingElement>(null);
  const labelOf = (id: string) => question.choices.find((c) => c.id === id)?.label ?? id;

  const promptHeading = useRef<HTMLHeadingElement>(null);
  // A new question takes keyboard focus, then its verdict does.
  useEffect(() => promptHeading.current?.focus(), []);
  useEffect(() => {
    if (result) verdictHeading.current?.focus();
  }, [result]);

  const check = async () => {
    if (!choice || busy) return;
    setBusy(true);
    setError(null);
    try {
      const answered = await sendAnswer(item.id, { answer: { choice, variant: question.variant, hinted }, clientId });
      setResult(answered);
      onAnswered(answered);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The answer could not be sent.');
    } finally {
      setBusy(false);
    }
  };

  const marks = new Map<string, Verdict>();
  if (result) {
    for (const id of result.accepted) marks.set(id, 'good');
    if (!result.correct) marks.set(result.answer.choice, 'bad');
  }

  return (
    <article className="panel" aria-labelledby="question-prompt" data-testid="rework-question" data-item-id={item.id} data-question-kind={question.kind}>
      <p className="text-sm font-semibold uppercase tracking-wide text-steel-600">
        Question {position.index + 1} of {position.total} · {item.procedure.title} · {STAGE_LABELS[item.stage]}
      </p>
      <h2 id="question-prompt" ref={promptHeading} tabIndex={-1} className="mt-1 text-2xl font-bold">
        {question.prompt}
      </h2>
      <ul className="mt-2 space-y-1 text-steel-800" data-testid="question-context">
        {question.context.map((line, i) => (
          <li key={i} className={i === 0 ? 'text-lg font-semibold text-steel-900' : ''}>
            {line}
          </li>
        ))}
      </ul>

      <div className={question.model ? 'mt-4 grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start' : 'mt-4'}>
        {question.model && (
          <ModelView item={item} selected={choice} marks={marks} onPick={(key) => !result && setChoice(key)} />
        )}
        <fieldset disabled={Boolean(result) || busy}>
          <legend className="field-label">Choose one</legend>
          <ul className="space-y-2" data-testid="choices">
            {question.choices.map((c) => {
              const mark = marks.get(c.id);
              return (
                <li key={c.id}>
                  <label
                    className={`flex min-h-touch cursor-pointer items-center gap-3 rounded-lg border-2 px-3 py-2 ${
                      mark === 'good' ? 'border-go-500 bg-go-50' : mark === 'bad' ? 'border-signal-500 bg-signal-50' : choice === c.id ? 'border-brass-500 bg-brass-50' : 'border-steel-200 bg-white hover:bg-steel-50'
                    }`}
                  >
                    <input type="radio" name={`choice-${item.id}`} value={c.id} checked={choice === c.id} onChange={() => setChoice(c.id)} className="h-5 w-5 accent-brass-500" />
                    <span className="flex-1">{c.label}</span>
                    {mark && (
                      <span className={`font-semibold ${mark === 'good' ? 'text-go-700' : 'text-signal-700'}`}>
                        {mark === 'good' ? '✓ Right' : '✗ Your pick'}
                      </span>
                    )}
                  </label>
                </li>
              );
            })}
          </ul>
        </fieldset>
      </div>

      {!result && (
        <div className="mt-4 space-y-3">
          {hinted ? (
            <p className="rounded-lg border border-brass-300 bg-brass-50 p-3 text-brass-900" data-testid="hint">
              <span className="font-semibold">Hint: </span>
              {question.hint}
            </p>
          ) : (
            <button type="button" className="btn-quiet" onClick={() => setHinted(true)}>
              Show a hint
              <span className="text-sm font-normal text-steel-600">(it comes back a little sooner)</span>
            </button>
          )}
          <div className="flex flex-wrap items-center gap-3">
            <button type="button" className="btn-primary" disabled={!choice || busy} onClick={check}>
              {busy ? 'Checking…' : 'Check answer'}
            </button>
            {!choice && <p className="text-sm text-steel-600">Pick one first.</p>}
          </div>
          {error && (
            <p role="alert" className="field-error">
              <span aria-hidden="true">⚠</span> {error}
            </p>
          )}
        </div>
      )}

      {result && (
        <section
          aria-labelledby="verdict-heading"
          data-testid="verdict"
          className={`mt-4 rounded-xl border-2 p-4 ${result.correct ? 'border-go-500 bg-go-50' : 'border-signal-500 bg-signal-50'}`}
        >
          <h3 id="verdict-heading" ref={verdictHeading} tabIndex={-1} className={`text-xl font-bold ${result.correct ? 'text-go-700' : 'text-signal-700'}`}>
            <span aria-hidden="true">{result.correct ? '✓ ' : '✗ '}</span>
            {result.correct ? 'Right' : 'Not this time'}
          </h3>
          {!result.correct && (
            <p className="mt-1 text-steel-900">
              {result.accepted.length === 1 ? 'The right answer: ' : 'Right answers: '}
              <strong>{result.accepted.map(labelOf).join('; ')}</strong>
            </p>
          )}
          <ul className="mt-2 space-y-1">
            {result.results.map((line, i) => (
              <ResultLine key={i} ok={line.ok}>
                {line.message}
              </ResultLine>
            ))}
          </ul>
          {result.notes.length > 0 && (
            <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-steel-800">
              {result.notes.map((note, i) => (
                <li key={i}>{note}</li>
              ))}
            </ul>
          )}
          <p className="mt-3 font-semibold text-steel-900" data-testid="next-due" data-due={result.dueAfter}>
            Comes back {dueWords(new Date(result.dueAfter), new Date(result.createdAt))} ({fromNow(new Date(result.dueAfter), new Date(result.createdAt))})
          </p>
          <button type="button" className="btn-primary mt-3" onClick={onNext}>
            {position.index + 1 < position.total ? 'Next question' : 'Done'}
          </button>
        </section>
      )}
    </article>
  );
}

function ModelView({ item, selected, marks, onPick }: { item: ReworkItem; selected: string | null; marks: Map<string, Verdict>; onPick: (key: string) => void }) {
  const question = item.question!;
  const [procedure, setProcedure] = useState<PublicProcedure | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    procedureFor(item.procedure.slug, item.procedure.version).then(
      (p) => live && setProcedure(p),
      (e: unknown) => live && setFailed(e instanceof Error ? e.message : 'The 3D view could not load.'),
    );
    return () => {
      live = false;
    };
  }, [item.procedure.slug, item.procedure.version]);

  if (failed) return <SceneNote>{failed} The list beside it works on its own.</SceneNote>;
  if (!procedure) return <SceneNote>Loading the 3D view…</SceneNote>;
  return (
    <SceneBoundary fallback={<SceneNote>The 3D view could not start on this device. Answer from the list.</SceneNote>}>
      <Suspense fallback={<SceneNote>Loading the 3D view…</SceneNote>}>
        <QuestionScene
          key={`${item.id}:${question.variant}`}
          procedure={procedure}
          model={question.model!}
          choices={question.choices.map((c) => c.id)}
          selected={selected}
          marks={marks}
          onPick={onPick}
        />
      </Suspense>
    </SceneBoundary>
  );
}

function SceneNote({ children }: { children: ReactNode }) {
  return <div className="flex h-[20rem] items-center justify-center rounded-xl border border-steel-200 bg-steel-100 p-6 text-center text-steel-700 sm:h-[24rem]">{children}</div>;
}
