import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { attempts, procedureVersions, procedures } from '../../src/db/schema';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { validateProcedure } from '../../src/lib/procedure/validate';
import type { Procedure } from '../../src/lib/procedure/schema';
import { Client, demoUser, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { BASE_URL } from './helpers/server';
import { coverProcedure } from '../support/cover-procedure';

// The procedure editor's routes: drafts, publish, clone, import and export, and who may do what.

/** A body-less DELETE carries its page's origin, as a browser's fetch does (Astro's origin check wants it). */
const SAME_ORIGIN = { origin: BASE_URL };

const INSTRUCTOR = 'instructor@larkspur.example';
const OTHER_INSTRUCTOR = 'instructor2@larkspur.example';
const ADMIN = 'admin@larkspur.example';

/** The cover job as a draft document: no slug or version (the server gives those), a title of its own. */
function coverDraft(title = `Cover practice ${randomUUID().slice(0, 6)}`) {
  const { slug: _slug, version: _version, ...rest } = coverProcedure();
  return { ...rest, title };
}

async function newDraft(client: Client, document: Record<string, unknown>) {
  const created = await client.post('/api/procedure-drafts', {});
  expect(created.status).toBe(201);
  const saved = await client.request('PUT', `/api/procedure-drafts/${created.body.id}`, { document, revision: created.body.revision });
  expect(saved.status).toBe(200);
  return { id: created.body.id as string, revision: saved.body.revision as number };
}

async function publishCover(client: Client, title?: string) {
  const draft = await newDraft(client, coverDraft(title));
  const res = await client.post(`/api/procedure-drafts/${draft.id}/publish`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { slug: string; version: number; created: boolean };
}

describe('drafts', () => {
  it('a new draft is blank, saves incomplete work, and refuses a stale revision', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const created = await client.post('/api/procedure-drafts', {});
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ title: '', basedOn: null, revision: 1, document: { stages: ['order'], parts: [] } });
    const url = `/api/procedure-drafts/${created.body.id}`;

    // Half-typed: a key in capitals, a number left empty. Saved as it is.
    const half = { title: 'Half done', parts: [{ key: 'Not Yet', count: null }] };
    const saved = await client.request('PUT', url, { document: half, revision: 1 });
    expect(saved.status).toBe(200);
    expect(saved.body.revision).toBe(2);
    expect((await client.get(url)).body).toMatchObject({ title: 'Half done', revision: 2, document: half });

    // A window still on revision 1 may not overwrite revision 2.
    const stale = await client.request('PUT', url, { document: { title: 'Older' }, revision: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.revision).toBe(2);
    expect((await client.get(url)).body.title).toBe('Half done');

    const list = await client.get('/api/procedure-drafts');
    expect(list.body.map((d: { id: string }) => d.id)).toContain(created.body.id);
  });

  it('400 for a document that is not an object, naming the field', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const created = await client.post('/api/procedure-drafts', {});
    const res = await client.request('PUT', `/api/procedure-drafts/${created.body.id}`, { document: [1, 2], revision: 1 });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toBe('document');
    const bad = await client.request('PUT', `/api/procedure-drafts/${created.body.id}`, 'not json', { 'content-type': 'application/json' });
    expect(bad.status).toBe(400);
  });

  it('deleting a draft removes it', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const created = await client.post('/api/procedure-drafts', {});
    expect((await client.request('DELETE', `/api/procedure-drafts/${created.body.id}`, undefined, SAME_ORIGIN)).status).toBe(204);
    expect((await client.get(`/api/procedure-drafts/${created.body.id}`)).status).toBe(404);
  });
});

