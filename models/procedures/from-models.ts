import type { ProcedureInput } from '~/lib/procedure/schema';
import type { ModelAnchor, PartModel } from '../types';

// Procedures take parts and anchors from the models, so keys, kinds and coordinates are never retyped.

type PartInput = ProcedureInput['parts'][number];
type AnchorInput = NonNullable<ProcedureInput['anchors']>[number];

export const WREN_160 = { key: 'wren-160', name: 'Wren 160' };

/** A kit part drawn with the given model; the part key is the model key. */
export function partFrom(
  model: PartModel,
  extra: { name?: string; count?: number; pin?: { diameterMm: number; lengthMm: number }; decoy?: boolean } = {},
): PartInput {
  const { name, ...rest } = extra;
  return { key: model.key, name: name ?? model.name, kind: model.kind, model: model.key, ...rest };
}

/** Procedure anchors for some of a model's anchors, on the part drawn with that model. */
export function anchorsFrom(model: PartModel, anchors: ModelAnchor[]): AnchorInput[] {
  return anchors.map((a) => {
    if (!model.anchors.includes(a)) throw new Error(`anchor ${a.key} is not on model ${model.key}`);
    return { key: a.key, part: model.key, kind: a.kind, position: [a.position[0], a.position[1], a.position[2]], sizeMm: a.sizeMm };
  });
}
