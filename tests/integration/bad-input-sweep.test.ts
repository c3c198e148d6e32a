import { randomUUID } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner } from './helpers/client';
import { newInstructor, pngBytes } from './helpers/bench-world';
import { inDays } from './helpers/drill-class';
import { publishOwnProcedure } from './helpers/own-procedure';
import { BASE_URL } from './helpers/server';

// Every API route, found from the files under src/pages/api (a new route is swept without being listed here),
// gets bodies no form would send, as each kind of caller, with ids that exist and ids that do not. Whatever
// the route decides, the answer must be a 4xx with an `error` in words (or a success), never a 500.

const API_DIR = 'src/pages/api';
const BODY_METHODS = new Set(['POST', 'PUT', 'PATCH']);

interface Route {
  file: string;
  /** The URL path with its [params] still in it. */
  pattern: string;
  methods: string[];
}

function routeFiles(dir: string, ext = '.ts'): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? routeFiles(path, ext) : path.endsWith(ext) ? [path] : [];
  });
}

const routes: Route[] = routeFiles(API_DIR).map((file) => ({
  file,
  pattern: '/api/' + relative(API_DIR, file).replace(/\.ts$/, '').replace(/(^|\/)index$/, ''),
  methods: [...readFileSync(file, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]!),
}));

/** Bodies no form would send: broken JSON, JSON of the wrong shape, odd types, a large string. */
const BAD_BODIES: { name: string; body: string | Uint8Array; type: string }[] = [
  { name: 'broken JSON', body: '{"name": ', type: 'application/json' },
  { name: 'a JSON array', body: '[1, 2, 3]', type: 'application/json' },
  { name: 'JSON null', body: 'null', type: 'application/json' },
  { name: 'a JSON string', body: '"hello"', type: 'application/json' },
  { name: 'unknown fields only', body: '{"unexpected": true, "id": {"$gt": ""}}', type: 'application/json' },
  { name: 'wrong types', body: '{"name": 7, "email": [], "stage": {}, "answer": "x", "procedure": 1, "caption": false}', type: 'application/json' },
  { name: 'a 200 KB string', body: JSON.stringify({ name: 'x'.repeat(200_000) }), type: 'application/json' },
  { name: 'NUL characters in every likely field', body: JSON.stringify(Object.fromEntries(['name', 'email', 'procedure', 'stage', 'caption', 'joinCode', 'notes', 'token', 'title'].map((k) => [k, `a\u0000b`]))), type: 'application/json' },
  { name: 'a NUL in a key', body: '{"a\\u0000b": 1}', type: 'application/json' },
  { name: 'plain text', body: 'just some words', type: 'text/plain' },
  { name: 'a form with NUL in its fields', body: nulForm(), type: 'multipart/form-data; boundary=sweep' },
  { name: 'bytes called a form', body: pngBytes(), type: 'multipart/form-data; boundary=nothing-here' },
];