describe('publish', () => {
  it('checks everything and answers 400 with every problem and its path', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const created = await client.post('/api/procedure-drafts', {});
    const res = await client.post(`/api/procedure-drafts/${created.body.id}/publish`);
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['title', 'cautions', 'parts', 'steps']));
    // Nothing was published and the draft is still there.
    expect((await client.get(`/api/procedure-drafts/${created.body.id}`)).status).toBe(200);
  });

  const refusals: [string, (d: ReturnType<typeof coverDraft>) => void, { path: string; key: string }][] = [
    ['a cycle', (d) => void (d.steps[0]!.after = ['step-seat']), { path: 'steps.0.after', key: 'step-seat' }],
    ['a missing part', (d) => void d.steps[1]!.parts!.push('head-gasket'), { path: 'steps.1.parts.1', key: 'head-gasket' }],
    ['a pin without a hole', (d) => void (d.pinSeats = []), { path: 'parts.3', key: 'dowel-pin-8' }],
  ];
  for (const [name, change, expected] of refusals) {
    it(`refuses ${name}, naming the offending key at its path`, async () => {
      const { client } = await demoUser(INSTRUCTOR);
      const doc = coverDraft();
      change(doc);
      const draft = await newDraft(client, doc);
      const res = await client.post(`/api/procedure-drafts/${draft.id}/publish`);
      expect(res.status).toBe(400);
      const issue = res.body.issues.find((i: { path: string }) => i.path === expected.path);
      expect(issue?.message).toContain(expected.key);
    });
  }

  it('the first publish creates the procedure under a slug from its title, owned by the publisher; learners can practise it', async () => {
    const { client, user } = await demoUser(INSTRUCTOR);
    const title = `Cover practice ${randomUUID().slice(0, 6)}`;
    const draft = await newDraft(client, coverDraft(title));
    const res = await client.post(`/api/procedure-drafts/${draft.id}/publish`);
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ slug: title.toLowerCase().replace(/ /g, '-'), version: 1, created: true });
    // The draft became the version.
    expect((await client.get(`/api/procedure-drafts/${draft.id}`)).status).toBe(404);

    const { db, close } = testDb();
    const [row] = await db.select().from(procedures).where(eq(procedures.slug, res.body.slug));
    await close();
    expect(row!.createdBy).toBe(user.id);

    const { client: learner } = await newLearner('editor-practice');
    const view = await learner.get(`/api/procedures/${res.body.slug}`);
    expect(view.status).toBe(200);
    expect(view.body).toMatchObject({ title, version: 1 });
    expect(JSON.stringify(view.body)).not.toContain('"after"');
  });

  it('a second draft with the same title gets the next free slug', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const title = `Twin cover ${randomUUID().slice(0, 6)}`;
    const first = await publishCover(client, title);
    const second = await publishCover(client, title);
    expect(second.slug).toBe(`${first.slug}-2`);
  });

  it('publishing an edit makes version 2, while an attempt made on version 1 still references version 1', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const v1 = await publishCover(client);
    const v1Doc = await exportedProcedure(client, v1.slug);

    const { client: learner } = await newLearner('editor-versions');
    const old = await learner.post('/api/attempts', { procedure: v1.slug, stage: 'final-check', answer: correctAnswer(v1Doc, 'final-check'), clientId: randomUUID() });
    expect(old.status).toBe(201);
    expect(old.body).toMatchObject({ version: 1, passed: true });

    // The edit: two crank turns now.
    const edit = await client.post('/api/procedure-drafts', { basedOn: v1.slug });
    expect(edit.status).toBe(201);
    expect(edit.body).toMatchObject({ basedOn: v1.slug, document: { slug: v1.slug, title: v1Doc.title } });
    const changed = { ...edit.body.document, finalCheck: { fastenerCount: 4, crankTurns: 2 } };
    expect((await client.request('PUT', `/api/procedure-drafts/${edit.body.id}`, { document: changed, revision: edit.body.revision })).status).toBe(200);
    const v2 = await client.post(`/api/procedure-drafts/${edit.body.id}/publish`);
    expect(v2.status).toBe(201);
    expect(v2.body).toEqual({ slug: v1.slug, version: 2, created: true });

    // The old attempt keeps version 1, in the API and in the table.
    expect((await learner.get(`/api/attempts/${old.body.id}`)).body).toMatchObject({ version: 1, passed: true });
    const { db, close } = testDb();
    const [row] = await db
      .select({ version: procedureVersions.version })
      .from(attempts)
      .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
      .where(eq(attempts.id, old.body.id));
    await close();
    expect(row!.version).toBe(1);
    // A new attempt is scored against version 2, which wants two turns.
    const latest = await learner.post('/api/attempts', { procedure: v1.slug, stage: 'final-check', answer: correctAnswer(v1Doc, 'final-check'), clientId: randomUUID() });
    expect(latest.body).toMatchObject({ version: 2, passed: false });
  });

  it('publishing an edit that changes nothing writes no version', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const v1 = await publishCover(client);
    const edit = await client.post('/api/procedure-drafts', { basedOn: v1.slug });
    const res = await client.post(`/api/procedure-drafts/${edit.body.id}/publish`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ slug: v1.slug, version: 1, created: false });
  });
});

