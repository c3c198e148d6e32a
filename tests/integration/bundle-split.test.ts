import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { Client, demoUser } from './helpers/client';

// three.js is heavy: only the trainer page may load it. Reads the built chunks each page asks for (dist/client),
// follows their imports, and looks for three.js's own marks in them.

const CLIENT_DIR = 'dist/client';
/** Marks three.js leaves in any bundle: the revision global its core sets, and its renderer's messages. */
const THREE_SIGNATURE = /__THREE__|THREE\.WebGLRenderer/;

/** Script sources, module preloads and island component/renderer URLs named in a page. */
function assetUrls(html: string): string[] {
  const urls = new Set<string>();
  for (const tag of html.match(/<(?:script|link|astro-island)\b[^>]*>/g) ?? []) {
    const isPreload = /^<link\b/.test(tag) && /\brel="modulepreload"/.test(tag);
    for (const [, attr, value] of tag.matchAll(/\b(src|href|component-url|renderer-url)="([^"]+)"/g)) {
      if (attr === 'href' && !isPreload) continue;
      if (value!.startsWith('/')) urls.add(value!);
    }
  }
  return [...urls];
}

/** Imports named in a built chunk: static (`import"x"`, `from"x"`) and, when asked, dynamic (`import("x")`). */
function importsOf(code: string, withDynamic: boolean): string[] {
  const found = [...code.matchAll(/(?:\bfrom\s*|\bimport\s*)["']([^"']+\.js)["']/g)].map((m) => m[1]!);
  if (withDynamic) {
    found.push(...[...code.matchAll(/\bimport\(\s*["']([^"']+\.js)["']\s*\)/g)].map((m) => m[1]!));
    // Vite lists a lazy chunk's dependencies in one array of paths from the site root.
    for (const list of code.matchAll(/__vite__mapDeps[^[]*\[((?:"[^"]*",?)+)\]/g)) {
      found.push(...[...list[1]!.matchAll(/"([^"]+\.js)"/g)].map((m) => `/${m[1]!.replace(/^\//, '')}`));
    }
  }
  return found;
}

/** Every built file reachable from the entry URLs, with its code. */
function reachable(entries: string[], withDynamic: boolean): Map<string, string> {
  const files = new Map<string, string>();
  const queue = [...entries];
  while (queue.length) {
    const url = queue.pop()!;
    if (files.has(url)) continue;
    const path = join(CLIENT_DIR, url);
    expect(existsSync(path), `${url} is not in ${CLIENT_DIR}`).toBe(true);
    const code = readFileSync(path, 'utf8');
    files.set(url, code);
    for (const spec of importsOf(code, withDynamic)) queue.push(new URL(spec, `http://site${url}`).pathname);
  }
  return files;
}

async function pageHtml(client: Client, path: string): Promise<string> {
  const res = await client.get(path);
  expect(res.status, path).toBe(200);
  return res.body as string;
}

describe('three.js stays out of every page but the trainer', () => {
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

  it('the procedure editor loads no three.js, not even lazily (its bolt map is 2D)', async () => {
    const { client } = await demoUser('instructor@larkspur.example');
    const draft = await client.post('/api/procedure-drafts', {});
    const html = await pageHtml(client, `/teach/procedures/drafts/${draft.body.id}`);
    expect(html).toMatch(/component-url="\/_astro\/ProcedureEditor\./);
    for (const [url, code] of reachable(assetUrls(html), true)) expect(code, url).not.toMatch(THREE_SIGNATURE);
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
