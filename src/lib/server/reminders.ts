import { and, eq, gt, isNull, lte } from 'drizzle-orm';
import { drillReminders, drills } from '../../db/schema';
import { drillProgress } from '../drills/progress';
import { drillReminderMessage } from '../mail/drill-messages';
import { learnersOf } from './class-members';
import { drillMailFacts, mailLearner } from './drill-notices';
import { drillAttempts, drillQuery, rulesOf, type Database } from './drill-store';
import type { Mailer } from './mailer';

// The reminder a day before a drill is due. Run by `npm run remind` on a schedule; each learner gets at
// most one reminder per drill however often the job runs, and several copies of the job may run at once.

export const REMIND_WITHIN_MS = 24 * 60 * 60 * 1000;

export interface ReminderRun {
  /** Reminders sent now. */
  sent: number;
  /** Sends that failed; their claim was dropped so the next run tries again. */
  failed: number;
  /** Learners reminded before, by this run's twin or an earlier run. */
  alreadyReminded: number;
}

/**
 * Reminds each learner who can still pass an open drill due in the next 24 hours and has not passed it.
 * A learner is claimed first (INSERT … ON CONFLICT DO NOTHING RETURNING), then mailed; a failed send
 * drops the claim. Learners who passed, or have no attempts left (missed), get nothing.
 */
export async function sendDrillReminders(db: Database, mailer: Mailer, now: Date, appUrl = 'http://localhost:4321'): Promise<ReminderRun> {
  const run: ReminderRun = { sent: 0, failed: 0, alreadyReminded: 0 };
  const horizon = new Date(now.getTime() + REMIND_WITHIN_MS);
  const dueSoon = await drillQuery(db).where(and(isNull(drills.closedAt), gt(drills.dueAt, now), lte(drills.dueAt, horizon)));

  for (const drill of dueSoon) {
    const learners = await learnersOf(db, drill.classId);
    const attempts = (await drillAttempts(db, [drill.id])).get(drill.id);
    for (const learner of learners) {
      const progress = drillProgress(rulesOf(drill), attempts?.get(learner.id) ?? [], now);
      if (progress.status !== 'not-started' && progress.status !== 'in-progress') continue;

      const [claimed] = await db
        .insert(drillReminders)
        .values({ drillId: drill.id, userId: learner.id, sentAt: now })
        .onConflictDoNothing()
        .returning({ drillId: drillReminders.drillId });
      if (!claimed) {
        run.alreadyReminded += 1;
        continue;
      }
      const message = drillReminderMessage({ ...drillMailFacts(drill, learner, appUrl), standing: { status: progress.status, bestPct: progress.bestPct } });
      if (await mailLearner(mailer, drill, learner, 'reminder', message)) {
        run.sent += 1;
      } else {
        // Give the claim back so the next run retries this learner.
        await db.delete(drillReminders).where(and(eq(drillReminders.drillId, drill.id), eq(drillReminders.userId, learner.id)));
        run.failed += 1;
      }
    }
  }
  return run;
}
