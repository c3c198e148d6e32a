import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { encodePdf } from '../../scripts/demo-pdf';
import { procedures, uploads } from '../../src/db/schema';
import { formatBytes } from '../../src/lib/uploads/check';
import { benchWorld, newInstructor, photoForm, pngBytes } from './helpers/bench-world';
import { Client, demoUser, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { publishOwnProcedure } from './helpers/own-procedure';

// Reference files: attached to a procedure through POST /api/uploads by those who may edit it (its creator,
// admins), listed and served to anyone signed in, deleted by any of its editors.

const database = testDb();
afterAll(() => database.close());

type Signed = { client: Client; user: { id: string } };
let editor: Signed;
let otherInstructor: Signed;
let admin: Signed;
let learner: Signed;
let slug = '';

beforeAll(async () => {
  editor = await newInstructor('ref-editor');
  otherInstructor = await newInstructor('ref-other');
  admin = await demoUser('admin@larkspur.example');
  learner = await newLearner('ref-learner');
  slug = (await publishOwnProcedure(editor.client, 'reference files')).slug;
});

/** A small PDF (header "%PDF-1.4", ISO 32000-1 §7.5.2), different text per call so two uploads differ. */
const pdfBytes = (text = 'Cover bolts: 4, cross pattern, demo values') => encodePdf([{ text }], 'Spec sheet');

function referenceForm(bytes: Uint8Array, name = 'spec.pdf', procedure = slug, type = 'application/pdf') {
  const form = new FormData();
  form.set('purpose', 'procedure-reference');
  form.set('procedure', procedure);
  form.set('file', new Blob([bytes as Uint8Array<ArrayBuffer>], { type }), name);
  return form;
}

async function storedFor(procedureSlug: string) {
  const [row] = await database.db
    .select({ n: count() })
    .from(uploads)
    .innerJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(and(eq(procedures.slug, procedureSlug), eq(uploads.purpose, 'procedure-reference')));
  return row!.n;
}

const uuidKey = /^procedure-files\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

describe('attaching a reference file', () => {
  it("the procedure's creator attaches a PDF: 201, kept under a random key, served to anyone signed in with the same bytes", async () => {
    const bytes = pdfBytes();
    const res = await editor.client.postForm('/api/uploads', referenceForm(bytes, 'cover spec.pdf'));
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      procedure: slug,
      originalName: 'cover spec.pdf',
      caption: null,
      contentType: 'application/pdf',
      sizeBytes: bytes.byteLength,
      createdAt: expect.any(String),
    });
    const [row] = await database.db.select().from(uploads).where(eq(uploads.id, res.body.id));
    expect(row).toMatchObject({ ownerId: editor.user.id, purpose: 'procedure-reference', contentType: 'application/pdf' });
    expect(row!.storageKey).toMatch(uuidKey);

    // A learner in no class at all opens it, as does the uploader.
    for (const who of [learner, editor, otherInstructor]) {
      const back = await who.client.get(`/api/uploads/${res.body.id}`);
      expect(back.status).toBe(200);
      expect(Buffer.from(back.bytes).equals(Buffer.from(bytes))).toBe(true);
      expect(back.headers.get('content-type')).toBe('application/pdf');
      expect(back.headers.get('content-disposition')).toBe('inline; filename="cover spec.pdf"');
      expect(back.headers.get('x-content-type-options')).toBe('nosniff');
      expect(back.headers.get('content-security-policy')).toBe('sandbox');
    }
    expect((await new Client().get(`/api/uploads/${res.body.id}`)).status).toBe(401);
  });

  it('an admin may attach to any procedure; a photo keeps the type found in its bytes', async () => {
    const res = await admin.client.postForm('/api/uploads', referenceForm(pngBytes([40, 80, 120]), 'cover-fitted.png', slug, 'image/png'));
    expect(res.status).toBe(201);
    expect(res.body.contentType).toBe('image/png');
  });

  it('another instructor and a learner get 403, the signed-out 401, and nothing is stored', async () => {
    const before = await storedFor(slug);
    const other = await otherInstructor.client.postForm('/api/uploads', referenceForm(pdfBytes()));
    expect(other.status).toBe(403);
    expect(other.body.error).toMatch(/instructor who created this procedure, or an admin/);
    expect((await learner.client.postForm('/api/uploads', referenceForm(pdfBytes()))).status).toBe(403);
    expect((await new Client().postForm('/api/uploads', referenceForm(pdfBytes()))).status).toBe(401);
    // The demo procedures have no creator: an instructor may not attach files to them, only an admin.
    expect((await editor.client.postForm('/api/uploads', referenceForm(pdfBytes(), 'spec.pdf', 'wren-160-head'))).status).toBe(403);
    expect(await storedFor(slug)).toBe(before);
  });

  it('400 for an unknown procedure, a missing file, or an unknown purpose', async () => {
    const unknown = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes(), 'spec.pdf', 'no-such-procedure-here'));
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields.procedure).toEqual(['No such procedure']);

    const noFile = new FormData();
    noFile.set('purpose', 'procedure-reference');
    noFile.set('procedure', slug);
    const missing = await editor.client.postForm('/api/uploads', noFile);
    expect(missing.status).toBe(400);
    expect(missing.body.fields.file).toEqual(['Choose a file to upload']);

    const other = referenceForm(pdfBytes());
    other.set('purpose', 'avatar');
    const purpose = await editor.client.postForm('/api/uploads', other);
    expect(purpose.status).toBe(400);
    expect(purpose.body.fields.purpose).toEqual(['purpose must be "bench-photo" or "procedure-reference"']);
  });

  it('refuses a text file named spec.pdf, naming what it is, and stores nothing', async () => {
    const before = await storedFor(slug);
    const text = new TextEncoder().encode('Cover bolts 4, torque 11 N·m. Not really a PDF.\n');
    const res = await editor.client.postForm('/api/uploads', referenceForm(text, 'spec.pdf'));
    expect(res.status).toBe(400);
    expect(res.body.error).toBe("The file's content is plain text (text/plain) although its name ends in .pdf. Upload JPEG, PNG, WebP, HEIC or PDF.");
    expect(res.body.fields.file).toEqual([res.body.error]);
    expect(await storedFor(slug)).toBe(before);
  });

  it('refuses a file over 10 MB with 413', async () => {
    const big = new Uint8Array(10 * 1024 * 1024 + 1);
    big.set(pdfBytes());
    const res = await editor.client.postForm('/api/uploads', referenceForm(big));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/at most 10 MB/);
  });
});

