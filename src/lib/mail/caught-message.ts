// One message as the local mail catcher (scripts/fakes/mail-catcher.mjs) lists it at /messages. Read by the
// admins' sent-mail page and by the tests, so both agree on its shape.

export interface CaughtMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export function isCaughtMessage(value: unknown): value is CaughtMessage {
  if (!value || typeof value !== 'object') return false;
  const m = value as Record<string, unknown>;
  return typeof m.id === 'string' && Array.isArray(m.to) && typeof m.subject === 'string' && typeof m.text === 'string' && typeof m.receivedAt === 'string';
}