/** A multipart form with a file, whose text fields (procedure, caption …) carry a NUL character. */
function nulForm(): Uint8Array {
  const field = (name: string, value: string) => `--sweep\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const fields = [field('purpose', 'procedure-reference'), ...['procedure', 'caption', 'slug', 'action'].map((name) => field(name, 'wren\u0000160'))];
  const file = '--sweep\r\nContent-Disposition: form-data; name="file"; filename="spec.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4\r\n';
  return new TextEncoder().encode(fields.join('') + file + '--sweep--\r\n');
}

/** Routes whose call would end the caller's session or remove what the sweep stands on. */
const SKIPPED = new Set(['POST /api/auth/sign-out']);

type Caller = { name: string; client: Client; headers?: Record<string, string> };
let callers: Caller[] = [];
let params: Record<string, string> = {};

beforeAll(async () => {
  const instructor = await newInstructor('sweep-teacher');
  const learner = await newLearner('sweep-learner');
  const admin = await demoUser('admin@larkspur.example');
  const target = await newLearner('sweep-target');

  const made = await instructor.client.post('/api/classes', { name: `Sweep ${randomUUID().slice(0, 6)}` });
  expect(made.status).toBe(201);
  expect((await learner.client.post('/api/classes/join', { joinCode: made.body.joinCode })).status).toBe(200);
  const drill = await instructor.client.post(`/api/classes/${made.body.id}/drills`, {
    procedure: 'wren-160-sump', stages: ['wrench'], dueAt: inDays(7), passMarkPct: 80, attemptLimit: null,
  });
  expect(drill.status).toBe(201);
  const { slug } = await publishOwnProcedure(instructor.client, 'sweep');
  const draft = await instructor.client.post('/api/procedure-drafts', {});
  const form = new FormData();
  form.set('purpose', 'procedure-reference');
  form.set('procedure', slug);
  form.set('file', new Blob([pngBytes() as Uint8Array<ArrayBuffer>], { type: 'image/png' }), 'cover.png');
  const upload = await instructor.client.postForm('/api/uploads', form);
  expect(upload.status).toBe(201);
  // A wrong wrench setting: an attempt to point at, and a rework item from its miss.
  const attempt = await learner.client.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'wrench', answer: { setting: 1, unit: 'N·m' }, clientId: randomUUID() });
  expect(attempt.status).toBe(201);
  const rework = await learner.client.get('/api/me/rework');
  expect(rework.body.due.length).toBeGreaterThan(0);

  callers = [
    { name: 'learner', client: learner.client },
    { name: 'instructor', client: instructor.client },
    { name: 'admin', client: admin.client },
    { name: 'signed out', client: new Client() },
    // A session cookie no sign-in ever set, with a NUL in it.
    { name: 'a forged cookie', client: new Client(), headers: { cookie: 'bw_session=abc%00def' } },
  ];
  // Ids that exist and belong to the callers, so a bad body gets past the ownership checks to the parsing.
  params = {
    '[id]': '',
    classes: made.body.id,
    drills: drill.body.id,
    attempts: attempt.body.id,
    rework: rework.body.due[0].id,
    uploads: upload.body.id,
    'procedure-drafts': draft.body.id,
    drafts: draft.body.id,
    learners: learner.user.id,
    users: target.user.id,
    '[slug]': slug,
    '[procedure]': 'wren-160-sump',
  };
});

/** The pattern with real ids: an [id] takes the id of the thing named just before it. */
function realPath(pattern: string): string {
  return pattern.replace(/([\w-]+)\/\[id\]/g, (_, owner: string) => `${owner}/${params[owner]}`).replace(/\[(slug|procedure)\]/g, (p) => params[p]!);
}

async function send(caller: Caller, method: string, path: string, body?: { body: string | Uint8Array; type: string }) {
  return caller.client.request(method, path, body?.body ?? undefined, {
    origin: BASE_URL,
    ...(body ? { 'content-type': body.type } : {}),
    ...caller.headers,
  });
}

function expectClearAnswer(res: { status: number; body: unknown }, what: string) {
  expect(res.status, what).toBeLessThan(500);
  if (res.status >= 400) expect((res.body as { error?: unknown } | null)?.error, what).toEqual(expect.any(String));
}

describe('no API route answers 500 to bad input', () => {
  it('finds the routes to sweep', () => {
    expect(routes.length).toBeGreaterThanOrEqual(40);
  });

  for (const route of routes) {
    const methods = route.methods.filter((m) => m !== 'DELETE' && !SKIPPED.has(`${m} ${route.pattern}`));
    if (methods.length === 0) continue;
    it(`${methods.join(', ')} ${route.pattern}`, async () => {
      const path = realPath(route.pattern);
      for (const method of methods) {
        for (const caller of callers) {
          if (BODY_METHODS.has(method)) {
            for (const bad of BAD_BODIES) expectClearAnswer(await send(caller, method, path, bad), `${caller.name}: ${method} ${path} with ${bad.name}`);
          } else {
            const odd = `${path}?version=abc&tz=Not%2FA_Zone&procedure=%00&page=-1`;
            expectClearAnswer(await send(caller, method, odd), `${caller.name}: ${method} ${odd}`);
          }
        }
      }
    });

    if (!route.pattern.includes('[')) continue;
    it(`${route.pattern} with ids that are malformed or belong to nothing`, async () => {
      for (const id of ['not-an-id', randomUUID(), '%00', '1'.repeat(300)]) {
        const path = route.pattern.replace(/\[\w+\]/g, id);
        for (const method of route.methods.filter((m) => !SKIPPED.has(`${m} ${route.pattern}`))) {
          for (const caller of callers) {
            const res = await send(caller, method, path, BODY_METHODS.has(method) ? BAD_BODIES[4] : undefined);
            expectClearAnswer(res, `${caller.name}: ${method} ${path}`);
          }
        }
      }
    });
  }
});

// Pages take their ids and slugs from the address too: a malformed one, one that names nothing, or a NUL
// in the address or the query gets a page that says so (404, 403, 400), or the sign-in page, never a 500.
const PAGE_DIR = 'src/pages';
const pageFiles = routeFiles(PAGE_DIR, '.astro');
const pathOf = (file: string) => '/' + relative(PAGE_DIR, file).replace(/\.astro$/, '').replace(/(^|\/)index$/, '');
const pages = pageFiles.map(pathOf);
/** Pages that take their own form posts (found by the check they start with). */
const formPages = pageFiles.filter((file) => readFileSync(file, 'utf8').includes("request.method === 'POST'")).map(pathOf);

describe('no page answers 500 to a bad address', () => {
  it('finds the pages to sweep', () => {
    expect(pages.length).toBeGreaterThanOrEqual(20);
  });

  for (const page of pages) {
    it(`GET ${page}`, async () => {
      const ids = page.includes('[') ? ['not-an-id', randomUUID(), '%00', realPath(page)] : [page];
      for (const id of ids) {
        const path = id.startsWith('/') ? id : page.replace(/\[\w+\]/g, id);
        for (const caller of callers) {
          for (const query of ['', '?published=%00&version=abc&next=%00', '?tz=Not%2FA_Zone&page=-1&q=%27%3B']) {
            const res = await caller.client.request('GET', path + query, undefined, caller.headers);
            expect(res.status, `${caller.name}: GET ${path}${query}`).toBeLessThan(500);
          }
        }
      }
    });
  }
});

describe('no page answers 500 to a bad form post', () => {
  it('finds the pages that take forms', () => {
    expect(formPages).toEqual(expect.arrayContaining(['/sign-in', '/sign-up', '/teach/procedures']));
  });

  for (const page of formPages) {
    it(`POST ${page}`, async () => {
      const forms = [
        ...BAD_BODIES,
        { name: 'a form with a NUL in every field', body: new URLSearchParams(Object.fromEntries(['email', 'password', 'name', 'joinCode', 'token', 'action', 'slug', 'role', 'userId', 'draft'].map((k) => [k, 'a\u0000b']))).toString(), type: 'application/x-www-form-urlencoded' },
        { name: 'an empty form', body: '', type: 'application/x-www-form-urlencoded' },
      ];
      for (const caller of callers) {
        for (const bad of forms) {
          const res = await caller.client.request('POST', page, bad.body, { origin: BASE_URL, 'content-type': bad.type, ...caller.headers });
          expect(res.status, `${caller.name}: POST ${page} with ${bad.name}`).toBeLessThan(500);
        }
      }
    });
  }
});
