import type { Stage } from '../../lib/procedure/schema';
import { ApiError, defaultFetch, postJson, refusal, type FetchLike } from '../api-client';
import type { StageStanding } from './drill';
import type { AttemptResult, Drafts } from './store';

// The trainer's calls to the server. `fetchImpl` is injectable so the draft saver can be tested without a browser.

export { ApiError, type FetchLike };

export interface SubmitRequest {
  procedure: string;
  version: number;
  stage: Stage;
  answer: unknown;
  clientId: string;
  /** Sent when the trainer was opened for a drill: the attempt counts toward it. */
  drillId?: string;
}

/** The server's verdict, and on a drill the learner's standing on each of its stages afterwards. */
export interface SubmitAnswer extends AttemptResult {
  drill?: { stages: StageStanding[] };
}

/** POST /api/attempts; throws ApiError with a message fit to show. */
export async function submitAttempt(request: SubmitRequest, fetchImpl: FetchLike = defaultFetch): Promise<SubmitAnswer> {
  const response = await postJson(
    '/api/attempts',
    request,
    'No connection to the server. Your work is kept; check again when you are back online.',
    fetchImpl,
  );
  if (response.ok) {
    const body = (await response.json()) as SubmitAnswer;
    return {
      id: body.id,
      score: body.score,
      maxScore: body.maxScore,
      passed: body.passed,
      results: body.results,
      notes: body.notes ?? [],
      answersHidden: body.answersHidden === true,
      ...(body.drill ? { drill: { stages: body.drill.stages } } : {}),
    };
  }
  throw await refusal(response, {
    signedOut: 'You are signed out. Sign in again in another tab, then check again; your work is kept.',
    serverDown: 'The server could not score this just now. Your work is kept; try again in a moment.',
    refused: (status) => `The server refused the check (${status}).`,
  });
}

export interface DraftCopy {
  drafts: Partial<Drafts>;
  savedAt: string;
}

export type LoadDraftOutcome =
  | { kind: 'loaded'; copy: DraftCopy | null }
  /** Network down, 5xx or signed out: worth asking again later. */
  | { kind: 'unreachable'; status: number }
  | { kind: 'refused'; status: number };

export type SaveDraftOutcome =
  | { kind: 'saved' }
  /** The server holds a newer copy (409). */
  | { kind: 'conflict' }
  | { kind: 'unreachable'; status: number }
  | { kind: 'refused'; status: number };

const draftUrl = (slug: string, version: number) => `/api/drafts/${encodeURIComponent(slug)}?version=${version}`;

/** Statuses a later retry can fix: the network, the server, a lapsed session, a rate limit. */
const retryable = (status: number) => status === 0 || status >= 500 || status === 401 || status === 408 || status === 429;

/** GET /api/drafts/:slug?version=N → the saved copy, or null when there is none. */
export async function loadDraft(slug: string, version: number, fetchImpl: FetchLike = defaultFetch): Promise<LoadDraftOutcome> {
  let response: Response;
  try {
    response = await fetchImpl(draftUrl(slug, version), { credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    return { kind: 'unreachable', status: 0 };
  }
  if (!response.ok) return retryable(response.status) ? { kind: 'unreachable', status: response.status } : { kind: 'refused', status: response.status };
  try {
    const body = (await response.json()) as { drafts?: Partial<Drafts> | null; savedAt?: string | null };
    return { kind: 'loaded', copy: body.drafts && body.savedAt ? { drafts: body.drafts, savedAt: body.savedAt } : null };
  } catch {
    return { kind: 'unreachable', status: response.status };
  }
}

/** PUT /api/drafts/:slug?version=N {drafts, savedAt} → 204. */
export async function saveDraft(slug: string, version: number, copy: DraftCopy, fetchImpl: FetchLike = defaultFetch): Promise<SaveDraftOutcome> {
  let response: Response;
  try {
    response = await fetchImpl(draftUrl(slug, version), {
      method: 'PUT',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(copy),
      // Lets the last save finish when the tab closes.
      keepalive: true,
    });
  } catch {
    return { kind: 'unreachable', status: 0 };
  }
  if (response.ok) return { kind: 'saved' };
  if (response.status === 409) return { kind: 'conflict' };
  return retryable(response.status) ? { kind: 'unreachable', status: response.status } : { kind: 'refused', status: response.status };
}

export interface WrenchCalcRequest {
  torque: number;
  unit: string;
  toUnit: string;
  wrenchLength?: number;
  extension?: number;
  lengthUnit?: 'in' | 'mm';
  direction?: 'forward' | 'back';
}
export interface WrenchCalcAnswer {
  setting: number;
  unit: string;
  steps: string[];
}

/** POST /api/tools/wrench-setting with the learner's own numbers. */
export async function calculateWrenchSetting(request: WrenchCalcRequest, fetchImpl: FetchLike = defaultFetch): Promise<WrenchCalcAnswer> {
  const response = await postJson('/api/tools/wrench-setting', request, 'No connection to the server: the calculator needs it.', fetchImpl);
  if (response.ok) return (await response.json()) as WrenchCalcAnswer;
  const body = (await response.json().catch(() => null)) as { error?: string; fields?: Record<string, string[]> } | null;
  const fieldText = body?.fields ? Object.values(body.fields).flat().join('; ') : '';
  throw new ApiError(response.status, fieldText || body?.error || `The calculator could not answer (${response.status}).`);
}
