import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { backoffDelay, draftStorageKey, startDraftSync, type DraftStorage, type DraftSync } from '~/components/trainer/draft-sync';
import { createTrainerStore, type TrainerStore } from '~/components/trainer/store';
import { toPublicProcedure } from '~/lib/procedure/public-view';
import { demoProcedure } from '../support/demo-procedures';

// The draft saver against a scripted server: fake fetch, a Map for localStorage, fake timers for the clock.

const view = toPublicProcedure(demoProcedure('wren-160-sump'), 'learner-1:wren-160-sump:1');
const KEY = draftStorageKey(view.slug, view.version);
const steps = view.steps.map((s) => s.key);
const T0 = Date.parse('2025-03-03T09:00:00.000Z');

type Handler = (url: string, init: RequestInit | undefined) => Response | Promise<Response>;

/** A server that answers GET and PUT from queues (the last answer repeats) and records every call. */
function fakeServer(gets: Handler[], puts: Handler[]) {
  const calls: { method: string; url: string; body: any }[] = [];
  const fetch = async (url: string, init?: RequestInit) => {
    const method = init?.method ?? 'GET';
    calls.push({ method, url, body: init?.body ? JSON.parse(String(init.body)) : undefined });
    const queue = method === 'PUT' ? puts : gets;
    const handler = queue.length > 1 ? queue.shift()! : queue[0]!;
    return handler(url, init);
  };
  return { fetch, calls, puts: () => calls.filter((c) => c.method === 'PUT'), gets: () => calls.filter((c) => c.method === 'GET') };
}

const noDraft: Handler = () => Response.json({ procedure: view.slug, version: view.version, drafts: null, savedAt: null });
const stored: Handler = () => new Response(null, { status: 204 });
const down: Handler = () => {
  throw new TypeError('Failed to fetch');
};
const serverError: Handler = () => Response.json({ error: 'db down' }, { status: 503 });
const copyOf = (sequence: string[], savedAt: string) => ({ drafts: { order: { sequence } }, savedAt });

function memoryStorage(initial?: Record<string, unknown>): DraftStorage & { map: Map<string, string> } {
  const map = new Map(Object.entries(initial ?? {}).map(([k, v]) => [k, JSON.stringify(v)]));
  return { map, getItem: (k) => map.get(k) ?? null, setItem: (k, v) => void map.set(k, v) };
}

let store: TrainerStore;
let sync: DraftSync | null = null;

beforeEach(() => {
  vi.useFakeTimers();
  vi.setSystemTime(T0);
  store = createTrainerStore(view);
});
afterEach(() => {
  sync?.stop();
  sync = null;
  vi.useRealTimers();
});

describe('backoffDelay', () => {
  it('doubles from 1 s and stops at 30 s', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 12].map(backoffDelay)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000]);
  });
});

describe('saving as the learner works', () => {
  it('coalesces quick edits into one PUT 800 ms after the last, with a local copy first', async () => {
    const server = fakeServer([noDraft], [stored]);
    const storage = memoryStorage();
    sync = startDraftSync({ store, fetch: server.fetch, storage });
    await sync.ready;

    store.getState().placeStep(steps[0]!);
    await vi.advanceTimersByTimeAsync(300);
    store.getState().placeStep(steps[1]!);
    await vi.advanceTimersByTimeAsync(300);
    store.getState().placeStep(steps[2]!);
    expect(store.getState().save.status).toBe('saving');
    await vi.advanceTimersByTimeAsync(799);
    expect(server.puts()).toHaveLength(0);
    await vi.advanceTimersByTimeAsync(1);

    expect(server.puts()).toHaveLength(1);
    const put = server.puts()[0]!;
    expect(put.url).toBe(`/api/drafts/${view.slug}?version=${view.version}`);
    expect(put.body.drafts.order.sequence).toEqual(steps.slice(0, 3));
    // savedAt is when the work last changed (600 ms in), not when the request left.
    expect(put.body.savedAt).toBe(new Date(T0 + 600).toISOString());
    expect(JSON.parse(storage.map.get(KEY)!)).toEqual(put.body);
    expect(store.getState().save).toEqual({ status: 'saved', savedAt: put.body.savedAt });
  });

  it('goes offline on failure, keeps the local copy, retries with backoff and then saves', async () => {
    const server = fakeServer([noDraft], [down, serverError, stored]);
    const storage = memoryStorage();
    sync = startDraftSync({ store, fetch: server.fetch, storage });
    await sync.ready;

    store.getState().placeStep(steps[4]!);
    await vi.advanceTimersByTimeAsync(800);
    expect(server.puts()).toHaveLength(1);
    expect(store.getState().save.status).toBe('offline');
    expect(JSON.parse(storage.map.get(KEY)!).drafts.order.sequence).toEqual([steps[4]]);

    await vi.advanceTimersByTimeAsync(999);
    expect(server.puts()).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(server.puts()).toHaveLength(2);
    expect(store.getState().save.status).toBe('offline');

    await vi.advanceTimersByTimeAsync(1999);
    expect(server.puts()).toHaveLength(2);
    await vi.advanceTimersByTimeAsync(1);
    expect(server.puts()).toHaveLength(3);
    expect(server.puts()[2]!.body).toEqual(server.puts()[0]!.body);
    expect(store.getState().save.status).toBe('saved');

    await vi.advanceTimersByTimeAsync(60_000);
    expect(server.puts()).toHaveLength(3);
  });

  it('on 409 takes the newer server copy', async () => {
    const newer = copyOf([steps[5]!, steps[6]!], new Date(T0 + 5000).toISOString());
    const server = fakeServer(
      [noDraft, () => Response.json({ procedure: view.slug, version: view.version, ...newer })],
      [() => Response.json({ error: 'A newer copy of this work is already saved', savedAt: newer.savedAt }, { status: 409 })],
    );
    const storage = memoryStorage();
    sync = startDraftSync({ store, fetch: server.fetch, storage });
    await sync.ready;

    store.getState().placeStep(steps[0]!);
    await vi.advanceTimersByTimeAsync(800);

    expect(server.gets()).toHaveLength(2);
    expect(store.getState().drafts.order.sequence).toEqual(newer.drafts.order.sequence);
    expect(store.getState().save).toEqual({ status: 'saved', savedAt: newer.savedAt });
    expect(JSON.parse(storage.map.get(KEY)!)).toEqual(newer);
    // Taking the server's copy is not an edit: nothing more is sent.
    await vi.advanceTimersByTimeAsync(10_000);
    expect(server.puts()).toHaveLength(1);
  });
});

