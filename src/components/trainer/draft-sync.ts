import { draftsSchema } from '../../lib/schemas/drafts';
import { loadDraft, saveDraft, type DraftCopy, type FetchLike } from './api';
import type { Drafts, TrainerStore } from './store';

// Keeps the learner's work safe as they go: a copy on this device before every save, the server copy
// debounced behind edits, retries with backoff while offline, and on start the newer copy wins.

/** The part of Web Storage the saver uses (localStorage in the browser, a Map in tests). */
export interface DraftStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

export interface DraftSyncOptions {
  store: TrainerStore;
  fetch?: FetchLike;
  /** null when the browser refuses storage (private mode, quota): the server copy still works. */
  storage?: DraftStorage | null;
  /** Milliseconds since the epoch; injectable so tests control savedAt. */
  now?: () => number;
  debounceMs?: number;
}

export interface DraftSync {
  /** Settles when the first load (and any save it starts) is done. */
  ready: Promise<void>;
  /** Saves now instead of after the debounce (the tab is being hidden). */
  flush(): Promise<void>;
  stop(): void;
}

export const SAVE_DEBOUNCE_MS = 800;
const MAX_BACKOFF_MS = 30_000;

export const draftStorageKey = (slug: string, version: number) => `bw-draft:${slug}:${version}`;

/** 1 s, 2 s, 4 s … for the 1st, 2nd, 3rd failure in a row, never more than 30 s. */
export function backoffDelay(failures: number): number {
  return Math.min(MAX_BACKOFF_MS, 1000 * 2 ** Math.max(0, failures - 1));
}

/** A saved copy we can trust: well-formed drafts and a readable time; anything else counts as no copy. */
export function readCopy(value: unknown): DraftCopy | null {
  if (!value || typeof value !== 'object') return null;
  const { drafts, savedAt } = value as { drafts?: unknown; savedAt?: unknown };
  if (typeof savedAt !== 'string' || Number.isNaN(Date.parse(savedAt))) return null;
  const parsed = draftsSchema.safeParse(drafts);
  return parsed.success ? { drafts: parsed.data as Partial<Drafts>, savedAt } : null;
}

const isNewer = (a: string, b: string) => Date.parse(a) > Date.parse(b);

export function startDraftSync(options: DraftSyncOptions): DraftSync {
  const { store, storage = null, now = Date.now, debounceMs = SAVE_DEBOUNCE_MS } = options;
  const fetchImpl = options.fetch;
  const { slug, version } = store.getState().procedure;
  const key = draftStorageKey(slug, version);

  let stopped = false;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let running: Promise<void> | null = null;
  let runAgain = false;
  let failures = 0;
  /** The server copy has not been read yet (start) or must be read again (after a 409). */
  let needsLoad = true;
  /** The server answered 409 to our copy: its copy wins on the next load, whatever the clocks say. */
  let serverWins = false;
  /** When the work in the store was last changed or the copy it came from was saved; null: nothing yet. */
  let liveAt: string | null = null;
  /** The store revision the server copy matches; null when unknown or behind. */
  let serverRevision: number | null = null;

  const iso = () => new Date(now()).toISOString();
  const state = () => store.getState();

  const readLocal = (): DraftCopy | null => {
    try {
      const text = storage?.getItem(key);
      return text ? readCopy(JSON.parse(text)) : null;
    } catch {
      return null;
    }
  };
  const writeLocal = (copy: DraftCopy) => {
    try {
      storage?.setItem(key, JSON.stringify(copy));
    } catch {
      // Storage full or refused: the server copy is still on its way.
    }
  };

  const restore = (copy: DraftCopy) => {
    state().restoreDrafts(copy.drafts);
    liveAt = copy.savedAt;
  };

  /** After a GET: take the server copy when it is newer than the work in the store (or when told to). */
  const adopt = (server: DraftCopy | null, force: boolean) => {
    if (server && (force || liveAt === null || isNewer(server.savedAt, liveAt))) {
      restore(server);
      writeLocal(server);
      serverRevision = state().revision;
      state().setSaveStatus('saved', server.savedAt);
    } else if (server && Date.parse(liveAt!) === Date.parse(server.savedAt)) {
      serverRevision = state().revision;
      state().setSaveStatus('saved', server.savedAt);
    } else if (force) {
      // The server refused our copy but has none to give: stop pushing until the next edit.
      serverRevision = state().revision;
      state().setSaveStatus('idle');
    }
  };

  const schedule = (ms: number) => {
    if (stopped) return;
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void run();
    }, ms);
  };

  const failed = () => {
    failures += 1;
    state().setSaveStatus('offline');
    schedule(backoffDelay(failures));
  };

  const step = async (): Promise<void> => {
    if (needsLoad) {
      const loaded = await loadDraft(slug, version, fetchImpl);
      if (stopped) return;
      if (loaded.kind === 'unreachable') return failed();
      needsLoad = false;
      failures = 0;
      const forced = serverWins;
      serverWins = false;
      if (loaded.kind === 'loaded') adopt(readCopy(loaded.copy), forced);
      else if (forced) adopt(null, true);
    }
    if (liveAt === null || serverRevision === state().revision) {
      if (state().save.status === 'saving' || state().save.status === 'offline') state().setSaveStatus(serverRevision === null ? 'idle' : 'saved');
      return;
    }
    const revision = state().revision;
    const copy: DraftCopy = { drafts: state().drafts, savedAt: liveAt };
    writeLocal(copy);
    if (state().save.status !== 'offline') state().setSaveStatus('saving');
    const saved = await saveDraft(slug, version, copy, fetchImpl);
    if (stopped) return;
    switch (saved.kind) {
      case 'saved':
        failures = 0;
        serverRevision = revision;
        // A later edit has its own save queued; the status stays "Saving…" until it lands.
        if (state().revision === revision) state().setSaveStatus('saved', copy.savedAt);
        return;
      case 'conflict':
        // The server holds a newer copy (another tab or device): it wins, whatever our clock says.
        failures = 0;
        needsLoad = true;
        serverWins = true;
        return step();
      case 'unreachable':
        return failed();
      case 'refused':
        // A retry would be refused the same way; the copy stays on this device and the next edit tries again.
        state().setSaveStatus('offline');
        return;
    }
  };

  const run = (): Promise<void> => {
    if (stopped) return Promise.resolve();
    if (running) {
      runAgain = true;
      return running;
    }
    running = step().finally(() => {
      running = null;
      if (runAgain && !stopped) {
        runAgain = false;
        schedule(0);
      }
    });
    return running;
  };

  // Work kept on this device shows at once; the server copy replaces it below if it is newer.
  const local = readLocal();
  if (local) restore(local);

  const unsubscribe = store.subscribe((next, previous) => {
    if (next.revision === previous.revision) return;
    liveAt = iso();
    if (next.save.status !== 'offline' && next.save.status !== 'saving') state().setSaveStatus('saving');
    schedule(debounceMs);
  });

  const ready = run();

  return {
    ready,
    flush: () => {
      if (timer !== null) {
        clearTimeout(timer);
        timer = null;
      }
      return run();
    },
    stop: () => {
      stopped = true;
      if (timer !== null) clearTimeout(timer);
      timer = null;
      unsubscribe();
    },
  };
}
