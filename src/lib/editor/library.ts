import { MODELS, findAnchor, getModel } from '@models/index';
import type { ModelAnchor, PartModel } from '@models/types';
import type { Anchor, Part, Vec3 } from '../procedure/schema';
import { uniqueSlug } from './slug';

// The part model library as the editor offers it: a part taken from a model carries the model's kind,
// name and pin size; an anchor taken from a model carries its kind, position and size, on the part drawn
// with that model. Nothing is typed twice, as with the demo procedures.

export type EditorAnchorKind = ModelAnchor['kind'];

/** Every model in the library, by name. */
export function libraryModels(): PartModel[] {
  return Object.values(MODELS).sort((a, b) => a.name.localeCompare(b.name));
}

/** A new kit part drawn with a model; its key is the model key, numbered when the model is already used. */
export function partFromModel(model: PartModel, takenKeys: readonly string[]): Part {
  const key = uniqueSlug(model.key, (k) => takenKeys.includes(k));
  return {
    key,
    name: model.name,
    kind: model.kind,
    model: model.key,
    count: 1,
    ...(model.pin ? { pin: { ...model.pin } } : {}),
    decoy: false,
  };
}

export interface LibraryAnchor {
  anchor: ModelAnchor;
  /** Key of the procedure part drawn with the anchor's model. */
  part: string;
  model: PartModel;
}

/** Anchors of the models the parts are drawn with, optionally of some kinds only, in model order. */
export function anchorsOfParts(parts: readonly Pick<Part, 'key' | 'model'>[], kinds?: readonly EditorAnchorKind[]): LibraryAnchor[] {
  const out: LibraryAnchor[] = [];
  const seenModels = new Set<string>();
  for (const part of parts) {
    const model = getModel(part.model);
    // Two parts drawn with one model share its anchors; the first part holds them.
    if (!model || seenModels.has(model.key)) continue;
    seenModels.add(model.key);
    for (const anchor of model.anchors) if (!kinds || kinds.includes(anchor.kind)) out.push({ anchor, part: part.key, model });
  }
  return out;
}

/** The procedure anchor for a library anchor key, on the part drawn with its model; null if no part is. */
export function anchorFromLibrary(anchorKey: string, parts: readonly Pick<Part, 'key' | 'model'>[]): Anchor | null {
  const found = findAnchor(anchorKey);
  if (!found) return null;
  const part = parts.find((p) => p.model === found.model.key);
  if (!part) return null;
  const { anchor } = found;
  return { key: anchor.key, part: part.key, kind: anchor.kind, position: [...anchor.position] as Vec3, sizeMm: anchor.sizeMm };
}

/** The anchors list with the given keys present (taken from the library when missing), others kept. */
export function withAnchors(anchors: readonly Anchor[], keys: readonly string[], parts: readonly Pick<Part, 'key' | 'model'>[]): Anchor[] {
  const out = [...anchors];
  for (const key of keys) {
    if (out.some((a) => a.key === key)) continue;
    const anchor = anchorFromLibrary(key, parts);
    if (anchor) out.push(anchor);
  }
  return out;
}

/** Direction a fastener travels into the anchor, from its model; +Y when the anchor is not in the library. */
export function anchorAxis(anchorKey: string): Vec3 {
  const axis = findAnchor(anchorKey)?.anchor.axis;
  return axis ? [axis[0], axis[1], axis[2]] : [0, 1, 0];
}

/**
 * A bolt key for a hole: 'bolt-3' from 'sump-bolt-3', so feedback names the bolt by the hole's number;
 * the hole's own key when that name is already taken in the procedure.
 */
export function boltKeyFor(anchorKey: string, takenKeys: readonly string[]): string {
  const number = /-(\d+)$/.exec(anchorKey)?.[1];
  const wanted = number ? `bolt-${number}` : anchorKey;
  if (!takenKeys.includes(wanted)) return wanted;
  return uniqueSlug(anchorKey, (k) => takenKeys.includes(k));
}
