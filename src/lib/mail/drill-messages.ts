import type { Stage } from '../procedure/schema';
import { STAGE_LABELS } from '../../components/trainer/labels';
import type { DrillStatus } from '../drills/progress';
import { STATUS_LABELS, formatPct } from '../drills/labels';
import { formatUtcDateTime } from '../local-time';
import type { MailText } from './account-messages';

export type { MailText };

// The plain-text e-mails about drills. Pure: the caller gives the facts, the link and the clock's words.

export interface DrillMailFacts {
  learnerName: string;
  className: string;
  procedureTitle: string;
  stages: readonly Stage[];
  dueAt: Date;
  passMarkPct: number;
  attemptLimit: number | null;
  answersAfterDue: boolean;
  /** Opens the trainer on this drill. */
  link: string;
}

function ruleLines(f: DrillMailFacts): string[] {
  return [
    `Stages: ${f.stages.map((s) => STAGE_LABELS[s]).join(', ')}`,
    // The server does not know each learner's time zone: mail says UTC, their page shows their own time.
    `Due: ${formatUtcDateTime(f.dueAt)} (your page on Benchwright shows it in your own time)`,
    `Pass mark: ${f.passMarkPct} % in every stage`,
    `Attempts: ${f.attemptLimit === null ? 'as many as you like' : `${f.attemptLimit} per stage`}`,
    ...(f.answersAfterDue ? ['Feedback shows which lines are right; the right answers show after the due date.'] : []),
  ];
}

const SIGN_OFF = [
  '',
  'Benchwright trains and scores; the engine maker\'s data, local codes and your instructor rule at the bench.',
];

/** Every drill e-mail: the greeting, what happened, the drill's rules, the link and the sign-off. */
function drillMail(f: DrillMailFacts, subject: string, opening: string): MailText {
  return {
    subject,
    text: [`Hello ${f.learnerName},`, '', opening, '', ...ruleLines(f), '', `Open it: ${f.link}`, ...SIGN_OFF].join('\n'),
  };
}

/** Sent to each learner of the class when an instructor assigns a drill. */
export function drillAssignedMessage(f: DrillMailFacts): MailText {
  return drillMail(f, `New drill for ${f.className}: ${f.procedureTitle}`, `Your instructor assigned a drill in ${f.className}: ${f.procedureTitle}.`);
}

export interface DrillStanding {
  status: DrillStatus;
  bestPct: number | null;
}

/** Sent once, about a day before the due date, to a learner who has not passed the drill yet. */
export function drillReminderMessage(f: DrillMailFacts & { standing: DrillStanding }): MailText {
  const where =
    f.standing.status === 'not-started'
      ? 'You have not started it yet.'
      : `So far: ${STATUS_LABELS[f.standing.status].toLowerCase()}, best score ${formatPct(f.standing.bestPct)}.`;
  return drillMail(f, `Due soon: ${f.procedureTitle} (${f.className})`, `The drill ${f.procedureTitle} in ${f.className} is due ${formatUtcDateTime(f.dueAt)}. ${where}`);
}

/** The trainer on a drill: `${appUrl}/train/<slug>?drill=<id>`. */
export function drillLink(appUrl: string, slug: string, drillId: string): string {
  return `${appUrl.replace(/\/+$/, '')}/train/${encodeURIComponent(slug)}?drill=${encodeURIComponent(drillId)}`;
}