describe('GET /api/procedures/:slug/files', () => {
  it('lists the files in the order attached, to any signed-in user', async () => {
    const { slug: own } = await publishOwnProcedure(editor.client, 'a list');
    const first = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes('first'), 'first.pdf', own));
    const second = await admin.client.postForm('/api/uploads', referenceForm(pngBytes([1, 2, 3]), 'second.png', own, 'image/png'));
    const list = await learner.client.get(`/api/procedures/${own}/files`);
    expect(list.status).toBe(200);
    expect(list.body).toEqual([first.body, second.body]);
    expect((await otherInstructor.client.get(`/api/procedures/${own}/files`)).body).toHaveLength(2);
  });

  it('an empty list for a procedure without files, 404 for an unknown one, 401 signed out', async () => {
    const { slug: bare } = await publishOwnProcedure(editor.client, 'nothing');
    expect((await learner.client.get(`/api/procedures/${bare}/files`)).body).toEqual([]);
    const unknown = await learner.client.get('/api/procedures/no-such-procedure-here/files');
    expect(unknown.status).toBe(404);
    expect(unknown.body).toEqual({ error: 'No such procedure' });
    expect((await new Client().get(`/api/procedures/${bare}/files`)).status).toBe(401);
  });
});

describe('DELETE /api/uploads/:id for a reference file', () => {
  it('any editor of the procedure deletes it, whoever uploaded it; others get 403', async () => {
    const made = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes('to delete'), 'old.pdf'));
    expect((await learner.client.delete(`/api/uploads/${made.body.id}`)).status).toBe(403);
    const other = await otherInstructor.client.delete(`/api/uploads/${made.body.id}`);
    expect(other.status).toBe(403);
    expect(other.body.error).toMatch(/can remove its files/);
    expect((await new Client().delete(`/api/uploads/${made.body.id}`)).status).toBe(401);

    // The admin was not the uploader, and may still remove it.
    expect((await admin.client.delete(`/api/uploads/${made.body.id}`)).status).toBe(204);
    expect((await learner.client.get(`/api/uploads/${made.body.id}`)).status).toBe(404);
    expect((await learner.client.get(`/api/procedures/${slug}/files`)).body.some((f: { id: string }) => f.id === made.body.id)).toBe(false);
    expect(await database.db.select().from(uploads).where(eq(uploads.id, made.body.id))).toEqual([]);

    // The creator removes one the admin attached.
    const byAdmin = await admin.client.postForm('/api/uploads', referenceForm(pdfBytes('by the admin'), 'admin.pdf'));
    expect((await editor.client.delete(`/api/uploads/${byAdmin.body.id}`)).status).toBe(204);
  });
});

