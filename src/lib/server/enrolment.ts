import { and, desc, eq, inArray } from 'drizzle-orm';
import { db } from './db';
import { classes, classInvitations, classMembers, users } from '../../db/schema';
import { deliverEach } from './mail-delivery';
import type { StaffClass } from './class-access';
import { addedToClassMail, classInvitationMail, pageLink, signUpLink } from '../mail/account-messages';
import { planRoster, type PlannedRow, type RosterContext, type RosterPlan } from '../roster/plan';
import type { RosterRow } from '../roster/rows';
import type { SessionUser } from '../roles';
import type { OutgoingMail } from './mailer';

// Putting people in a class by e-mail: the invitation form and the roster import share these rules.

type Executor = Pick<typeof db, 'select'>;

async function rosterContext(executor: Executor, classId: string, rows: RosterRow[], self: SessionUser): Promise<RosterContext> {
  const emails = [...new Set(rows.map((r) => r.email).filter(Boolean))];
  if (emails.length === 0) return { accounts: new Map(), members: new Map(), selfEmail: self.email };
  const accounts = await executor.select({ email: users.email, name: users.name, role: users.role }).from(users).where(inArray(users.email, emails));
  const members = await executor
    .select({ email: users.email, role: classMembers.role })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), inArray(users.email, emails)));
  return {
    accounts: new Map(accounts.map((a) => [a.email, { name: a.name, role: a.role }])),
    members: new Map(members.map((m) => [m.email, m.role])),
    selfEmail: self.email,
  };
}

/** What an import would do, row by row, without changing anything. */
export async function previewEnrolment(classId: string, self: SessionUser, rows: RosterRow[]): Promise<RosterPlan> {
  return planRoster(rows, await rosterContext(db, classId, rows, self));
}

export interface EnrolledRow {
  row: number;
  name: string;
  email: string;
  /** Whether the mail relay took the notice or invitation (sent after the records were saved). */
  mail: 'sent' | 'failed';
}

export type EnrolResult = { ok: false; plan: RosterPlan } | { ok: true; added: EnrolledRow[]; invited: EnrolledRow[] };

/**
 * All or nothing: when any row has a problem nothing is written and the plan comes back with every
 * row's problems. Otherwise, in one transaction, existing learner accounts join the class and the other
 * addresses get an invitation recorded; the e-mails go out after the commit.
 */
export async function enrol(cls: StaffClass, self: SessionUser, rows: RosterRow[], origin: string): Promise<EnrolResult> {
  const outcome = await db.transaction(async (tx) => {
    // One import per class at a time, so two overlapping imports cannot both pass the checks.
    await tx.select({ id: classes.id }).from(classes).where(eq(classes.id, cls.id)).for('update');
    const plan = planRoster(rows, await rosterContext(tx, cls.id, rows, self));
    if (!plan.ok) return { ok: false as const, plan };

    const toAdd = plan.rows.filter((r) => r.action === 'add');
    const toInvite = plan.rows.filter((r) => r.action === 'invite');
    const addedAccounts = toAdd.length
      ? await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(inArray(users.email, toAdd.map((r) => r.email)))
      : [];
    if (addedAccounts.length) {
      await tx
        .insert(classMembers)
        .values(addedAccounts.map((a) => ({ classId: cls.id, userId: a.id, role: 'learner' as const })))
        .onConflictDoNothing();
    }
    if (toInvite.length) {
      await tx.insert(classInvitations).values(toInvite.map((r) => ({ classId: cls.id, email: r.email, name: r.name || null, invitedBy: self.id })));
    }
    const nameOf = new Map(addedAccounts.map((a) => [a.email, a.name]));
    return { ok: true as const, added: toAdd.map((r) => ({ ...r, name: nameOf.get(r.email) ?? r.name })), invited: toInvite };
  });
  if (!outcome.ok) return outcome;

  const mails: OutgoingMail[] = [
    ...outcome.added.map((r) => ({ to: r.email, ...addedMail(cls, self, r, origin) })),
    ...outcome.invited.map((r) => ({ to: r.email, ...invitationMail(cls, self, r, origin) })),
  ];
  const sent = await deliverEach(mails);
  const withMail = (r: PlannedRow, i: number): EnrolledRow => ({ row: r.row, name: r.name, email: r.email, mail: sent[i] ? 'sent' : 'failed' });
  return {
    ok: true,
    added: outcome.added.map((r, i) => withMail(r, i)),
    invited: outcome.invited.map((r, i) => withMail(r, outcome.added.length + i)),
  };
}

function addedMail(cls: StaffClass, self: SessionUser, row: PlannedRow, origin: string) {
  return addedToClassMail({
    className: cls.name,
    instructorName: self.name,
    learnerName: row.name,
    signInUrl: pageLink(origin, '/sign-in'),
    forgotPasswordUrl: pageLink(origin, '/forgot-password'),
  });
}

function invitationMail(cls: StaffClass, self: SessionUser, row: PlannedRow, origin: string) {
  return classInvitationMail({
    className: cls.name,
    instructorName: self.name,
    inviteeName: row.name || null,
    joinCode: cls.joinCode,
    signUpUrl: signUpLink(origin, cls.joinCode, row.email),
    signInUrl: pageLink(origin, '/sign-in'),
  });
}

export interface InvitationView {
  id: string;
  email: string;
  name: string | null;
  invitedBy: string;
  sentAt: Date;
  /** True once someone with this address is in the class. */
  joined: boolean;
}

/** Invitations of a class, newest first, with whether the invited address has joined since. */
export async function listInvitations(classId: string): Promise<InvitationView[]> {
  const rows = await db
    .select({
      id: classInvitations.id,
      email: classInvitations.email,
      name: classInvitations.name,
      invitedBy: users.name,
      sentAt: classInvitations.sentAt,
    })
    .from(classInvitations)
    .innerJoin(users, eq(users.id, classInvitations.invitedBy))
    .where(eq(classInvitations.classId, classId))
    .orderBy(desc(classInvitations.sentAt));
  const emails = [...new Set(rows.map((r) => r.email))];
  const joined = emails.length
    ? await db
        .select({ email: users.email })
        .from(classMembers)
        .innerJoin(users, eq(users.id, classMembers.userId))
        .where(and(eq(classMembers.classId, classId), inArray(users.email, emails)))
    : [];
  const joinedSet = new Set(joined.map((j) => j.email));
  return rows.map((r) => ({ ...r, joined: joinedSet.has(r.email) }));
}
