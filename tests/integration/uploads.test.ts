import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { uploads } from '../../src/db/schema';
import { benchWorld, photoForm, pngBytes } from './helpers/bench-world';
import { newLearner } from './helpers/client';
import { BASE_URL } from './helpers/server';
import { testDb } from './helpers/db';

let world: Awaited<ReturnType<typeof benchWorld>>;
const database = testDb();

beforeAll(async () => {
  world = await benchWorld();
});
afterAll(() => database.close());

async function storedCount(ownerId: string) {
  const [row] = await database.db.select({ n: count() }).from(uploads).where(eq(uploads.ownerId, ownerId));
  return row!.n;
}

describe('POST /api/uploads then GET /api/uploads/:id', () => {
  it('keeps the photo under a random key and gives back the identical bytes', async () => {
    const bytes = pngBytes([10, 200, 90], 24);
    const res = await world.owner.client.postForm('/api/uploads', photoForm(bytes, 'my sump (final).png'));
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      originalName: 'my sump (final).png',
      contentType: 'image/png',
      sizeBytes: bytes.byteLength,
      createdAt: expect.any(String),
      procedure: 'wren-160-sump',
      attached: false,
    });

    const [row] = await database.db.select().from(uploads).where(eq(uploads.id, res.body.id));
    expect(row!.storageKey).toMatch(/^bench-photos\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
    expect(row).toMatchObject({ ownerId: world.owner.user.id, purpose: 'bench-photo', contentType: 'image/png' });

    const back = await world.owner.client.get(`/api/uploads/${res.body.id}`);
    expect(back.status).toBe(200);
    expect(Buffer.from(back.bytes).equals(Buffer.from(bytes))).toBe(true);
    expect(back.headers.get('content-type')).toBe('image/png');
    expect(back.headers.get('content-disposition')).toBe('inline; filename="my sump (final).png"');
    expect(back.headers.get('x-content-type-options')).toBe('nosniff');
    expect(back.headers.get('content-security-policy')).toBe('sandbox');
    expect(back.headers.get('cache-control')).toMatch(/^private\b/);
  });

  it('stores the type found in the bytes, whatever the browser declared', async () => {
    const res = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes(), 'holiday.jpg', 'wren-160-head', 'image/jpeg'));
    expect(res.status).toBe(201);
    expect(res.body.contentType).toBe('image/png');
    expect((await world.owner.client.get(`/api/uploads/${res.body.id}`)).headers.get('content-type')).toBe('image/png');
  });

  it('refuses a text file named .jpg, names what it is, and stores nothing', async () => {
    const before = await storedCount(world.owner.user.id);
    const text = new TextEncoder().encode('These are my notes, not a photo.\n');
    const res = await world.owner.client.postForm('/api/uploads', photoForm(text, 'photo.jpg', 'wren-160-sump', 'image/jpeg'));
    expect(res.status).toBe(400);
    expect(res.body.error).toContain('plain text (text/plain)');
    expect(res.body.fields.file[0]).toContain('.jpg');
    expect(await storedCount(world.owner.user.id)).toBe(before);
  });

  it('refuses an SVG named .png', async () => {
    const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>');
    const res = await world.owner.client.postForm('/api/uploads', photoForm(svg, 'photo.png'));
    expect(res.status).toBe(400);
    expect(res.body.error).toContain('SVG');
  });

  it('refuses a photo over 10 MB: one byte over the limit, and a body far over it', async () => {
    const before = await storedCount(world.owner.user.id);
    // A real PNG start followed by padding: the size is what must be refused, not the type.
    const justOver = new Uint8Array(10 * 1024 * 1024 + 1);
    justOver.set(pngBytes());
    const res = await world.owner.client.postForm('/api/uploads', photoForm(justOver));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/at most 10 MB/);

    const farOver = new Uint8Array(12 * 1024 * 1024);
    farOver.set(pngBytes());
    const big = await world.owner.client.postForm('/api/uploads', photoForm(farOver));
    expect(big.status).toBe(413);
    expect(big.body).toEqual({ error: 'The file is too large: at most 10 MB', fields: { file: ['The file is too large: at most 10 MB'] } });
    expect(await storedCount(world.owner.user.id)).toBe(before);
  });

  it('counts a body sent without Content-Length, keeps nothing past the limit and still answers 413', async () => {
    const form = photoForm(new Uint8Array(12 * 1024 * 1024));
    const encoded = new Response(form);
    const body = encoded.body!; // a stream: fetch sends it chunked, with no Content-Length
    // The test client keeps its cookie to itself, so this raw request signs in a session of its own.
    const signIn = await fetch(`${BASE_URL}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': '10.9.9.9' },
      body: JSON.stringify({ email: world.owner.email, password: 'correct horse battery' }),
    });
    const cookie = signIn.headers.getSetCookie()[0]!.split(';')[0]!;
    const res = await fetch(`${BASE_URL}/api/uploads`, {
      method: 'POST',
      headers: { cookie, origin: BASE_URL, 'content-type': encoded.headers.get('content-type')!, 'x-forwarded-for': '10.9.9.9' },
      body,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
    expect(await res.json()).toMatchObject({ error: 'The file is too large: at most 10 MB' });
    // The rest of that body was read and dropped, not left unread, so the sender always gets this answer
    // (a socket closed on unread bytes is reset, which can lose it) and the connection stays usable.
    expect(res.headers.get('connection')).not.toBe('close');
    expect((await world.owner.client.get('/api/me')).status).toBe(200);
  });

  it('answers 400 for a missing file, an unknown procedure, another purpose or a JSON body', async () => {
    const noFile = new FormData();
    noFile.set('purpose', 'bench-photo');
    noFile.set('procedure', 'wren-160-sump');
    const missing = await world.owner.client.postForm('/api/uploads', noFile);
    expect(missing.status).toBe(400);
    expect(missing.body.fields.file).toEqual(['Choose a file to upload']);

    const unknown = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes(), 'a.png', 'wren-999-nothing'));
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields.procedure).toEqual(['No such procedure']);

    const other = photoForm(pngBytes());
    other.set('purpose', 'avatar');
    const purpose = await world.owner.client.postForm('/api/uploads', other);
    expect(purpose.status).toBe(400);
    expect(purpose.body.fields.purpose).toEqual(['purpose must be "bench-photo" or "procedure-reference"']);

    const json = await world.owner.client.post('/api/uploads', { file: 'x' });
    expect(json.status).toBe(400);
    expect(json.body.error).toBe('Send the file as multipart/form-data');
  });
});

describe('a cap per learner and procedure', () => {
  it('keeps at most 24 photos of one procedure; the 25th is refused until one is deleted', async () => {
    const { client } = await newLearner('cap');
    const ids: string[] = [];
    for (let i = 0; i < 24; i++) {
      const res = await client.postForm('/api/uploads', photoForm(pngBytes([i, i, i]), `p${i}.png`, 'wren-160-spark-plug'));
      expect(res.status).toBe(201);
      ids.push(res.body.id);
    }
    const over = await client.postForm('/api/uploads', photoForm(pngBytes(), 'p24.png', 'wren-160-spark-plug'));
    expect(over.status).toBe(409);
    expect(over.body.error).toMatch(/already keep 24 photos of this procedure/);
    // Another procedure has its own count.
    expect((await client.postForm('/api/uploads', photoForm(pngBytes(), 'head.png', 'wren-160-head'))).status).toBe(201);
    expect((await client.delete(`/api/uploads/${ids[0]}`)).status).toBe(204);
    expect((await client.postForm('/api/uploads', photoForm(pngBytes(), 'p24.png', 'wren-160-spark-plug'))).status).toBe(201);
  });
});

describe('GET /api/me/uploads', () => {
  it("lists the learner's own bench photos, newest first, narrowed by procedure", async () => {
    const learner = world.otherLearner.client;
    const first = await learner.postForm('/api/uploads', photoForm(pngBytes([1, 2, 3]), 'one.png', 'wren-160-flywheel'));
    const second = await learner.postForm('/api/uploads', photoForm(pngBytes([4, 5, 6]), 'two.png', 'wren-160-flywheel'));
    await learner.postForm('/api/uploads', photoForm(pngBytes([7, 8, 9]), 'three.png', 'wren-160-spark-plug'));

    const flywheel = await learner.get('/api/me/uploads?procedure=wren-160-flywheel');
    expect(flywheel.status).toBe(200);
    expect(flywheel.body.map((u: { id: string }) => u.id)).toEqual([second.body.id, first.body.id]);
    const all = await learner.get('/api/me/uploads');
    expect(all.body.map((u: { originalName: string }) => u.originalName)).toEqual(['three.png', 'two.png', 'one.png']);
    // Another learner's list never holds these.
    const mine = await world.owner.client.get('/api/me/uploads');
    expect(mine.body.some((u: { id: string }) => u.id === first.body.id)).toBe(false);

    const unknown = await learner.get('/api/me/uploads?procedure=wren-999-nothing');
    expect(unknown.status).toBe(400);
  });
});

describe('DELETE /api/uploads/:id', () => {
  it('removes an unattached photo of the owner; it is gone for everyone after', async () => {
    const made = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes([99, 99, 99])));
    const res = await world.owner.client.delete(`/api/uploads/${made.body.id}`);
    expect(res.status).toBe(204);
    expect((await world.owner.client.get(`/api/uploads/${made.body.id}`)).status).toBe(404);
    expect((await world.admin.get(`/api/uploads/${made.body.id}`)).status).toBe(404);
    expect(await database.db.select().from(uploads).where(and(eq(uploads.id, made.body.id)))).toEqual([]);
    expect((await world.owner.client.delete(`/api/uploads/${made.body.id}`)).status).toBe(404);
  });
});
