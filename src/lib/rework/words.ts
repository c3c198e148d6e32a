import type { WrenchTask } from '../procedure/schema';
import { formatNumber } from '../torque';

// Small phrases the questions share with the trainer's wording.

/** The extension or adapter on the drive, as the trainer's Wrench stage words it. */
export function extensionText(task: Pick<WrenchTask, 'extension' | 'lengthUnit' | 'direction'>): string {
  if (task.extension <= 0) return 'No extension: the socket goes straight on the drive.';
  const size = `${formatNumber(task.extension)} ${task.lengthUnit}`;
  return task.direction === 'back' ? `A ${size} adapter pointing back toward the handle.` : `A ${size} extension pointing forward.`;
}