describe('clone, export and import', () => {
  it('clone: a draft of the latest version, "(copy)", published under a new slug owned by the cloner', async () => {
    const { client: owner } = await demoUser(INSTRUCTOR);
    const original = await publishCover(owner);
    const { client: other, user: otherUser } = await demoUser(OTHER_INSTRUCTOR);
    const clone = await other.post(`/api/procedures/${original.slug}/clone`);
    expect(clone.status).toBe(201);
    expect(clone.body.title).toMatch(/ \(copy\)$/);
    expect(clone.body.basedOn).toBeNull();
    expect(clone.body.document).not.toHaveProperty('slug');
    const published = await other.post(`/api/procedure-drafts/${clone.body.id}/publish`);
    expect(published.status).toBe(201);
    expect(published.body).toMatchObject({ slug: `${original.slug}-copy`, version: 1 });
    const { db, close } = testDb();
    const [row] = await db.select().from(procedures).where(eq(procedures.slug, published.body.slug));
    await close();
    expect(row!.createdBy).toBe(otherUser.id);
    expect((await other.post('/api/procedures/no-such-procedure/clone')).status).toBe(404);
  });

  it('export gives the whole document as a file; importing it makes a draft with an equal document', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const res = await client.get('/api/procedures/wren-160-sump/export');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toBe('attachment; filename="wren-160-sump-v1.benchwright.json"');
    expect(res.body).toMatchObject({ format: 'benchwright-procedure', formatVersion: 1, procedure: { slug: 'wren-160-sump', pinSeats: expect.any(Array) } });
    expect(res.body.$schema).toMatch(/\/api\/procedures\/schema\.json$/);

    const imported = await client.post('/api/procedure-drafts/import', { document: res.body });
    expect(imported.status).toBe(201);
    const { version, ...rest } = res.body.procedure;
    expect(version).toBe(1);
    expect(imported.body.document).toEqual(rest);
    // Published, it is a procedure of the importer's, not a new version of the demo.
    const published = await client.post(`/api/procedure-drafts/${imported.body.id}/publish`);
    expect(published.status).toBe(201);
    expect(published.body.slug).toMatch(/^wren-160-sump-\d+$/);
    const again = await exportedProcedure(client, published.body.slug);
    expect({ ...again, slug: 'wren-160-sump' }).toEqual(res.body.procedure);
  });

  it('import refuses a broken file with every problem and its path', async () => {
    const { client } = await demoUser(INSTRUCTOR);
    const file = (await client.get('/api/procedures/wren-160-head/export')).body;
    file.procedure.steps[0].text = '';
    file.procedure.anchors[0].sizeMm = -1;
    const res = await client.post('/api/procedure-drafts/import', { document: file });
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['procedure.anchors.0.sizeMm', 'procedure.steps.0.text']);

    const refs = (await client.get('/api/procedures/wren-160-head/export')).body;
    refs.procedure.steps[3].after = ['fit-head-gasket'];
    const cycle = await client.post('/api/procedure-drafts/import', { document: refs });
    expect(cycle.status).toBe(400);
    expect(cycle.body.issues[0]).toMatchObject({ path: 'procedure.steps.3.after', message: expect.stringContaining('fit-head-gasket') });

    expect((await client.post('/api/procedure-drafts/import', {})).status).toBe(400);
  });

  it('the JSON Schema is served to anyone and is the committed docs/procedure.schema.json', async () => {
    const res = await new Client().get('/api/procedures/schema.json');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('application/schema+json');
    expect(res.body).toEqual(JSON.parse(readFileSync('docs/procedure.schema.json', 'utf8')));
  });
});

