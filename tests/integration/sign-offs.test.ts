import { beforeAll, describe, expect, it } from 'vitest';
import { benchWorld, photoForm, pngBytes } from './helpers/bench-world';

let world: Awaited<ReturnType<typeof benchWorld>>;
let photoId = '';

beforeAll(async () => {
  world = await benchWorld();
  const res = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes([30, 60, 90], 8), 'finished-sump.png'));
  expect(res.status).toBe(201);
  photoId = res.body.id;
});

const today = () => new Date().toISOString().slice(0, 10);
const signOffPath = () => `/api/classes/${world.classA.id}/sign-offs`;

describe('recording a sign-off', () => {
  it('an instructor of the class records a pass with the learner’s photo', async () => {
    const res = await world.instructorA.client.post(signOffPath(), {
      learnerId: world.owner.user.id,
      procedure: 'wren-160-sump',
      benchDate: today(),
      outcome: 'pass',
      notes: '  Cross pattern, two passes; 8 of 8 bolts.  ',
      photoIds: [photoId],
    });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      classId: world.classA.id,
      className: 'Bench class A',
      learnerId: world.owner.user.id,
      learnerName: 'Test owner',
      procedure: 'wren-160-sump',
      procedureTitle: 'Wren 160: install the sump',
      instructorName: 'Test teacher-a',
      benchDate: today(),
      outcome: 'pass',
      notes: 'Cross pattern, two passes; 8 of 8 bolts.',
      photos: [{ id: photoId, originalName: 'finished-sump.png', contentType: 'image/png' }],
      createdAt: expect.any(String),
    });

    // The learner sees it, with the instructor's name, and the photo is now attached.
    const mine = await world.owner.client.get('/api/me/sign-offs');
    expect(mine.status).toBe(200);
    expect(mine.body).toEqual([res.body]);
    const photos = await world.owner.client.get('/api/me/uploads?procedure=wren-160-sump');
    expect(photos.body.find((p: { id: string }) => p.id === photoId).attached).toBe(true);
  });

  it('an attached photo cannot be deleted (409) and stays readable', async () => {
    const res = await world.owner.client.delete(`/api/uploads/${photoId}`);
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('This photo is part of a sign-off and stays with it');
    expect((await world.owner.client.get(`/api/uploads/${photoId}`)).status).toBe(200);
    expect((await world.instructorA.client.get(`/api/uploads/${photoId}`)).status).toBe(200);
  });

  it('refuses a photo of another learner, of another procedure, or unknown', async () => {
    const theirs = await world.otherLearner.client.postForm('/api/uploads', photoForm(pngBytes([1, 1, 1])));
    const headPhoto = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes([2, 2, 2]), 'head.png', 'wren-160-head'));
    const base = { learnerId: world.owner.user.id, procedure: 'wren-160-sump', benchDate: today(), outcome: 'redo' };
    for (const id of [theirs.body.id, headPhoto.body.id, '0f6b2f7e-3c41-4d8e-9b0a-5e2d7c1a9f33']) {
      const res = await world.instructorA.client.post(signOffPath(), { ...base, photoIds: [id] });
      expect(res.status).toBe(400);
      expect(res.body.fields.photoIds).toEqual([`Photo ${id} is not one of this learner's bench photos of this procedure`]);
    }
    // Nothing was recorded by the refused requests.
    const list = await world.instructorA.client.get(`${signOffPath()}?learner=${world.owner.user.id}`);
    expect(list.body).toHaveLength(1);
  });

  it('refuses a learner from another class, an unknown procedure and bad fields, each by name', async () => {
    const base = { learnerId: world.owner.user.id, procedure: 'wren-160-sump', benchDate: today(), outcome: 'pass' };
    const stranger = await world.instructorA.client.post(signOffPath(), { ...base, learnerId: world.otherLearner.user.id });
    expect(stranger.status).toBe(400);
    expect(stranger.body.fields).toEqual({ learnerId: ['This person is not a learner in this class'] });

    const teacher = await world.instructorA.client.post(signOffPath(), { ...base, learnerId: world.instructorA.user.id });
    expect(teacher.status).toBe(400);

    const unknown = await world.instructorA.client.post(signOffPath(), { ...base, procedure: 'wren-999-nothing' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields).toEqual({ procedure: ['No procedure "wren-999-nothing"'] });

    const future = new Date(Date.now() + 3 * 86400_000).toISOString().slice(0, 10);
    const bad = await world.instructorA.client.post(signOffPath(), { ...base, benchDate: future, outcome: 'fine', notes: 'x'.repeat(2001) });
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toEqual({
      benchDate: ['The bench date cannot be in the future'],
      outcome: ['Choose pass or redo'],
      notes: ['Notes are at most 2000 characters'],
    });

    const broken = await world.instructorA.client.request('POST', signOffPath(), '{"learnerId":', { 'content-type': 'application/json' });
    expect(broken.status).toBe(400);
  });
});

describe('listing sign-offs', () => {
  it('lists the class newest bench date first, narrows by learner and procedure, and keeps the latest per pair', async () => {
    const client = world.instructorA.client;
    const base = { learnerId: world.owner.user.id, procedure: 'wren-160-head', notes: '' };
    const older = await client.post(signOffPath(), { ...base, benchDate: '2026-01-05', outcome: 'redo' });
    const newer = await client.post(signOffPath(), { ...base, benchDate: '2026-01-12', outcome: 'pass' });
    expect([older.status, newer.status]).toEqual([201, 201]);

    const head = await client.get(`${signOffPath()}?procedure=wren-160-head`);
    expect(head.body.map((s: { id: string }) => s.id)).toEqual([newer.body.id, older.body.id]);

    const latest = await client.get(`${signOffPath()}?latest=true`);
    expect(latest.body.map((s: { procedure: string; outcome: string }) => `${s.procedure}:${s.outcome}`).sort()).toEqual([
      'wren-160-head:pass',
      'wren-160-sump:pass',
    ]);

    const nobody = await client.get(`${signOffPath()}?learner=${world.otherLearner.user.id}`);
    expect(nobody.body).toEqual([]);
  });

  it('the instructor picks from the learner’s photos of a procedure', async () => {
    const res = await world.instructorA.client.get(
      `/api/classes/${world.classA.id}/bench-photos?learner=${world.owner.user.id}&procedure=wren-160-sump`,
    );
    expect(res.status).toBe(200);
    expect(res.body.map((p: { id: string }) => p.id)).toContain(photoId);
    const notMember = await world.instructorA.client.get(
      `/api/classes/${world.classA.id}/bench-photos?learner=${world.otherLearner.user.id}&procedure=wren-160-sump`,
    );
    expect(notMember.status).toBe(400);
    const noProcedure = await world.instructorA.client.get(`/api/classes/${world.classA.id}/bench-photos?learner=${world.owner.user.id}`);
    expect(noProcedure.status).toBe(400);
    expect(noProcedure.body.fields.procedure).toEqual(['Choose the procedure']);
  });
});
