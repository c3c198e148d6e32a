import type { Stage } from '../../lib/procedure/schema';
import { ApiError, submitAttempt } from './api';
import { useTrainer, useTrainerStore } from './context';
import { useDrill } from './drill';
import { answerFor } from './store';

// "Check this stage": sends the stage's answer to be scored. A check that got no answer keeps its
// clientId, so sending the same work again cannot make a second attempt on the server.

interface PendingCheck {
  clientId: string;
  answer: string;
}
const pendingChecks = new Map<string, PendingCheck>();

/** crypto.randomUUID needs a secure context; a school server on plain HTTP still gets a v4 UUID. */
export function newClientId(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6]! & 0x0f) | 0x40;
  bytes[8] = (bytes[8]! & 0x3f) | 0x80;
  const hex = [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

export function CheckStage({ stage }: { stage: Stage }) {
  const store = useTrainerStore();
  const submitting = useTrainer((s) => s.submitting);
  const error = useTrainer((s) => s.submitError);
  const scored = useTrainer((s) => Boolean(s.results[stage]));
  const { drill, setStanding } = useDrill();
  const standing = drill?.stages.find((s) => s.stage === stage);
  const noneLeft = standing?.attemptsLeft === 0;

  const check = async () => {
    const { procedure, drafts } = store.getState();
    const answer = answerFor(stage, drafts);
    const answerText = JSON.stringify(answer);
    // A drill's checks are other attempts than free practice on the same version.
    const slot = `${procedure.slug}:${procedure.version}:${stage}:${drill?.id ?? ''}`;
    // Changed work is a new attempt; the same work after a failure is a retry of the old one.
    let pending = pendingChecks.get(slot);
    if (!pending || pending.answer !== answerText) {
      pending = { clientId: newClientId(), answer: answerText };
      pendingChecks.set(slot, pending);
    }
    store.getState().setSubmitting(stage);
    try {
      const { drill: standingAfter, ...result } = await submitAttempt({
        procedure: procedure.slug,
        version: procedure.version,
        stage,
        answer,
        clientId: pending.clientId,
        ...(drill ? { drillId: drill.id } : {}),
      });
      pendingChecks.delete(slot);
      if (standingAfter) setStanding(standingAfter.stages);
      store.getState().setSubmitting(null);
      store.getState().setResult(stage, result);
    } catch (err) {
      const message = err instanceof ApiError ? err.message : 'The check failed. Your work is kept; try again.';
      // Shown in a role="alert" paragraph below, which screen readers read at once.
      store.getState().setSubmitting(null, message);
    }
  };

  const busy = submitting !== null;
  return (
    <div className="mt-5 border-t border-steel-200 pt-4">
      <button type="button" className="btn-primary w-full sm:w-auto" disabled={busy || noneLeft} onClick={() => void check()}>
        {submitting === stage ? 'Checking…' : scored ? 'Check this stage again' : 'Check this stage'}
      </button>
      {drill && standing && (
        <div className="mt-2 space-y-1 text-sm text-steel-700">
          <p data-testid="stage-best">
            {standing.bestPct === null
              ? `Pass mark for this stage: ${drill.passMarkPct} %.`
              : `Your best on this stage: ${Math.round(standing.bestPct)} % (pass mark ${drill.passMarkPct} %).`}
          </p>
          <AttemptsLeft left={standing.attemptsLeft} limit={drill.attemptLimit} />
        </div>
      )}
      {error && (
        <p className="field-error" role="alert">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
}

/** On a drill: how many checks this stage has left (the limit counts per stage). */
function AttemptsLeft({ left, limit }: { left: number | null; limit: number | null }) {
  if (left === null || limit === null) return <p>This drill has no attempt limit.</p>;
  if (left === 0) {
    return (
      <p className="font-semibold text-signal-700" data-testid="attempts-left">
        <span aria-hidden="true">⚠</span> No attempts left on this stage of the drill. Your attempts are kept for your instructor.
      </p>
    );
  }
  return (
    <p data-testid="attempts-left">
      {left} of {limit} attempt{limit === 1 ? '' : 's'} left on this stage of the drill.
    </p>
  );
}
