import type { Stage } from '../../lib/procedure/schema';
import type { PublicAnchor, PublicPart } from '../../lib/procedure/public-view';

// Words the learner reads for stages, holes, bolts and pins, built from keys so no label is typed twice.

export const STAGE_LABELS: Record<Stage, string> = {
  order: 'Order',
  pins: 'Pins',
  pattern: 'Pattern',
  wrench: 'Wrench',
  'final-check': 'Final check',
};

/** 'dowel-hole-a' → 'Dowel hole A', 'sump-bolt-3' → 'Sump bolt 3'. */
export function readableKey(key: string): string {
  const words = key.split('-').filter(Boolean).map((w) => (w.length === 1 ? w.toUpperCase() : w));
  const [first = key, ...rest] = words;
  return [first.charAt(0).toUpperCase() + first.slice(1), ...rest].join(' ');
}

/** 'bolt-3' or 'sump-bolt-3' → 'Bolt 3' (the trailing number is the bolt's name on the part). */
export function boltLabel(key: string): string {
  const number = /(\d+)$/.exec(key)?.[1];
  return number ? `Bolt ${number}` : readableKey(key);
}

const HOLE_KIND_WORDS: Partial<Record<PublicAnchor['kind'], string>> = {
  'locating-hole': 'locating',
  'threaded-hole': 'threaded',
};

/** 'Dowel hole A · locating · 8 mm' (a no-break space keeps the size on one line). */
export function holeLabel(anchor: Pick<PublicAnchor, 'key' | 'kind' | 'sizeMm'>): string {
  return `${readableKey(anchor.key)} · ${HOLE_KIND_WORDS[anchor.kind] ?? anchor.kind} · ${anchor.sizeMm}\u00a0mm`;
}

/** '8 × 14 mm' for a pin or sleeve; '' for parts without a pin size. */
export function pinSize(part: Pick<PublicPart, 'pin'>): string {
  return part.pin ? `${part.pin.diameterMm} × ${part.pin.lengthMm}\u00a0mm` : '';
}
