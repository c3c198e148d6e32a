import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyMarks, closure, constraintsFromMarks, groupsFromMarks, marksFromSteps, moveItem } from '~/lib/editor/ordering';
import { layoutPrecedence } from '~/lib/editor/graph-layout';
import { isLinearExtension, topoOrder } from '~/lib/procedure/graph';
import { demoProcedure } from '../support/demo-procedures';

// The editor states precedence as a list plus "any order with the previous step" marks (this project's
// own rule, see ordering.ts); these tests pin how that turns into `after` constraints and back.

const steps = (keys: string[]) => keys.map((key) => ({ key, after: [] as string[] }));

describe('list and marks → after constraints', () => {
  it('groups runs of marked steps and makes each group wait for the whole group before it', () => {
    const keys = ['a', 'b', 'c', 'd', 'e'];
    const marks = [true, false, true, true, false]; // a mark on the first step means nothing
    expect(groupsFromMarks(keys, marks)).toEqual([['a'], ['b', 'c', 'd'], ['e']]);
    expect(Object.fromEntries(constraintsFromMarks(keys, marks))).toEqual({
      a: [],
      b: ['a'],
      c: ['a'],
      d: ['a'],
      e: ['b', 'c', 'd'],
    });
  });

  it('with no marks the list is one fixed chain; with every mark there is no constraint', () => {
    expect(applyMarks(steps(['x', 'y', 'z']), [false, false, false]).map((s) => s.after)).toEqual([[], ['x'], ['y']]);
    expect(applyMarks(steps(['x', 'y', 'z']), [false, true, true]).map((s) => s.after)).toEqual([[], [], []]);
  });

  it('the list order is always one order the constraints allow, and a marked pair may swap', () => {
    fc.assert(
      fc.property(fc.array(fc.boolean(), { minLength: 1, maxLength: 12 }), (marks) => {
        const keys = marks.map((_, i) => `s${i}`);
        const out = applyMarks(steps(keys), marks);
        expect(isLinearExtension(keys, out)).toBe(true);
        marks.forEach((marked, i) => {
          if (i === 0) return;
          const swapped = moveItem(keys, i, i - 1);
          expect(isLinearExtension(swapped, out)).toBe(marked);
        });
      }),
    );
  });
});

describe('after constraints → list and marks', () => {
  it('reads back exactly what the marks wrote', () => {
    fc.assert(
      fc.property(fc.array(fc.boolean(), { minLength: 1, maxLength: 12 }), (raw) => {
        const marks = raw.map((m, i) => (i === 0 ? false : m));
        const out = applyMarks(steps(marks.map((_, i) => `s${i}`)), marks);
        expect(marksFromSteps(out)).toEqual({ anyOrder: marks, exact: true });
      }),
    );
  });

  it('says when stored constraints are finer than marks can say (the demo sump: the gasket waits for the pins, not the seal check)', () => {
    const sump = demoProcedure('wren-160-sump');
    const read = marksFromSteps(sump.steps);
    expect(read.exact).toBe(false);
    // The seal check and both pins may come in any order; the gasket waits for a pin.
    expect(read.anyOrder.slice(0, 4)).toEqual([false, true, true, false]);
  });

  it('reports a cycle as not expressible, with no marks', () => {
    const cyclic = [
      { key: 'a', after: ['b'] },
      { key: 'b', after: ['a'] },
    ];
    expect(closure(cyclic)).toBeNull();
    expect(marksFromSteps(cyclic)).toEqual({ anyOrder: [false, false], exact: false });
  });
});

describe('precedence graph layout', () => {
  it('puts each step one column after the longest chain it waits for, with only the direct edges', () => {
    const sump = demoProcedure('wren-160-sump');
    const layout = layoutPrecedence(sump.steps)!;
    const layer = Object.fromEntries(layout.nodes.map((n) => [n.key, n.layer]));
    expect(layer).toMatchObject({
      'check-oil-seal': 0,
      'dowel-pin-a': 0,
      'fit-gasket': 1,
      'seat-sump-cover': 2,
      'check-once-around': 6,
    });
    expect(layout.layers).toBe(7);
    expect(layout.edges).toContainEqual(['dowel-pin-a', 'fit-gasket']);
    expect(layout.edges).toContainEqual(['fit-gasket', 'seat-sump-cover']);
    // Every edge goes left to right, and no two nodes share a place.
    for (const [from, to] of layout.edges) expect(layer[from]!).toBeLessThan(layer[to]!);
    const places = layout.nodes.map((n) => `${n.layer}:${n.row}`);
    expect(new Set(places).size).toBe(places.length);
  });

  it('drops an edge another path already implies', () => {
    const layout = layoutPrecedence([
      { key: 'a', after: [] },
      { key: 'b', after: ['a'] },
      { key: 'c', after: ['a', 'b'] },
    ])!;
    expect(layout.edges).toEqual([
      ['a', 'b'],
      ['b', 'c'],
    ]);
  });

  it('gives no layout for a cycle', () => {
    expect(layoutPrecedence([{ key: 'a', after: ['a'] }])).toBeNull();
  });

  it('agrees with the topological order of every demo procedure', () => {
    for (const slug of ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']) {
      const p = demoProcedure(slug);
      const layout = layoutPrecedence(p.steps)!;
      const layer = new Map(layout.nodes.map((n) => [n.key, n.layer]));
      const order = topoOrder(p.steps)!;
      const sorted = [...order].sort((a, b) => layer.get(a)! - layer.get(b)!);
      expect(isLinearExtension(sorted, p.steps)).toBe(true);
    }
  });
});

describe('moveItem', () => {
  it('moves one item and leaves the list alone for an index out of range', () => {
    expect(moveItem(['a', 'b', 'c', 'd'], 0, 2)).toEqual(['b', 'c', 'a', 'd']);
    expect(moveItem(['a', 'b', 'c', 'd'], 3, 1)).toEqual(['a', 'd', 'b', 'c']);
    expect(moveItem(['a', 'b'], 0, 5)).toEqual(['a', 'b']);
  });
});
