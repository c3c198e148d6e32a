import { drillAssignedMessage, drillLink } from '../mail/drill-messages';
import { learnersOf } from './class-members';
import type { Database, DrillRecord } from './drill-store';
import type { Mailer } from './mailer';

/**
 * Tells each learner of the class about a new drill. Called after the drill is stored; a failed send is
 * logged and never undoes the drill or fails the request that made it.
 */
export async function sendDrillNotices(db: Database, mailer: Mailer, drill: DrillRecord, appUrl: string): Promise<{ sent: number; failed: number }> {
  const learners = await learnersOf(db, drill.classId);
  let sent = 0;
  let failed = 0;
  for (const learner of learners) {
    const message = drillAssignedMessage({
      learnerName: learner.name,
      className: drill.className,
      procedureTitle: drill.title,
      stages: drill.stages,
      dueAt: drill.dueAt,
      passMarkPct: drill.passMarkPct,
      attemptLimit: drill.attemptLimit,
      answersAfterDue: drill.answersAfterDue,
      link: drillLink(appUrl, drill.slug, drill.id),
    });
    try {
      await mailer.send({ to: learner.email, ...message });
      sent += 1;
    } catch (err) {
      failed += 1;
      console.error(`drill ${drill.id}: the notice to ${learner.email} was not sent: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  return { sent, failed };
}