describe('starting up', () => {
  it('takes the server copy when it is newer than the copy on this device', async () => {
    const local = copyOf([steps[0]!], new Date(T0 - 60_000).toISOString());
    const remote = copyOf([steps[1]!, steps[2]!], new Date(T0 - 1_000).toISOString());
    const server = fakeServer([() => Response.json({ procedure: view.slug, version: view.version, ...remote })], [stored]);
    const storage = memoryStorage({ [KEY]: local });
    sync = startDraftSync({ store, fetch: server.fetch, storage });
    await sync.ready;

    expect(store.getState().drafts.order.sequence).toEqual(remote.drafts.order.sequence);
    expect(JSON.parse(storage.map.get(KEY)!)).toEqual(remote);
    expect(store.getState().save.status).toBe('saved');
    await vi.advanceTimersByTimeAsync(5_000);
    expect(server.puts()).toHaveLength(0);
  });

  it('keeps the device copy when it is newer and sends it to the server', async () => {
    const local = copyOf([steps[3]!], new Date(T0 - 1_000).toISOString());
    const remote = copyOf([steps[1]!, steps[2]!], new Date(T0 - 60_000).toISOString());
    const server = fakeServer([() => Response.json({ procedure: view.slug, version: view.version, ...remote })], [stored]);
    sync = startDraftSync({ store, fetch: server.fetch, storage: memoryStorage({ [KEY]: local }) });
    await sync.ready;

    expect(store.getState().drafts.order.sequence).toEqual([steps[3]]);
    expect(server.puts()).toHaveLength(1);
    expect(server.puts()[0]!.body.savedAt).toBe(local.savedAt);
    expect(server.puts()[0]!.body.drafts.order).toEqual(local.drafts.order);
    expect(store.getState().save).toEqual({ status: 'saved', savedAt: local.savedAt });
  });

  it('shows the device copy while the server cannot be reached, then syncs when it answers', async () => {
    const local = copyOf([steps[2]!], new Date(T0 - 1_000).toISOString());
    const server = fakeServer([serverError, noDraft], [stored]);
    sync = startDraftSync({ store, fetch: server.fetch, storage: memoryStorage({ [KEY]: local }) });
    await sync.ready;

    expect(store.getState().drafts.order.sequence).toEqual([steps[2]]);
    expect(store.getState().save.status).toBe('offline');
    await vi.advanceTimersByTimeAsync(1000);
    expect(server.gets()).toHaveLength(2);
    expect(server.puts().map((p) => p.body)).toEqual([{ ...local, drafts: store.getState().drafts }]);
    expect(store.getState().save.status).toBe('saved');
  });

  it('ignores a malformed copy on this device', async () => {
    const server = fakeServer([noDraft], [stored]);
    const storage = memoryStorage({ [KEY]: { drafts: { order: { sequence: 'not a list' } }, savedAt: 'yesterday' } });
    sync = startDraftSync({ store, fetch: server.fetch, storage });
    await sync.ready;
    expect(store.getState().drafts.order.sequence).toEqual([]);
    expect(server.puts()).toHaveLength(0);
    expect(store.getState().save.status).toBe('idle');
  });
});
