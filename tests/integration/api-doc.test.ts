import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD } from './helpers/client';

// Sends every request shown in docs/api.md and compares the answer with the documented response,
// so the document cannot drift from what the server does.

interface Example {
  method: string;
  path: string;
  as: string | null;
  body: unknown;
  status: number;
  match: 'exact' | 'keys' | 'items';
  response: unknown;
  /** `save=name` on the response block: later examples may use `{name.field}` in their path or body. */
  save: string | null;
}

// Values that differ on every run; the document shows them as "…".
const VOLATILE = new Set(['id', 'learnerId', 'createdAt', 'joinCode', 'classId', 'drillId', 'updatedAt', 'closedAt', 'lastActivity']);

function parseExamples(markdown: string): Example[] {
  const blocks = [...markdown.matchAll(/```(\w+)([^\n]*)\n([\s\S]*?)```/g)].map((m) => ({ lang: m[1], info: m[2]!.trim(), text: m[3]! }));
  const examples: Example[] = [];
  blocks.forEach((block, i) => {
    if (block.lang !== 'http') return;
    const reply = blocks[i + 1];
    if (!reply || reply.lang !== 'json') throw new Error(`request block ${block.text.split('\n')[0]} has no response block`);
    const [head, ...rest] = block.text.split('\n');
    const [method, path] = head!.trim().split(/\s+/);
    const blank = rest.findIndex((line) => line.trim() === '');
    const headers = blank === -1 ? rest : rest.slice(0, blank);
    const bodyText = blank === -1 ? '' : rest.slice(blank + 1).join('\n').trim();
    const as = headers.map((h) => /^As:\s*(.+)$/.exec(h.trim())?.[1]).find(Boolean) ?? null;
    examples.push({
      method: method!,
      path: path!,
      as,
      body: bodyText ? JSON.parse(bodyText) : undefined,
      status: Number(/status=(\d+)/.exec(reply.info)?.[1]),
      match: (/match=(keys|items)/.exec(reply.info)?.[1] as Example['match'] | undefined) ?? 'exact',
      response: JSON.parse(reply.text),
      save: /save=(\w+)/.exec(reply.info)?.[1] ?? null,
    });
  });
  return examples;
}

function withoutVolatile(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutVolatile);
  if (value && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, VOLATILE.has(k) ? '…' : withoutVolatile(v)]));
  }
  return value;
}

// Answers kept by `save=name`, for the ids of things an earlier example made (a class, a drill).
const saved = new Map<string, unknown>();

/** Replaces `{name.path.to.field}` in a string with the saved answer's field. */
function fillIn(text: string): string {
  return text.replace(/\{(\w+)((?:\.\w+)+)\}/g, (whole, name: string, path: string) => {
    let value: unknown = saved.get(name);
    if (value === undefined) throw new Error(`${whole}: no earlier example saved "${name}"`);
    for (const key of path.slice(1).split('.')) value = (value as Record<string, unknown> | null)?.[key];
    if (typeof value !== 'string' && typeof value !== 'number') throw new Error(`${whole}: the saved answer has no such field`);
    return String(value);
  });
}

function fillInBody(value: unknown): unknown {
  if (typeof value === 'string') return fillIn(value);
  if (Array.isArray(value)) return value.map(fillInBody);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, fillInBody(v)]));
  return value;
}

const examples = parseExamples(readFileSync('docs/api.md', 'utf8'));

describe('docs/api.md examples', () => {
  it('the document has examples to check', () => {
    expect(examples.length).toBeGreaterThanOrEqual(7);
  });

  for (const example of examples) {
    it(`${example.method} ${example.path}${example.as ? ` as ${example.as}` : ''} → ${example.status}`, async () => {
      const client = new Client();
      if (example.as) {
        expect((await client.post('/api/auth/sign-in', { email: example.as, password: DEMO_PASSWORD })).status).toBe(200);
      }
      // A documented clientId would be a replay on the second run; each run sends a fresh one.
      const filled = fillInBody(example.body);
      const body = filled && typeof filled === 'object' && 'clientId' in filled ? { ...filled, clientId: randomUUID() } : filled;
      const res = await client.request(example.method, fillIn(example.path), body);
      expect(res.status).toBe(example.status);
      if (example.save) saved.set(example.save, res.body);
      if (example.match === 'keys') {
        expect(Object.keys(res.body).sort()).toEqual(Object.keys(example.response as object).sort());
      } else if (example.match === 'items') {
        // Lists other tests add to (the catalogue): every documented item must be in the answer.
        expect(withoutVolatile(res.body)).toEqual(expect.arrayContaining(withoutVolatile(example.response) as unknown[]));
      } else {
        expect(withoutVolatile(res.body)).toEqual(withoutVolatile(example.response));
      }
    });
  }
});
