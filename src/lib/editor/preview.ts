import type { Anchor, FastenerGroup, Vec3 } from '../procedure/schema';
import { exampleSequence, type BoltPosition } from '../patterns';

// What the editor shows for a fastener group's rule: one sequence the rule accepts, from the bolts'
// positions (the same function the reference answers use), or why it cannot be shown yet.

export type TighteningPreview =
  | { ok: true; bolts: { key: string; position: Vec3 }[]; sequence: string[] }
  | { ok: false; message: string };

export function tighteningPreview(group: Pick<FastenerGroup, 'bolts' | 'axis' | 'rule'>, anchors: readonly Anchor[]): TighteningPreview | null {
  if (group.bolts.length === 0) return null;
  const positions = new Map(anchors.map((a) => [a.key, a.position] as const));
  const bolts: BoltPosition[] = [];
  for (const bolt of group.bolts) {
    const position = positions.get(bolt.anchor);
    if (!position) return { ok: false, message: `Bolt ${bolt.key} has no hole on the model yet.` };
    bolts.push({ key: bolt.key, position });
  }
  if (new Set(bolts.map((b) => b.key)).size !== bolts.length) return { ok: false, message: 'Two bolts share a key.' };
  try {
    return { ok: true, bolts: bolts.map((b) => ({ key: b.key, position: [...b.position] as Vec3 })), sequence: exampleSequence(bolts, group.axis, group.rule) };
  } catch (err) {
    return { ok: false, message: err instanceof Error ? err.message : 'The sequence cannot be worked out.' };
  }
}
