import { hashString, mulberry32, seededShuffle } from '../procedure/public-view';

// Question variants: a number that picks the prefix, the distractors and the order of the choices, so the
// server can rebuild the very question the learner saw and a later review can ask it differently.

/** The variant for an item's next review: different after each review, the same until then. */
export function variantFor(itemId: string, reviews: number): number {
  return hashString(`${itemId}:${reviews}`) % 1_000_000;
}

export function randomFor(variant: number, purpose: string): () => number {
  return mulberry32(hashString(`${variant}:${purpose}`));
}

export function shuffled<T>(items: readonly T[], variant: number): T[] {
  return seededShuffle(items, `choices:${variant}`);
}
