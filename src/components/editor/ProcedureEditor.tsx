import { useEffect, useState } from 'react';
import { FormProvider, useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { validateDraft } from '../../lib/editor/drafts';
import { fieldPath, issuesToErrors, plainMessage } from '../../lib/editor/issues';
import { fromEditorValues, toEditorValues, type EditorValues } from '../../lib/editor/values';
import type { Issue } from '../../lib/procedure/validate';
import { publishDraft } from './api';
import { ChecksSection } from './ChecksSection';
import { DetailsSection } from './DetailsSection';
import { FastenersSection } from './FastenersSection';
import { FieldIssue } from './FieldIssue';
import { IssueSummary } from './IssueSummary';
import { PartsSection } from './PartsSection';
import { PinsSection } from './PinsSection';
import { SaveIndicator } from './SaveIndicator';
import { StepsSection } from './StepsSection';
import { useAutosave } from './useAutosave';

// The procedure editor island. The form holds the draft document; it saves as it changes and is checked in
// full (the procedure schema and every cross-reference rule, as the server does) when the instructor checks
// or publishes. Each problem shows beside its field and in a list at the top.

export interface EditorDraft {
  id: string;
  revision: number;
  /** Slug of the procedure this draft becomes the next version of; null for a new procedure. */
  basedOn: string | null;
  document: Record<string, unknown>;
}

const resolver: Resolver<EditorValues> = async (values) => {
  const result = validateDraft(fromEditorValues(values));
  if (result.ok) return { values, errors: {} };
  return { values: {}, errors: issuesToErrors(result.issues) as FieldErrors<EditorValues> };
};

const SECTIONS = [
  ['details', 'Details'],
  ['parts', 'Parts'],
  ['steps', 'Steps'],
  ['pins', 'Pins'],
  ['fasteners', 'Fastener groups'],
  ['checks', 'Wrench and final check'],
] as const;

/** Once the instructor has checked or tried to publish, every change re-checks the whole draft (debounced). */
function useRecheckAfterChanges(form: ReturnType<typeof useForm<EditorValues>>) {
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | null = null;
    const subscription = form.watch(() => {
      if (!form.formState.isSubmitted) return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => void form.trigger(), 300);
    });
    return () => {
      subscription.unsubscribe();
      if (timer) clearTimeout(timer);
    };
  }, [form]);
}

export default function ProcedureEditor({ draft }: { draft: EditorDraft }) {
  // Checked in full, never field by field: a change to one field can fix or break a rule about another.
  const form = useForm<EditorValues>({ defaultValues: toEditorValues(draft.document), resolver, mode: 'onSubmit', reValidateMode: 'onSubmit' });
  const { state, flush } = useAutosave(form, draft.id, draft.revision);
  useRecheckAfterChanges(form);
  const [outcome, setOutcome] = useState<{ kind: 'checked' } | { kind: 'failed'; message: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const showServerIssues = (issues: Issue[]) => {
    // Parents before children, so a message on a list does not hide those on its items.
    const sorted = [...issues].sort((a, b) => a.path.split('.').length - b.path.split('.').length);
    for (const issue of sorted) {
      const path = fieldPath(issue.path) as Parameters<typeof form.setError>[0];
      form.setError(path, { type: 'server', message: plainMessage(issue.message) });
    }
  };

  const publish = form.handleSubmit(async () => {
    setBusy(true);
    setOutcome(null);
    try {
      if (!(await flush())) {
        setOutcome({ kind: 'failed', message: 'The draft could not be saved, so it was not published. Your changes are still here.' });
        return;
      }
      const result = await publishDraft(draft.id);
      if (result.kind === 'published') {
        window.location.assign(`/teach/procedures?published=${encodeURIComponent(result.slug)}&version=${result.version}&created=${result.created ? 1 : 0}`);
        return;
      }
      if (result.kind === 'invalid') showServerIssues(result.issues);
      else setOutcome({ kind: 'failed', message: result.message });
    } finally {
      setBusy(false);
    }
  });
  const check = form.handleSubmit(() => setOutcome({ kind: 'checked' }));

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={publish} className="grid gap-6 lg:grid-cols-[12rem_minmax(0,1fr)]" aria-label="Procedure editor">
        <nav aria-label="Editor sections" className="lg:sticky lg:top-4 lg:self-start">
          <ul className="flex flex-wrap gap-2 lg:flex-col">
            {SECTIONS.map(([id, label]) => (
              <li key={id}>
                <a href={`#${id}`} className="flex min-h-touch items-center rounded-lg px-3 font-semibold text-steel-700 hover:bg-steel-100">
                  {label}
                </a>
              </li>
            ))}
          </ul>
        </nav>
        <div className="min-w-0 space-y-6">
          <div className="panel sticky top-0 z-20 flex flex-wrap items-center gap-3 py-3 sm:py-3">
            <SaveIndicator state={state} />
            <div className="ml-auto flex flex-wrap gap-2">
              <button type="button" className="btn-quiet" onClick={check} disabled={busy}>
                Check for problems
              </button>
              <button type="submit" className="btn-primary" disabled={busy || state.status === 'conflict'}>
                {draft.basedOn ? 'Publish new version' : 'Publish'}
              </button>
            </div>
            {outcome?.kind === 'checked' && (
              <p role="status" className="w-full font-semibold text-go-700">
                <span aria-hidden="true">✓ </span>No problems found: ready to publish.
              </p>
            )}
            {outcome?.kind === 'failed' && (
              <p role="alert" className="w-full font-semibold text-signal-700">
                <span aria-hidden="true">⚠ </span>
                {outcome.message}
              </p>
            )}
          </div>
          <IssueSummary />
          <FieldIssue path="root" />
          <DetailsSection basedOn={draft.basedOn} />
          <PartsSection />
          <StepsSection />
          <PinsSection />
          <FastenersSection />
          <ChecksSection />
        </div>
      </form>
    </FormProvider>
  );
}
