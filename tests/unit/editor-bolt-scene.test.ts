import { describe, expect, it } from 'vitest';
import { getModel } from '@models/index';
import { boltScene, type BoltSceneView } from '~/lib/editor/bolt-scene';
import { partFromModel } from '~/lib/editor/library';
import { tighteningPreview } from '~/lib/editor/preview';
import { toEditorValues } from '~/lib/editor/values';
import type { FastenerGroup, Part } from '~/lib/procedure/schema';
import { buildLayout } from '~/components/trainer/scene/layout';
import { partFactors, scenePoint } from '~/components/trainer/scene/points';
import { coverProcedure } from '../support/cover-procedure';

// The editor's 3D bolt picker draws what boltScene builds from the form values, which may be a half-filled
// draft: it must never throw, and its numbers must be the 2D preview's.

const SUMP_HOLES = Array.from({ length: 8 }, (_, i) => `sump-bolt-${i + 1}`);
const DECK_HOLES = Array.from({ length: 5 }, (_, i) => `head-bolt-${i + 1}`);

function view(result: ReturnType<typeof boltScene>): BoltSceneView {
  if (!result.ok) throw new Error(result.message);
  return result;
}

const part = (model: string, extra: Partial<Part> = {}): Part => ({ ...partFromModel(getModel(model)!, []), ...extra });
const emptyGroup = (extra: Partial<FastenerGroup> = {}): FastenerGroup => ({
  key: 'bolts', name: '', part: '', axis: [0, 1, 0], bolts: [], torque: { value: Number.NaN, unit: 'N·m', tolerancePct: 10 }, passes: [0.5, 1], rule: 'cross', ...extra,
});

describe('the 3D bolt picker built from the four-bolt cover job', () => {
  const values = toEditorValues(coverProcedure());
  const group = values.fastenerGroups[0]!;
  const preview = tighteningPreview(group, values.anchors);
  const scene = view(boltScene(values.parts, group, preview));

  it('draws the part with threaded holes and the bolts, not the cover, gasket or pins that would hide the holes', () => {
    expect(scene.procedure.parts.map((p) => p.key)).toEqual(['crankcase', 'flange-bolt']);
    expect(scene.otherParts).toEqual([]);
    // models/crankcase.ts: eight sump bolt holes and five head bolt holes, all threaded.
    expect(scene.holes).toEqual([...SUMP_HOLES, ...DECK_HOLES]);
    expect(scene.procedure.anchors.every((a) => a.kind === 'threaded-hole' && a.part === 'crankcase')).toBe(true);
  });

  it('puts each bolt in its hole, at the hole the library gives', () => {
    const bolts = scene.procedure.fastenerGroups[0]!.bolts;
    expect(bolts.map((b) => [b.key, b.anchor])).toEqual([
      ['bolt-1', 'sump-bolt-1'], ['bolt-3', 'sump-bolt-3'], ['bolt-5', 'sump-bolt-5'], ['bolt-7', 'sump-bolt-7'],
    ]);
    for (const bolt of bolts) expect(bolt.position).toEqual(values.anchors.find((a) => a.key === bolt.anchor)!.position);
    expect(scene.notDrawn).toBe(0);
  });

  it('numbers the bolts in the same accepted sequence the 2D map shows', () => {
    // Cross pattern for four bolts round a circle: 1-3-2-4, from memory of ASME PCC-1; here holes 1, 5, 3, 7.
    expect(scene.order).toEqual({ 'bolt-1': 1, 'bolt-5': 2, 'bolt-3': 3, 'bolt-7': 4 });
    if (!preview?.ok) throw new Error('expected a preview');
    expect(Object.keys(scene.order).sort((a, b) => scene.order[a]! - scene.order[b]!)).toEqual(preview.sequence);
  });

  it('frames the face the bolts go into', () => {
    expect(scene.focus).toEqual(SUMP_HOLES);
    expect(scene.focusAxis).toEqual([0, 1, 0]);
  });

  it('is drawn by the trainer scene with the bolts home in their holes and every hole a point to pick', () => {
    const layout = buildLayout(scene.procedure);
    expect(layout.assembled.map((d) => d.part.key)).toEqual(['crankcase']);
    expect(layout.bolts?.places.map((b) => b.key)).toEqual(['bolt-1', 'bolt-3', 'bolt-5', 'bolt-7']);
    expect(layout.holes).toHaveLength(13);
    const sceneView = { stage: 'pattern' as const, explode: 0, sequence: [], placements: [] };
    expect(partFactors(scene.procedure, layout, sceneView).get('flange-bolt')).toBe(0);
    for (const key of [...scene.holes, 'bolt-1']) expect(scenePoint(scene.procedure, layout, sceneView, key)).not.toBeNull();
  });
});

