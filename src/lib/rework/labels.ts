import type { Procedure, Stage } from '../procedure/schema';
import { holeLabel } from '../../components/trainer/labels';
import type { MissKind } from './misses';

// Words for a rework item in lists: what was missed, and how.

export const MISS_WORDS: Record<MissKind, string> = {
  'out-of-order': 'Out of order',
  'wrong-pin': 'Wrong pin or hole',
  'broken-pattern': 'Tightening pattern',
  'wrong-wrench-setting': 'Wrench setting',
  'failed-final-check': 'Final check',
};

/** A short name for the thing missed: the step's text, the hole or pin, the pass or the check. */
export function itemLabel(procedure: Procedure, stage: Stage, itemKey: string): string {
  switch (stage) {
    case 'order':
      return procedure.steps.find((s) => s.key === itemKey)?.text ?? itemKey;
    case 'pins': {
      const anchor = procedure.anchors.find((a) => a.key === itemKey);
      if (anchor) return holeLabel(anchor);
      return procedure.parts.find((p) => p.key === itemKey)?.name ?? itemKey;
    }
    case 'pattern': {
      if (itemKey === 'passes') return 'Number of passes';
      const match = /^pass-(\d+)(-torque)?$/.exec(itemKey);
      if (!match) return itemKey;
      return match[2] ? `Torque for pass ${match[1]}` : `Bolt order in pass ${match[1]}`;
    }
    case 'wrench':
      return itemKey === 'unit' ? 'Unit on the wrench dial' : 'Number on the wrench dial';
    case 'final-check':
      return ({ fasteners: 'Fasteners counted', leftover: 'Parts left over', 'crank-turns': 'Crankshaft turns' } as Record<string, string>)[itemKey] ?? itemKey;
  }
}
