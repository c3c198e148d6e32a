import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as THREE from 'three';
import * as subset from '../../src/components/trainer/scene/three-subset';

// The build hands react-three-fiber a subset of three.js (astro.config.mjs). A lower-case JSX element
// whose class is missing from it works in `astro dev` but throws in the built app, so check them all here.

function tsxFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? tsxFiles(join(dir, e.name)) : e.name.endsWith('.tsx') ? [join(dir, e.name)] : [],
  );
}

const pascal = (tag: string) => tag.charAt(0).toUpperCase() + tag.slice(1);

describe('three.js subset given to react-three-fiber in the build', () => {
  const used = new Set<string>();
  // Only the scenes' files render into a Canvas (the trainer's and the editor's bolt picker); the panels' SVG
  // has a <line> that is not three's Line.
  for (const file of ['src/components/trainer/Scene.tsx', ...tsxFiles('src/components/trainer/scene'), ...tsxFiles('src/components/editor/scene')]) {
    for (const [, tag] of readFileSync(file, 'utf8').matchAll(/<([a-z][A-Za-z0-9]*)[\s/>]/g)) {
      // Only tags that name a three.js class are 3D elements; div, button … are DOM.
      if (tag && pascal(tag) in THREE) used.add(tag);
    }
  }

  it('finds the 3D elements the trainer draws with', () => {
    expect([...used]).toEqual(expect.arrayContaining(['mesh', 'group', 'instancedMesh']));
  });

  it('exports the class of every 3D element used in JSX, as the same object three.js exports', () => {
    for (const tag of used) {
      const name = pascal(tag) as keyof typeof THREE;
      expect(subset, `<${tag}> needs ${name} in three-subset.ts`).toHaveProperty(name);
      expect((subset as Record<string, unknown>)[name]).toBe(THREE[name]);
    }
  });
});
