import { describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner } from './helpers/client';
import { demoProcedure } from '../support/demo-procedures';

// The trainer pages: signed-in only, the cautions rendered on the server, and no answer key in the HTML.

/** Astro writes island props HTML-escaped; undo the entities so a search sees the JSON as sent. */
const unescape = (html: string) =>
  html.replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');

describe('/train', () => {
  it('lists every procedure with its engine, stages, demo badge and a link', async () => {
    const { client } = await newLearner('train-list');
    const res = await client.get('/train');
    expect(res.status).toBe(200);
    const html = unescape(res.body as string);
    for (const slug of ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']) {
      expect(html).toContain(`href="/train/${slug}"`);
      expect(html).toContain(demoProcedure(slug).title);
    }
    expect(html).toContain('Wren 160');
    expect(html).toContain('Order · Pins · Pattern · Wrench · Final check');
    expect(html).toContain('Demo values');
  });

  it('is open to instructors too, and sends the signed-out to sign in', async () => {
    const { client } = await demoUser('instructor@larkspur.example');
    expect((await client.get('/train')).status).toBe(200);
    const anon = await new Client().get('/train');
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent('/train')}`);
  });
});

describe('/train/:procedure', () => {
  it('renders the title, the demo notice, the cautions and the island, without the answer key', async () => {
    const { client } = await newLearner('train-page');
    const res = await client.get('/train/wren-160-sump');
    expect(res.status).toBe(200);
    const html = unescape(res.body as string);
    const doc = demoProcedure('wren-160-sump');
    expect(html).toContain(`<title>${doc.title} · Benchwright</title>`);
    expect(html).toContain('data-testid="demo-values"');
    for (const caution of doc.cautions) expect(html).toContain(caution);
    expect(html).toContain('does not replace the service manual or a qualified instructor');
    expect(html).toMatch(/<astro-island[^>]*client="only"/);
    // The island gets the public view: the steps are there, their constraints and the pin seats are not.
    for (const step of doc.steps) expect(html).toContain(step.key);
    for (const secret of ['"after"', 'pinSeats', '"decoy"', '"passes"', '"finalCheck"', '"rule"']) expect(html).not.toContain(secret);
  });

  it('gives the island the same shuffle as the API', async () => {
    const { client } = await newLearner('train-seed');
    const api = (await client.get('/api/procedures/wren-160-sump')).body as { steps: { key: string }[] };
    const html = unescape((await client.get('/train/wren-160-sump')).body as string);
    const positions = api.steps.map((s) => html.indexOf(`"key":[0,"${s.key}"]`));
    expect(positions.every((p) => p > 0)).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
  });

  it('serves a version asked for, and 404 for an unknown procedure, version or a bad version', async () => {
    const { client } = await newLearner('train-404');
    expect((await client.get('/train/wren-160-sump?version=1')).status).toBe(200);
    for (const path of ['/train/no-such-procedure', '/train/wren-160-sump?version=999', '/train/wren-160-sump?version=zero']) {
      const res = await client.get(path);
      expect(res.status, path).toBe(404);
      expect(res.body, path).toContain('Nothing here');
    }
  });

  it('sends the signed-out to sign in and back', async () => {
    const anon = await new Client().get('/train/wren-160-sump');
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent('/train/wren-160-sump')}`);
  });
});

describe('/learn', () => {
  it('links each procedure to its trainer', async () => {
    const { client } = await newLearner('learn-practise');
    const html = (await client.get('/learn')).body as string;
    expect(html).toContain('Practise a procedure');
    for (const slug of ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']) expect(html).toContain(`href="/train/${slug}"`);
  });
});
