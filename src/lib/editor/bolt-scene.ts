import { getModel } from '@models/index';
import type { PublicAnchor, PublicFastenerGroup, PublicPart, PublicProcedure } from '../procedure/public-view';
import type { FastenerGroup, Part, Vec3 } from '../procedure/schema';
import { anchorsOfParts, type LibraryAnchor } from './library';
import type { TighteningPreview } from './preview';

// What the editor's 3D bolt picker draws for one fastener group, from form values that may be a half-filled
// draft: the kit part the group's holes are on with every threaded hole of it, the group's bolts in those holes,
// and each bolt's place in the preview's accepted sequence. It has the shape of the trainer's public view, so
// the trainer's scene pieces draw it as they are.

export interface BoltSceneView {
  ok: true;
  procedure: PublicProcedure;
  /** Keys of the threaded holes drawn, in the library's order (as the list offers them). */
  holes: string[];
  /** The holes the camera frames: those on the face of the group's first bolt, else the face with most holes. */
  focus: string[];
  /** Unit direction a bolt travels into the focused holes. */
  focusAxis: Vec3;
  /** Bolt key → its place (from 1) in the preview's accepted sequence; empty when the preview has none. */
  order: Record<string, number>;
  /** Bolts of the group not drawn: no hole, a hole not on the part drawn, or a key or hole used twice. */
  notDrawn: number;
  /** Names of the other kit parts with threaded holes (picked from the list, or here once a bolt is in one). */
  otherParts: string[];
}

export type BoltScene = BoltSceneView | { ok: false; message: string };

const isUnit = (v: readonly number[]) => v.length === 3 && v.every(Number.isFinite) && Math.hypot(v[0]!, v[1]!, v[2]!) > 1e-9;
const sameAxis = (a: readonly number[], b: readonly number[]) => a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]! > 0.999;

/** The picker's view of a fastener group; `preview` is the same result the 2D bolt map numbers. */
export function boltScene(
  parts: readonly Part[],
  group: Pick<FastenerGroup, 'key' | 'name' | 'part' | 'axis' | 'bolts'>,
  preview: TighteningPreview | null,
): BoltScene {
  const fastener = parts.find((p) => p.key === group.part);
  if (fastener?.kind === 'nut') return { ok: false, message: 'A nut goes on a shaft end: pick it from the list.' };

  // A key used twice in a draft would draw two parts as one: the first part with a key is the one drawn.
  const kit = parts.filter((p, i) => parts.findIndex((q) => q.key === p.key) === i);
  const library = anchorsOfParts(kit, ['threaded-hole']);
  if (library.length === 0) return { ok: false, message: 'Nothing to show yet: add the part the bolts go into.' };

  // One part is drawn, the one the group works on: another part with holes (a head on the deck) would stand
  // in front of them. Its face is the first bolt's, or the face most holes are on (the crankcase's sump face).
  const onFace = (face: LibraryAnchor) => library.filter((h) => h.part === face.part && sameAxis(h.anchor.axis, face.anchor.axis));
  const first = group.bolts.map((b) => library.find((h) => h.anchor.key === b.anchor)).find((h) => h !== undefined);
  const face = first ?? library.reduce((best, h) => (onFace(h).length > onFace(best).length ? h : best));
  const drawnHoles = library.filter((h) => h.part === face.part);
  const host = kit.find((p) => p.key === face.part)!;
  const otherParts = [...new Set(library.filter((h) => h.part !== host.key).map((h) => h.part))].map((key) => kit.find((p) => p.key === key)!.name);

  const publicPart = (p: Part): PublicPart => ({ key: p.key, name: p.name, kind: p.kind, model: p.model, count: Number.isFinite(p.count) ? p.count : 1 });
  const drawnParts = [publicPart(host)];
  // Bolts are drawn with a model the trainer draws once per hole; a spark plug, or no part yet, shows as marked holes.
  const boltModel = fastener ? getModel(fastener.model) : undefined;
  const drawFastener = fastener !== undefined && boltModel?.placement === 'local' && fastener.key !== host.key;
  if (drawFastener) drawnParts.push(publicPart(fastener));

  const anchors: PublicAnchor[] = drawnHoles.map(({ anchor, part }) => ({
    key: anchor.key, part, kind: anchor.kind, position: [...anchor.position] as Vec3, sizeMm: anchor.sizeMm,
  }));
  const byKey = new Map(drawnHoles.map((h) => [h.anchor.key, h.anchor] as const));
  const bolts: PublicFastenerGroup['bolts'] = [];
  let notDrawn = 0;
  for (const bolt of group.bolts) {
    const hole = byKey.get(bolt.anchor);
    if (!hole || !bolt.key || bolts.some((b) => b.key === bolt.key || b.anchor === bolt.anchor)) {
      notDrawn += 1;
      continue;
    }
    bolts.push({ key: bolt.key, anchor: bolt.anchor, position: [...hole.position] as Vec3 });
  }

  const order: Record<string, number> = {};
  if (preview?.ok) preview.sequence.forEach((key, i) => (order[key] = i + 1));
  const focusAxis = [...face.anchor.axis] as Vec3;

  const procedure: PublicProcedure = {
    slug: 'editor-bolt-picker',
    title: group.name,
    version: 1,
    engine: { key: '', name: '' },
    summary: '',
    cautions: [],
    demoValues: false,
    stages: ['pattern'],
    parts: drawnParts,
    anchors,
    steps: [],
    fastenerGroups: [
      {
        key: group.key || 'group',
        name: group.name,
        part: drawFastener ? fastener.key : '',
        axis: isUnit(group.axis) ? [...group.axis] : focusAxis,
        bolts,
        passCount: 1,
      },
    ],
  };
  return {
    ok: true, procedure, holes: drawnHoles.map((h) => h.anchor.key), focus: onFace(face).map((h) => h.anchor.key), focusAxis, order, notDrawn, otherParts,
  };
}
