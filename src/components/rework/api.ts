import { refusal, send } from '../api-client';
import type { PublicProcedure } from '../../lib/procedure/public-view';
import type { ReworkAnswerResult, ReworkList } from './types';

// The rework page's calls to the server; errors become ApiError with words a learner can act on.

const REFUSAL_WORDS = {
  signedOut: 'You are signed out. Sign in again, then come back to your rework.',
  serverDown: 'The server could not answer just now. Try again in a moment.',
  refused: (status: number) => `The server refused this (${status}).`,
};

async function request(path: string, init: RequestInit, offline: string): Promise<Response> {
  const response = await send(path, init, offline);
  if (response.ok) return response;
  throw await refusal(response, REFUSAL_WORDS);
}

export async function loadRework(): Promise<ReworkList> {
  const response = await request('/api/me/rework', {}, 'No connection to the server: your rework list could not be loaded.');
  return (await response.json()) as ReworkList;
}

export interface AnswerRequest {
  answer: { choice: string; variant: number; hinted: boolean };
  clientId: string;
}

/** POST /api/rework/:id/answer; the same clientId is sent again on a retry, so it never counts twice. */
export async function sendAnswer(itemId: string, body: AnswerRequest): Promise<ReworkAnswerResult> {
  const response = await request(
    `/api/rework/${encodeURIComponent(itemId)}/answer`,
    { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) },
    'No connection to the server. Your choice is kept; check again when you are back online.',
  );
  return (await response.json()) as ReworkAnswerResult;
}

export async function loadProcedure(slug: string, version: number): Promise<PublicProcedure> {
  const response = await request(`/api/procedures/${encodeURIComponent(slug)}?version=${version}`, {}, 'No connection: the 3D view could not load.');
  return (await response.json()) as PublicProcedure;
}
