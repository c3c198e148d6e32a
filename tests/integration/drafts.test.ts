import { describe, expect, it } from 'vitest';
import { MAX_DRAFT_BYTES } from '../../src/lib/schemas/drafts';
import { Client, newLearner } from './helpers/client';

// Work in progress saved as the learner goes: the copy made last wins, and only its learner sees it.

const SUMP = '/api/drafts/wren-160-sump';

const put = (client: Client, path: string, body: unknown) => client.request('PUT', path, body);

const someDrafts = {
  order: { sequence: ['check-oil-seal', 'fit-gasket'] },
  wrench: { setting: 97.4, unit: 'in·lbf' },
  'final-check': { fastenersCounted: 8, leftover: null, crankTurns: 0.5 },
};

describe('PUT then GET /api/drafts/:procedure', () => {
  it('reads back what was saved, for the version asked for', async () => {
    const { client } = await newLearner('drafts-roundtrip');
    const empty = await client.get(`${SUMP}?version=1`);
    expect(empty).toMatchObject({ status: 200, body: { procedure: 'wren-160-sump', version: 1, drafts: null, savedAt: null } });

    const savedAt = '2026-03-02T10:15:30.250Z';
    const saved = await put(client, `${SUMP}?version=1`, { drafts: someDrafts, savedAt });
    expect(saved.status).toBe(204);
    expect(saved.body).toBeNull();

    const back = await client.get(`${SUMP}?version=1`);
    expect(back.status).toBe(200);
    expect(back.body).toEqual({ procedure: 'wren-160-sump', version: 1, drafts: someDrafts, savedAt });
    // Without ?version the latest version is meant; the demo sump has one.
    expect((await client.get(SUMP)).body).toEqual(back.body);
  });

  it('keeps the newer copy: an older one gets 409 with the savedAt the server holds', async () => {
    const { client } = await newLearner('drafts-lww');
    const first = { drafts: { order: { sequence: ['fit-gasket'] } }, savedAt: '2026-03-02T10:00:00.000Z' };
    const newer = { drafts: { order: { sequence: ['fit-gasket', 'check-oil-seal'] } }, savedAt: '2026-03-02T10:00:05.000Z' };
    const older = { drafts: { order: { sequence: [] } }, savedAt: '2026-03-02T09:59:59.000Z' };

    expect((await put(client, SUMP, first)).status).toBe(204);
    expect((await put(client, SUMP, newer)).status).toBe(204);
    const stale = await put(client, SUMP, older);
    expect(stale.status).toBe(409);
    expect(stale.body).toEqual({ error: expect.any(String), savedAt: newer.savedAt });
    expect((await client.get(SUMP)).body).toMatchObject({ drafts: newer.drafts, savedAt: newer.savedAt });

    // The same savedAt again is a retried save, not a conflict; an offset is the same instant.
    expect((await put(client, SUMP, { ...newer, savedAt: '2026-03-02T12:00:05+02:00' })).status).toBe(204);
  });

  it('counts a copy dated in the future as made now, so another device can still save after it', async () => {
    const { client } = await newLearner('drafts-future');
    expect((await put(client, SUMP, { drafts: { order: { sequence: ['a'] } }, savedAt: '2999-01-01T00:00:00Z' })).status).toBe(204);
    const stored = (await client.get(SUMP)).body;
    expect(Date.parse(stored.savedAt)).toBeLessThanOrEqual(Date.now() + 60_000);
    expect((await put(client, SUMP, { drafts: { order: { sequence: ['b'] } }, savedAt: new Date(Date.now() + 60_000).toISOString() })).status).toBe(204);
    expect((await client.get(SUMP)).body.drafts).toEqual({ order: { sequence: ['b'] } });
  });

  it('keeps a draft per procedure version', async () => {
    const { client } = await newLearner('drafts-versions');
    expect((await put(client, '/api/drafts/wren-160-spark-plug', { drafts: { order: { sequence: ['x'] } }, savedAt: '2026-03-02T10:00:00Z' })).status).toBe(204);
    expect((await client.get(SUMP)).body.drafts).toBeNull();
    expect((await client.get('/api/drafts/wren-160-spark-plug')).body.drafts).toEqual({ order: { sequence: ['x'] } });
  });
});

