import { useCallback, useEffect, useRef, useState } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { fromEditorValues, type EditorValues } from '../../lib/editor/values';
import { saveDraft } from './api';

// Saves the draft 800 ms after the last change, one request at a time; flush() saves at once (before
// publishing). A save refused because another window saved first stops autosaving and says so.

const DELAY_MS = 800;

export type SaveState =
  | { status: 'idle' | 'pending' | 'saving' }
  | { status: 'saved'; at: string }
  | { status: 'failed'; message: string }
  | { status: 'conflict' };

export function useAutosave(form: UseFormReturn<EditorValues>, draftId: string, initialRevision: number) {
  const [state, setState] = useState<SaveState>({ status: 'idle' });
  const revision = useRef(initialRevision);
  const dirty = useRef(false);
  const running = useRef<Promise<boolean> | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const stopped = useRef(false);

  const saveNow = useCallback(async (): Promise<boolean> => {
    if (stopped.current) return false;
    if (running.current) await running.current;
    if (!dirty.current) return true;
    dirty.current = false;
    setState({ status: 'saving' });
    const job = (async () => {
      const outcome = await saveDraft(draftId, fromEditorValues(form.getValues()), revision.current);
      if (outcome.kind === 'saved') {
        revision.current = outcome.revision;
        if (!dirty.current) setState({ status: 'saved', at: outcome.updatedAt });
        return true;
      }
      if (outcome.kind === 'conflict') {
        stopped.current = true;
        setState({ status: 'conflict' });
        return false;
      }
      dirty.current = true;
      setState({ status: 'failed', message: outcome.message });
      return false;
    })();
    running.current = job;
    try {
      return await job;
    } finally {
      running.current = null;
    }
  }, [draftId, form]);

  useEffect(() => {
    const subscription = form.watch(() => {
      dirty.current = true;
      if (!stopped.current) setState((s) => (s.status === 'pending' ? s : { status: 'pending' }));
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => {
        void saveNow().then((ok) => {
          // Offline or a server hiccup: try again a little later, keeping the work in the form meanwhile.
          if (!ok && !stopped.current) timer.current = setTimeout(() => void saveNow(), 5000);
        });
      }, DELAY_MS);
    });
    return () => subscription.unsubscribe();
  }, [form, saveNow]);

  // Leaving with unsaved changes asks first.
  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (dirty.current || running.current) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  const flush = useCallback(async () => {
    if (timer.current) clearTimeout(timer.current);
    return saveNow();
  }, [saveNow]);

  return { state, flush };
}