describe('captions', () => {
  it('a file may be attached with a caption; a bench photo may not carry one', async () => {
    const form = referenceForm(pdfBytes('captioned'), 'torque-card.pdf');
    form.set('caption', '  Cover torque card  ');
    const res = await editor.client.postForm('/api/uploads', form);
    expect(res.status).toBe(201);
    expect(res.body.caption).toBe('Cover torque card');

    const photo = photoForm(pngBytes(), 'cover.png', 'wren-160-sump');
    photo.set('caption', 'My cover');
    const refused = await learner.client.postForm('/api/uploads', photo);
    expect(refused.status).toBe(400);
    expect(refused.body.fields.caption).toEqual(['Only a reference file takes a caption']);
  });

  it("the procedure's editors set and clear a caption; everyone else is refused and nothing changes", async () => {
    const made = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes('to caption'), 'plain-name.pdf'));
    const path = `/api/uploads/${made.body.id}`;
    const set = await editor.client.patch(path, { caption: 'Flange bolt torque, two passes' });
    expect(set.status).toBe(200);
    expect(set.body).toMatchObject({ id: made.body.id, originalName: 'plain-name.pdf', caption: 'Flange bolt torque, two passes' });

    expect((await otherInstructor.client.patch(path, { caption: 'Mine now' })).status).toBe(403);
    expect((await learner.client.patch(path, { caption: 'Mine now' })).status).toBe(403);
    expect((await new Client().patch(path, { caption: 'Mine now' })).status).toBe(401);
    const listed = (await learner.client.get(`/api/procedures/${slug}/files`)).body.find((f: { id: string }) => f.id === made.body.id);
    expect(listed.caption).toBe('Flange bolt torque, two passes');

    // An admin may caption it too; blank clears it, as does null.
    expect((await admin.client.patch(path, { caption: '   ' })).body.caption).toBeNull();
    expect((await editor.client.patch(path, { caption: 'Back again' })).body.caption).toBe('Back again');
    expect((await editor.client.patch(path, { caption: null })).body.caption).toBeNull();
  });

  it('400 for a caption too long, not text, or an unknown field, without touching the stored one; 404 for no such file', async () => {
    const made = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes('kept caption'), 'kept.pdf'));
    const path = `/api/uploads/${made.body.id}`;
    await editor.client.patch(path, { caption: 'Kept' });
    const long = await editor.client.patch(path, { caption: 'x'.repeat(121) });
    expect(long.status).toBe(400);
    expect(long.body.fields.caption).toEqual(['A caption is at most 120 characters']);
    const number = await editor.client.patch(path, { caption: 7 });
    expect(number.status).toBe(400);
    expect(number.body.fields.caption).toEqual(['A caption is text']);
    expect((await editor.client.patch(path, { caption: 'x', name: 'y' })).status).toBe(400);
    expect((await editor.client.patch(path, {})).status).toBe(400);
    const [row] = await database.db.select({ caption: uploads.caption }).from(uploads).where(eq(uploads.id, made.body.id));
    expect(row!.caption).toBe('Kept');
    expect((await editor.client.patch('/api/uploads/00000000-0000-4000-8000-000000000000', { caption: 'x' })).status).toBe(404);
  });

  it("a bench photo takes no caption, and stays hidden from whoever may not see it", async () => {
    const world = await benchWorld();
    const photo = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes()));
    expect(photo.status).toBe(201);
    const own = await world.owner.client.patch(`/api/uploads/${photo.body.id}`, { caption: 'My cover' });
    expect(own.status).toBe(400);
    expect(own.body.error).toBe('Only a reference file takes a caption');
    expect((await learner.client.patch(`/api/uploads/${photo.body.id}`, { caption: 'x' })).status).toBe(404);
  });
});

describe('a cap per procedure', () => {
  it('keeps at most 20 files; the 21st is 409 until one is deleted', async () => {
    const { slug: capped } = await publishOwnProcedure(editor.client, 'a cap');
    const ids: string[] = [];
    for (let i = 0; i < 20; i++) {
      const res = await editor.client.postForm('/api/uploads', referenceForm(pngBytes([i, 2 * i, 3 * i]), `p${i}.png`, capped, 'image/png'));
      expect(res.status).toBe(201);
      ids.push(res.body.id);
    }
    // The admin counts against the same cap: it is per procedure, whoever attaches.
    const over = await admin.client.postForm('/api/uploads', referenceForm(pdfBytes(), 'one-more.pdf', capped));
    expect(over.status).toBe(409);
    expect(over.body.error).toBe('This procedure already has 20 reference files; delete one first');
    expect(await storedFor(capped)).toBe(20);
    expect((await editor.client.delete(`/api/uploads/${ids[0]}`)).status).toBe(204);
    expect((await admin.client.postForm('/api/uploads', referenceForm(pdfBytes(), 'one-more.pdf', capped))).status).toBe(201);
  });

  it('uploads sent at the same moment never pass the cap together', async () => {
    const { slug: racing } = await publishOwnProcedure(editor.client, 'a race');
    for (let i = 0; i < 18; i++) {
      expect((await editor.client.postForm('/api/uploads', referenceForm(pngBytes([i, i, 9]), `r${i}.png`, racing, 'image/png'))).status).toBe(201);
    }
    // Two places left, five at once: each passes the early count, but the rows are written one at a time.
    const results = await Promise.all(
      [0, 1, 2, 3, 4].map((i) => editor.client.postForm('/api/uploads', referenceForm(pdfBytes(`race ${i}`), `race${i}.pdf`, racing))),
    );
    expect(results.map((r) => r.status).sort()).toEqual([201, 201, 409, 409, 409]);
    expect(await storedFor(racing)).toBe(20);
  });
});

