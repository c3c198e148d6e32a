import { useRef, useState, type KeyboardEvent } from 'react';
import type { ReviewFrame } from '../../lib/results/attempt-review';
import { ResultLine } from '../ResultLine';

// Steps through an attempt as the learner did it: one frame at a time with the server's lines about it,
// Previous / Next (or the arrow keys on the buttons), and the whole list to jump to any frame.

const frameOk = (frame: ReviewFrame) => frame.lines.every((l) => l.ok);

export default function AttemptReview({ frames }: { frames: ReviewFrame[] }) {
  const [index, setIndex] = useState(0);
  const heading = useRef<HTMLHeadingElement>(null);
  const frame = frames[index];
  if (!frame) return <p className="text-steel-600">This attempt has nothing to step through.</p>;

  const go = (to: number, focusHeading = false) => {
    setIndex(Math.max(0, Math.min(frames.length - 1, to)));
    if (focusHeading) requestAnimationFrame(() => heading.current?.focus());
  };
  const onKeyDown = (event: KeyboardEvent) => {
    if (event.key === 'ArrowRight') go(index + 1);
    else if (event.key === 'ArrowLeft') go(index - 1);
    else return;
    event.preventDefault();
  };

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)] lg:items-start">
      <section className="panel" aria-labelledby="frame-heading" data-testid="review-frame">
        <p className="text-sm font-semibold text-steel-600" aria-live="polite" data-testid="frame-position">
          {index + 1} of {frames.length}
        </p>
        <h2 id="frame-heading" ref={heading} tabIndex={-1} className="mt-1 text-xl font-bold">
          {frame.title}
        </h2>
        {frame.detail.length > 0 && (
          <ol className="mt-3 flex flex-wrap gap-2" aria-label="What the learner did">
            {frame.detail.map((d, i) => (
              <li key={i} className="rounded-lg border border-steel-300 bg-steel-50 px-3 py-1 font-mono text-sm">
                {d}
              </li>
            ))}
          </ol>
        )}
        {frame.lines.length === 0 ? (
          <p className="mt-3 text-steel-600">The server said nothing more about this one (see the line above it).</p>
        ) : (
          <ul className="mt-4 space-y-2" aria-label="Server results">
            {frame.lines.map((line, i) => (
              <ResultLine key={i} ok={line.ok} className={`rounded-lg border p-3 ${line.ok ? 'border-go-500 bg-go-50' : 'border-signal-500 bg-signal-50'}`} markClass="font-bold">
                {line.message}
              </ResultLine>
            ))}
          </ul>
        )}
        <div className="mt-6 flex flex-wrap gap-3" onKeyDown={onKeyDown}>
          <button type="button" className="btn-quiet" onClick={() => go(index - 1)} disabled={index === 0}>
            <span aria-hidden="true">←</span> Previous
          </button>
          <button type="button" className="btn-primary" onClick={() => go(index + 1)} disabled={index === frames.length - 1}>
            Next <span aria-hidden="true">→</span>
          </button>
        </div>
      </section>

      <nav className="panel" aria-labelledby="whole-attempt-heading">
        <h2 id="whole-attempt-heading" className="mb-3 text-lg font-bold">
          The whole attempt
        </h2>
        <ol className="space-y-1">
          {frames.map((f, i) => {
            const ok = frameOk(f);
            return (
              <li key={i}>
                <button
                  type="button"
                  onClick={() => go(i, true)}
                  aria-current={i === index ? 'step' : undefined}
                  className={`flex min-h-touch w-full items-start gap-2 rounded-lg px-2 py-1 text-left ${i === index ? 'bg-brass-50 ring-2 ring-brass-500' : 'hover:bg-steel-100'}`}
                >
                  <span aria-hidden="true" className={`font-bold ${ok ? 'text-go-700' : 'text-signal-700'}`}>
                    {ok ? '✓' : '✗'}
                  </span>
                  <span>
                    <span className="sr-only">{ok ? 'Right: ' : 'Has a mistake: '}</span>
                    {f.title}
                  </span>
                </button>
              </li>
            );
          })}
        </ol>
      </nav>
    </div>
  );
}