describe('the 3D bolt picker on a half-filled draft', () => {
  it('says why there is nothing to draw before a part with threaded holes is in the kit', () => {
    expect(boltScene([], emptyGroup(), null)).toEqual({ ok: false, message: 'Nothing to show yet: add the part the bolts go into.' });
    expect(boltScene([part('sump-cover'), part('flange-bolt')], emptyGroup({ part: 'flange-bolt' }), null).ok).toBe(false);
  });

  it('draws every hole and no bolts for a new group, framed on the face with most holes', () => {
    const scene = view(boltScene([part('cylinder-head'), part('crankcase')], emptyGroup(), null));
    expect(scene.procedure.parts.map((p) => p.key)).toEqual(['crankcase']);
    expect(scene.procedure.fastenerGroups[0]!.bolts).toEqual([]);
    expect(scene.procedure.steps).toEqual([]);
    expect(scene.focus).toEqual(SUMP_HOLES);
    expect(() => buildLayout(scene.procedure)).not.toThrow();
  });

  it('draws the part the first bolt is on, alone: a head would stand in front of the deck holes', () => {
    const kit = [part('crankcase'), part('cylinder-head'), part('head-gasket'), part('head-bolt')];
    const group = emptyGroup({ part: 'head-bolt', axis: [-1, 0, 0], bolts: [{ key: 'bolt-2', anchor: 'head-bolt-2' }, { key: 'plug', anchor: 'plug-hole' }] });
    const scene = view(boltScene(kit, group, null));
    expect(scene.procedure.parts.map((p) => p.key)).toEqual(['crankcase', 'head-bolt']);
    expect(scene.holes).toEqual([...SUMP_HOLES, ...DECK_HOLES]);
    // models/crankcase.ts: head bolts go into the deck travelling −X.
    expect(scene.focus).toEqual(DECK_HOLES);
    expect(scene.focusAxis).toEqual([-1, 0, 0]);
    // The plug hole is on the head, not drawn here.
    expect(scene.procedure.fastenerGroups[0]!.bolts.map((b) => b.key)).toEqual(['bolt-2']);
    expect(scene.notDrawn).toBe(1);
    expect(scene.otherParts).toEqual(['Cylinder head']);
  });

  it('marks holes but draws no bolt model until the fastener part is one drawn per hole', () => {
    const kit = [part('crankcase'), part('cylinder-head'), part('spark-plug')];
    const scene = view(boltScene(kit, emptyGroup({ part: 'spark-plug', axis: [-1, 0, 0], bolts: [{ key: 'plug', anchor: 'plug-hole' }] }), null));
    expect(scene.procedure.parts.map((p) => p.key)).toEqual(['cylinder-head']);
    expect(scene.procedure.fastenerGroups[0]!.bolts.map((b) => b.anchor)).toEqual(['plug-hole']);
    expect(scene.focus).toEqual(['plug-hole']);
    expect(scene.otherParts).toEqual(['Crankcase']);
    expect(buildLayout(scene.procedure).bolts).toBeNull();
  });

  it('leaves out bolts it cannot place and counts them, whatever state they are in', () => {
    const group = emptyGroup({
      part: 'flange-bolt',
      axis: [Number.NaN, 0, 0],
      bolts: [
        { key: 'bolt-2', anchor: 'sump-bolt-2' },
        { key: '', anchor: 'sump-bolt-4' },
        { key: 'bolt-x', anchor: '' },
        { key: 'bolt-y', anchor: 'no-such-hole' },
        { key: 'bolt-2', anchor: 'sump-bolt-6' },
        { key: 'bolt-8', anchor: 'sump-bolt-2' },
        // A locating hole is not a threaded one.
        { key: 'dowel', anchor: 'dowel-hole-a' },
      ],
    });
    const scene = view(boltScene([part('crankcase'), part('flange-bolt', { count: Number.NaN })], group, null));
    expect(scene.procedure.fastenerGroups[0]!.bolts.map((b) => b.key)).toEqual(['bolt-2']);
    expect(scene.notDrawn).toBe(6);
    // No usable axis typed: the first bolt's hole gives it.
    expect(scene.procedure.fastenerGroups[0]!.axis).toEqual([0, 1, 0]);
    expect(scene.procedure.parts.find((p) => p.key === 'flange-bolt')?.count).toBe(1);
    expect(scene.order).toEqual({});
    expect(() => buildLayout(scene.procedure)).not.toThrow();
  });

  it('draws the first of two parts that share a key, once', () => {
    const kit = [part('crankcase'), { ...part('cylinder-head'), key: 'crankcase' }];
    const scene = view(boltScene(kit, emptyGroup(), null));
    expect(scene.procedure.parts.map((p) => p.key)).toEqual(['crankcase']);
    expect(scene.holes).toEqual([...SUMP_HOLES, ...DECK_HOLES]);
  });

  it('sends a nut to the list: it goes on a shaft end, which the picker does not show', () => {
    const kit = [part('crankshaft'), part('flywheel-nut')];
    expect(boltScene(kit, emptyGroup({ part: 'flywheel-nut' }), null)).toEqual({ ok: false, message: 'A nut goes on a shaft end: pick it from the list.' });
  });
});