describe('bench photos keep their own rules', () => {
  it('a learner who may read reference files still cannot see another learner’s bench photo; staff cannot upload one', async () => {
    const world = await benchWorld();
    const photo = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes([3, 30, 60])));
    expect(photo.status).toBe(201);
    expect((await learner.client.get(`/api/uploads/${photo.body.id}`)).status).toBe(404);
    expect((await world.instructorB.client.get(`/api/uploads/${photo.body.id}`)).status).toBe(404);
    expect((await world.instructorA.client.get(`/api/uploads/${photo.body.id}`)).status).toBe(200);
    expect((await world.instructorA.client.delete(`/api/uploads/${photo.body.id}`)).status).toBe(403);
    // An editor of the photo's procedure (the admin edits the demo ones) gains nothing over bench photos by it.
    expect((await admin.client.delete(`/api/uploads/${photo.body.id}`)).status).toBe(403);

    const staff = await editor.client.postForm('/api/uploads', photoForm(pngBytes()));
    expect(staff.status).toBe(403);
    expect(staff.body.error).toBe('Only learners upload bench photos');
    // A learner's bench photo never shows among a procedure's reference files.
    const files = await learner.client.get('/api/procedures/wren-160-sump/files');
    expect(files.body.some((f: { id: string }) => f.id === photo.body.id)).toBe(false);
  });
});

describe('pages', () => {
  it('the trainer page lists the files beside the cautions, only when there are any', async () => {
    const { slug: shown, title } = await publishOwnProcedure(editor.client, 'a page');
    const without = (await learner.client.get(`/train/${shown}`)).body as string;
    expect(without).toContain('data-testid="cautions"');
    expect(without).not.toContain('data-testid="reference-files"');

    const made = await editor.client.postForm('/api/uploads', referenceForm(pdfBytes(), 'cover-spec.pdf', shown));
    const html = (await learner.client.get(`/train/${shown}`)).body as string;
    expect(html).toContain(title);
    expect(html).toContain('data-testid="reference-files"');
    expect(html).toContain(`href="/api/uploads/${made.body.id}" target="_blank" rel="noopener"`);
    expect(html).toContain('cover-spec.pdf');
    expect(html).toContain(`PDF</span> · ${formatBytes(made.body.sizeBytes)} ·`);

    // With a caption, the link reads the caption and the file name moves to the line below.
    await editor.client.patch(`/api/uploads/${made.body.id}`, { caption: 'Cover bolt card' });
    const captioned = (await learner.client.get(`/train/${shown}`)).body as string;
    expect(captioned).toMatch(/target="_blank" rel="noopener"[^>]*>\s*Cover bolt card\s*<span class="sr-only">/);
    expect(captioned).toContain('cover-spec.pdf');
  });

  it('the files page is for the procedure’s editors only', async () => {
    const { slug: own } = await publishOwnProcedure(editor.client, 'the files page');
    const page = await editor.client.get(`/teach/procedures/files/${own}`);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Reference files');
    expect((await admin.client.get(`/teach/procedures/files/${own}`)).status).toBe(200);
    expect((await otherInstructor.client.get(`/teach/procedures/files/${own}`)).status).toBe(403);
    expect((await learner.client.get(`/teach/procedures/files/${own}`)).status).toBe(403);
    expect((await editor.client.get('/teach/procedures/files/no-such-procedure-here')).status).toBe(404);
    // Listed with a count on the instructor's procedures page.
    expect((await editor.client.get('/teach/procedures')).body).toContain(`href="/teach/procedures/files/${own}"`);
  });

  it('a draft of a new procedure says to publish first; a draft of a published one shows the panel', async () => {
    const fresh = await editor.client.post('/api/procedure-drafts', {});
    const draftPage = (await editor.client.get(`/teach/procedures/drafts/${fresh.body.id}`)).body as string;
    expect(draftPage).toContain('Publish first, then attach files');

    const next = await editor.client.post('/api/procedure-drafts', { basedOn: slug });
    expect(next.status).toBe(201);
    const nextPage = (await editor.client.get(`/teach/procedures/drafts/${next.body.id}`)).body as string;
    expect(nextPage).toContain('data-testid="reference-files-panel"');
    expect(nextPage).not.toContain('Publish first');
  });
});
