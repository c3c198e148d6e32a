import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';
import type { Client } from './client';

// Reading the built client assets a page loads: the bundle tests check which pages bring three.js.

export const CLIENT_DIR = 'dist/client';
/** Marks three.js leaves in any bundle: the revision global its core sets, and its renderer's messages. */
export const THREE_SIGNATURE = /__THREE__|THREE\.WebGLRenderer/;

/** Script sources, module preloads and island component/renderer URLs named in a page. */
export function assetUrls(html: string): string[] {
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
export function importsOf(code: string, withDynamic: boolean): string[] {
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
export function reachable(entries: string[], withDynamic: boolean): Map<string, string> {
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

export async function pageHtml(client: Client, path: string): Promise<string> {
  const res = await client.get(path);
  expect(res.status, path).toBe(200);
  return res.body as string;
}
