import { STAGE_LABELS } from '../../components/trainer/labels';
import type { Stage } from '../procedure/schema';

// Whether a learner may submit a stage on a drill. Pure: the server locks, counts and then asks here.

export interface DrillForAttempt {
  slug: string;
  version: number;
  stages: readonly Stage[];
  attemptLimit: number | null;
  closedAt: Date | null;
}

export interface AttemptAsked {
  procedure: string;
  version?: number;
  stage: Stage;
}

export type DrillRefusal =
  | { status: 400; path: 'procedure' | 'version' | 'stage'; error: string }
  | { status: 409; error: string };

/**
 * Null when the attempt may be scored. `usedOnStage` is how many attempts the learner already made on this
 * stage of the drill (the limit counts per stage). Late attempts are fine while the drill is open.
 */
export function drillRefusal(drill: DrillForAttempt, asked: AttemptAsked, usedOnStage: number, now: Date): DrillRefusal | null {
  if (drill.closedAt !== null && drill.closedAt.getTime() <= now.getTime()) {
    return { status: 409, error: 'This drill is closed: it takes no more attempts. Your earlier attempts are kept.' };
  }
  if (asked.procedure !== drill.slug) {
    return { status: 400, path: 'procedure', error: `This drill is on procedure "${drill.slug}", not "${asked.procedure}"` };
  }
  if (asked.version !== undefined && asked.version !== drill.version) {
    return { status: 400, path: 'version', error: `This drill is pinned to version ${drill.version} of ${drill.slug}, not version ${asked.version}` };
  }
  if (!drill.stages.includes(asked.stage)) {
    const asks = drill.stages.map((s) => STAGE_LABELS[s]).join(', ');
    return { status: 400, path: 'stage', error: `The ${STAGE_LABELS[asked.stage]} stage is not part of this drill (it asks for: ${asks})` };
  }
  if (drill.attemptLimit !== null && usedOnStage >= drill.attemptLimit) {
    return {
      status: 409,
      error: `You have used all ${drill.attemptLimit} attempt${drill.attemptLimit === 1 ? '' : 's'} on the ${STAGE_LABELS[asked.stage]} stage of this drill`,
    };
  }
  return null;
}
