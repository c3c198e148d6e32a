import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Client, demoUser } from './helpers/client';
import { THREE_SIGNATURE, assetUrls, pageHtml, reachable } from './helpers/bundles';

// three.js is heavy: only the trainer page may load it up front, and the procedure editor only lazily, for its
// 3D bolt picker. Reads the built chunks each page asks for (dist/client), follows their imports, and looks for
// three.js's own marks in them.

describe('three.js stays out of every page but the trainer and the editor\'s lazy bolt picker', () => {
  it('the signature finds three.js in its own build', () => {
    // Guards the check below: a signature that never matches would pass every page.
    expect(readFileSync('node_modules/three/build/three.core.js', 'utf8')).toMatch(THREE_SIGNATURE);
  });

  const pages: { path: string; as: string | null }[] = [
    { path: '/', as: null },
    { path: '/sign-in', as: null },
    { path: '/learn', as: 'learner1@larkspur.example' },
    { path: '/teach', as: 'instructor@larkspur.example' },
    { path: '/teach/procedures', as: 'instructor@larkspur.example' },
  ];
  for (const page of pages) {
    it(`${page.path} loads no three.js, not even lazily`, async () => {
      const client = page.as ? (await demoUser(page.as)).client : new Client();
      const html = await pageHtml(client, page.path);
      expect(html).not.toMatch(THREE_SIGNATURE);
      for (const [url, code] of reachable(assetUrls(html), true)) expect(code, url).not.toMatch(THREE_SIGNATURE);
    });
  }

  it('the procedure editor loads no three.js up front; its 3D bolt picker brings it when it is shown', async () => {
    const { client } = await demoUser('instructor@larkspur.example');
    const draft = await client.post('/api/procedure-drafts', {});
    const html = await pageHtml(client, `/teach/procedures/drafts/${draft.body.id}`);
    expect(html).toMatch(/component-url="\/_astro\/ProcedureEditor\./);
    for (const [url, code] of reachable(assetUrls(html), false)) expect(code, url).not.toMatch(THREE_SIGNATURE);
    const lazily = [...reachable(assetUrls(html), true)];
    const picker = lazily.find(([url]) => /\/BoltScene\.[^/]+\.js$/.test(url));
    expect(picker, 'the bolt picker is a chunk of its own').toBeDefined();
    const fromPicker = reachable([picker![0]], false);
    expect([...fromPicker.values()].some((code) => THREE_SIGNATURE.test(code))).toBe(true);
  });

  it('/train/wren-160-sump mounts the trainer island, which brings three.js with it', async () => {
    const { client } = await demoUser('learner1@larkspur.example');
    const html = await pageHtml(client, '/train/wren-160-sump');
    const island = html.match(/<astro-island\b[^>]*>/)?.[0] ?? '';
    expect(island).toMatch(/\bclient="only"/);
    const componentUrl = /\bcomponent-url="([^"]+)"/.exec(island)?.[1];
    expect(componentUrl).toMatch(/^\/_astro\/Trainer\..*\.js$/);
    const loaded = reachable([componentUrl!], true);
    expect([...loaded.values()].some((code) => THREE_SIGNATURE.test(code))).toBe(true);
  });
});