describe('who may do what', () => {
  it('signed out: 401 everywhere but the schema', async () => {
    const anon = new Client();
    const id = randomUUID();
    for (const [method, path] of [
      ['GET', '/api/procedure-drafts'],
      ['POST', '/api/procedure-drafts'],
      ['GET', `/api/procedure-drafts/${id}`],
      ['PUT', `/api/procedure-drafts/${id}`],
      ['DELETE', `/api/procedure-drafts/${id}`],
      ['POST', `/api/procedure-drafts/${id}/publish`],
      ['POST', '/api/procedure-drafts/import'],
      ['GET', '/api/procedures/wren-160-sump/export'],
      ['POST', '/api/procedures/wren-160-sump/clone'],
    ] as const) {
      expect((await anon.request(method, path, method === 'GET' || method === 'DELETE' ? undefined : {}, SAME_ORIGIN)).status, `${method} ${path}`).toBe(401);
    }
  });

  it('learners: 403 everywhere, and never see an answer key through export', async () => {
    const { client } = await newLearner('editor-learner');
    expect((await client.get('/api/procedure-drafts')).status).toBe(403);
    expect((await client.post('/api/procedure-drafts', {})).status).toBe(403);
    expect((await client.post('/api/procedure-drafts/import', { document: {} })).status).toBe(403);
    expect((await client.get('/api/procedures/wren-160-sump/export')).status).toBe(403);
    expect((await client.post('/api/procedures/wren-160-sump/clone')).status).toBe(403);
    expect((await client.get(`/api/procedure-drafts/${randomUUID()}`)).status).toBe(403);
  });

  it("another instructor: 404 for someone else's draft, 403 to publish a new version of their procedure", async () => {
    const { client: owner } = await demoUser(INSTRUCTOR);
    const doc = coverDraft();
    const draft = await newDraft(owner, doc);
    const { client: other } = await demoUser(OTHER_INSTRUCTOR);
    const url = `/api/procedure-drafts/${draft.id}`;
    expect((await other.get(url)).status).toBe(404);
    expect((await other.request('PUT', url, { document: { title: 'Mine now' }, revision: draft.revision })).status).toBe(404);
    expect((await other.post(`${url}/publish`)).status).toBe(404);
    expect((await other.request('DELETE', url, undefined, SAME_ORIGIN)).status).toBe(404);
    expect((await other.get('/api/procedure-drafts')).body.map((d: { id: string }) => d.id)).not.toContain(draft.id);
    // Untouched.
    expect((await owner.get(url)).body).toMatchObject({ title: doc.title, revision: draft.revision });

    const published = await publishCover(owner);
    const edit = await other.post('/api/procedure-drafts', { basedOn: published.slug });
    expect(edit.status).toBe(403);
    // Nor the demo procedures, which no instructor created.
    expect((await other.post('/api/procedure-drafts', { basedOn: 'wren-160-sump' })).status).toBe(403);
    expect((await other.post('/api/procedure-drafts', { basedOn: 'no-such-procedure' })).status).toBe(404);
    // A malformed draft id is simply not found.
    expect((await other.get('/api/procedure-drafts/not-a-uuid')).status).toBe(404);
  });

  it("an admin may prepare a new version of anyone's procedure", async () => {
    const { client: owner } = await demoUser(INSTRUCTOR);
    const published = await publishCover(owner);
    const { client: admin } = await demoUser(ADMIN);
    const edit = await admin.post('/api/procedure-drafts', { basedOn: published.slug });
    expect(edit.status).toBe(201);
    const changed = { ...edit.body.document, summary: 'Checked by the school admin. Demo values for a fictional engine.' };
    await admin.request('PUT', `/api/procedure-drafts/${edit.body.id}`, { document: changed, revision: edit.body.revision });
    const res = await admin.post(`/api/procedure-drafts/${edit.body.id}/publish`);
    expect(res.body).toEqual({ slug: published.slug, version: 2, created: true });
  });
});

async function exportedProcedure(client: Client, slug: string): Promise<Procedure> {
  const res = await client.get(`/api/procedures/${slug}/export`);
  expect(res.status).toBe(200);
  const checked = validateProcedure(res.body.procedure);
  if (!checked.ok) throw new Error(JSON.stringify(checked.issues));
  return checked.procedure;
}
