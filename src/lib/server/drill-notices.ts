import { drillAssignedMessage, drillLink, type DrillMailFacts, type MailText } from '../mail/drill-messages';
import { learnersOf, type Learner } from './class-members';
import type { Database, DrillRecord } from './drill-store';
import type { Mailer } from './mailer';

// Mail to the learners of a drill: the notice when it is assigned (here) and the reminder before it is due
// (reminders.ts) say the same facts and fail the same way.

/** What every drill e-mail tells this learner about the drill. */
export function drillMailFacts(drill: DrillRecord, learner: Learner, appUrl: string): DrillMailFacts {
  return {
    learnerName: learner.name,
    className: drill.className,
    procedureTitle: drill.title,
    stages: drill.stages,
    dueAt: drill.dueAt,
    passMarkPct: drill.passMarkPct,
    attemptLimit: drill.attemptLimit,
    answersAfterDue: drill.answersAfterDue,
    link: drillLink(appUrl, drill.slug, drill.id),
  };
}

/** Sends one drill e-mail; a failure is logged, never thrown, and answered false. */
export async function mailLearner(mailer: Mailer, drill: DrillRecord, learner: Learner, kind: 'notice' | 'reminder', message: MailText): Promise<boolean> {
  try {
    await mailer.send({ to: learner.email, ...message });
    return true;
  } catch (err) {
    console.error(`drill ${drill.id}: the ${kind} to ${learner.email} was not sent: ${err instanceof Error ? err.message : String(err)}`);
    return false;
  }
}

/**
 * Tells each learner of the class about a new drill. Called after the drill is stored; a failed send is
 * logged and never undoes the drill or fails the request that made it.
 */
export async function sendDrillNotices(db: Database, mailer: Mailer, drill: DrillRecord, appUrl: string): Promise<{ sent: number; failed: number }> {
  const learners = await learnersOf(db, drill.classId);
  let sent = 0;
  let failed = 0;
  for (const learner of learners) {
    const message = drillAssignedMessage(drillMailFacts(drill, learner, appUrl));
    if (await mailLearner(mailer, drill, learner, 'notice', message)) sent += 1;
    else failed += 1;
  }
  return { sent, failed };
}