describe('a draft belongs to its learner', () => {
  it('another learner reads null and their save does not touch the first one', async () => {
    const owner = await newLearner('drafts-owner');
    const other = await newLearner('drafts-other');
    const mine = { drafts: someDrafts, savedAt: '2026-03-02T10:00:00.000Z' };
    expect((await put(owner.client, SUMP, mine)).status).toBe(204);

    expect((await other.client.get(SUMP)).body).toMatchObject({ drafts: null, savedAt: null });
    // An older copy from someone else is no conflict: it lands in their own row.
    expect((await put(other.client, SUMP, { drafts: { order: { sequence: [] } }, savedAt: '2026-01-01T00:00:00.000Z' })).status).toBe(204);
    expect((await owner.client.get(SUMP)).body).toMatchObject(mine);
  });

  it('anonymous callers get 401 for reading and saving', async () => {
    const anon = new Client();
    expect((await anon.get(SUMP)).status).toBe(401);
    expect((await put(anon, SUMP, { drafts: {}, savedAt: '2026-03-02T10:00:00Z' })).status).toBe(401);
  });
});

describe('bad requests', () => {
  it('refuses a body over the size limit with a clear 400, before parsing it', async () => {
    const { client } = await newLearner('drafts-size');
    const filler = 'k'.repeat(100);
    const big = { drafts: { order: { sequence: Array.from({ length: 700 }, () => filler) } }, savedAt: '2026-03-02T10:00:00Z' };
    expect(JSON.stringify(big).length).toBeGreaterThan(MAX_DRAFT_BYTES);
    const res = await put(client, SUMP, big);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/too large/i);
    // Too large even when it is not JSON at all: the size is checked first.
    const junk = await client.request('PUT', SUMP, '{'.repeat(MAX_DRAFT_BYTES + 1));
    expect(junk.status).toBe(400);
    expect(junk.body.error).toMatch(/too large/i);
    expect((await client.get(SUMP)).body.drafts).toBeNull();
  });

  it('names the path of a badly shaped field', async () => {
    const { client } = await newLearner('drafts-shape');
    const res = await put(client, SUMP, { drafts: { order: { sequence: 'fit-gasket' } }, savedAt: '2026-03-02T10:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.issues).toContainEqual({ path: 'drafts.order.sequence', message: expect.any(String) });
    expect(res.body.error).toContain('drafts.order.sequence');

    const unknownStage = await put(client, SUMP, { drafts: { polish: {} }, savedAt: '2026-03-02T10:00:00Z' });
    expect(unknownStage.status).toBe(400);
    expect(unknownStage.body.issues[0].path).toBe('drafts');

    const noDate = await put(client, SUMP, { drafts: {}, savedAt: 'yesterday' });
    expect(noDate.status).toBe(400);
    expect(noDate.body.issues[0].path).toBe('savedAt');

    expect((await client.request('PUT', SUMP, 'not json')).status).toBe(400);
    expect((await client.get(SUMP)).body.drafts).toBeNull();
  });

  it('404 for an unknown procedure or version, 400 for a bad version', async () => {
    const { client } = await newLearner('drafts-404');
    const body = { drafts: {}, savedAt: '2026-03-02T10:00:00Z' };
    expect((await client.get('/api/drafts/no-such-procedure')).status).toBe(404);
    expect((await put(client, '/api/drafts/no-such-procedure', body)).status).toBe(404);
    expect((await client.get(`${SUMP}?version=999`)).status).toBe(404);
    expect((await put(client, `${SUMP}?version=999`, body)).status).toBe(404);
    expect((await client.get(`${SUMP}?version=zero`)).status).toBe(400);
    expect((await put(client, `${SUMP}?version=0`, body)).status).toBe(400);
  });
});
