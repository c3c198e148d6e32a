import { ApiError } from '../trainer/api';
import type { PublicProcedure } from '../../lib/procedure/public-view';
import type { ReworkAnswerResult, ReworkList } from './types';

// The rework page's calls to the server; errors become ApiError with words a learner can act on.

async function errorText(response: Response): Promise<string | null> {
  try {
    const body: unknown = await response.json();
    if (body && typeof body === 'object' && 'error' in body && typeof body.error === 'string') return body.error;
  } catch {
    // Not JSON: the status alone has to do.
  }
  return null;
}

async function request(path: string, init: RequestInit, offline: string): Promise<Response> {
  let response: Response;
  try {
    response = await fetch(path, { credentials: 'same-origin', ...init, headers: { Accept: 'application/json', ...init.headers } });
  } catch {
    throw new ApiError(0, offline);
  }
  if (response.ok) return response;
  if (response.status === 401) throw new ApiError(401, 'You are signed out. Sign in again, then come back to your rework.');
  if (response.status >= 500) throw new ApiError(response.status, 'The server could not answer just now. Try again in a moment.');
  throw new ApiError(response.status, (await errorText(response)) ?? `The server refused this (${response.status}).`);
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
