import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { procedureVersions } from '../../src/db/schema';
import { publishProcedure } from '../../src/lib/server/procedure-store';
import { Client, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';

describe('GET /api/procedures', () => {
  it('lists the four demo procedures with their stages', async () => {
    const { client } = await newLearner('catalogue');
    const res = await client.get('/api/procedures');
    expect(res.status).toBe(200);
    const bySlug = Object.fromEntries(res.body.map((p: { slug: string }) => [p.slug, p]));
    expect(bySlug['wren-160-sump']).toMatchObject({
      title: expect.any(String),
      version: 1,
      engine: { key: 'wren-160', name: 'Wren 160' },
      stages: ['order', 'pins', 'pattern', 'wrench', 'final-check'],
      demoValues: true,
    });
    expect(Object.keys(bySlug)).toEqual(expect.arrayContaining(['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']));
  });

  it('needs a signed-in user', async () => {
    expect((await new Client().get('/api/procedures')).status).toBe(401);
  });
});

describe('GET /api/procedures/:slug sends what the trainer draws, never the answer key', () => {
  it('has parts, anchors, shuffled steps and cautions, but no constraints, seats, decoy flags or pass fractions', async () => {
    const { client } = await newLearner('public-view');
    const res = await client.get('/api/procedures/wren-160-sump');
    expect(res.status).toBe(200);
    const view = res.body;
    const doc = demoProcedure('wren-160-sump');
    expect(view.cautions.length).toBeGreaterThan(0);
    expect(view.steps.map((s: { key: string }) => s.key).sort()).toEqual(doc.steps.map((s) => s.key).sort());
    expect(view.parts).toHaveLength(doc.parts.length);
    const text = JSON.stringify(view);
    for (const secret of ['"after"', '"pinSeats"', '"decoy"', '"passes"', '"finalCheck"', '"rule"']) expect(text).not.toContain(secret);
    // The stored order of steps is itself a hint; the view must not repeat it.
    expect(view.steps.map((s: { key: string }) => s.key)).not.toEqual(doc.steps.map((s) => s.key));
    // Stable for one learner, so a reload does not reshuffle the list under their hands.
    expect((await client.get('/api/procedures/wren-160-sump')).body).toEqual(view);
  });

  it('404 for an unknown slug, 400 for a bad version', async () => {
    const { client } = await newLearner('public-404');
    expect((await client.get('/api/procedures/no-such-thing')).status).toBe(404);
    expect((await client.get('/api/procedures/wren-160-sump?version=zero')).status).toBe(400);
  });
});

describe('versions are immutable and attempts keep theirs', () => {
  it('a new version does not change how an older attempt was scored, and an old version stays reachable', async () => {
    const base = demoProcedure('wren-160-spark-plug');
    const slug = `spark-plug-variant-${randomUUID().slice(0, 8)}`;
    const { db, close } = testDb();
    const v1 = await publishProcedure(db, { ...base, slug });
    expect(v1.ok && v1.version.version).toBe(1);
    // Publishing the same document again writes nothing.
    const same = await publishProcedure(db, { ...base, slug });
    expect(same.ok && same.created).toBe(false);

    const { client } = await newLearner('versions');
    const old = await client.post('/api/attempts', { procedure: slug, stage: 'final-check', answer: correctAnswer(base, 'final-check'), clientId: randomUUID() });
    expect(old.body).toMatchObject({ version: 1, passed: true });

    // Version 2 asks for two turns of the crankshaft.
    const v2 = await publishProcedure(db, { ...base, slug, finalCheck: { fastenerCount: 1, crankTurns: 2 } });
    expect(v2.ok && v2.version.version).toBe(2);
    const latest = await client.post('/api/attempts', { procedure: slug, stage: 'final-check', answer: correctAnswer(base, 'final-check'), clientId: randomUUID() });
    expect(latest.body).toMatchObject({ version: 2, passed: false });
    const pinned = await client.post('/api/attempts', { procedure: slug, version: 1, stage: 'final-check', answer: correctAnswer(base, 'final-check'), clientId: randomUUID() });
    expect(pinned.body).toMatchObject({ version: 1, passed: true });
    expect((await client.get(`/api/attempts/${old.body.id}`)).body).toMatchObject({ version: 1, passed: true });
    expect((await client.get(`/api/procedures/${slug}?version=1`)).body.version).toBe(1);

    // The database itself refuses to change a stored version.
    const refused = await db
      .update(procedureVersions)
      .set({ checksum: 'tampered' })
      .where(eq(procedureVersions.version, 1))
      .then(() => null, (err: Error) => err);
    // Drizzle wraps the PostgreSQL error; the trigger's message is its cause.
    expect((refused?.cause as Error | undefined)?.message).toMatch(/immutable/);
    const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(procedureVersions).where(eq(procedureVersions.checksum, 'tampered'));
    expect(n).toBe(0);
    await close();
  });

  it('publishing refuses an invalid document with the offending key', async () => {
    const base = demoProcedure('wren-160-spark-plug');
    const { db, close } = testDb();
    const result = await publishProcedure(db, {
      ...base,
      slug: `broken-${randomUUID().slice(0, 8)}`,
      steps: base.steps.map((s, i) => (i === 0 ? { ...s, after: [base.steps.at(-1)!.key] } : s)),
    });
    await close();
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues.map((i) => i.message).join(' ')).toMatch(/cycle/);
  });
});

describe('POST /api/tools/wrench-setting', () => {
  it('compensates for an extension: US Army TM 1-1500-204-23-9, Fig. 8-16 (L 10 in, E 4 in, 300 in·lbf → 214.3)', async () => {
    const res = await new Client().post('/api/tools/wrench-setting', {
      torque: 300, unit: 'in·lbf', toUnit: 'in·lbf', wrenchLength: 10, extension: 4, lengthUnit: 'in',
    });
    expect(res.status).toBe(200);
    expect(res.body.setting).toBeCloseTo(214.2857, 3);
    expect(res.body.unit).toBe('in·lbf');
    expect(res.body.steps.join(' ')).toMatch(/300 × 10 \/ \(10 \+ 4\)/);
  });

  it('converts units typed the usual ways: 17 ft·lbf → 204 in·lbf (common practice, no source)', async () => {
    const res = await new Client().post('/api/tools/wrench-setting', { torque: 17, unit: 'ft-lb', toUnit: 'in-lb' });
    expect(res.status).toBe(200);
    expect(res.body.setting).toBeCloseTo(204, 9);
  });

  it('answers impossible or malformed input with 400', async () => {
    const client = new Client();
    const back = await client.post('/api/tools/wrench-setting', { torque: 50, unit: 'N·m', toUnit: 'N·m', wrenchLength: 2, extension: 3, direction: 'back' });
    expect(back.status).toBe(400);
    const unit = await client.post('/api/tools/wrench-setting', { torque: 50, unit: 'furlongs', toUnit: 'N·m' });
    expect(unit.status).toBe(400);
    expect(unit.body.fields.unit[0]).toMatch(/not a torque unit/);
    expect((await client.post('/api/tools/wrench-setting', { torque: -3, unit: 'N·m', toUnit: 'N·m' })).status).toBe(400);
    expect((await client.post('/api/tools/wrench-setting', { torque: 30, unit: 'N·m', toUnit: 'N·m', extension: 2 })).status).toBe(400);
  });
});
