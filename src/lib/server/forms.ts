import type { ZodError } from 'zod';
import { hasNul } from '../text/nul';

export type FieldErrors = Record<string, string[] | undefined>;

/**
 * Reads an HTML form post as plain strings; anything unreadable becomes an empty form, and so does one with
 * a NUL character (no browser sends one from a text field, and the database refuses it).
 */
export async function readForm(request: Request): Promise<Record<string, string>> {
  try {
    const data = await request.formData();
    const out: Record<string, string> = {};
    for (const [name, value] of data) if (typeof value === 'string') out[name] = value;
    return hasNul(out) ? {} : out;
  } catch {
    return {};
  }
}

export function fieldErrors(err: ZodError): FieldErrors {
  return err.flatten().fieldErrors as FieldErrors;
}

/** Only same-site paths may be a post-sign-in destination (no open redirects). */
export function safeNext(next: string | null | undefined): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  return next;
}
