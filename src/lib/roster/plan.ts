import type { Role } from '../roles';
import type { RosterRow } from './rows';

/** What the database says about the addresses in a roster, looked up by the caller. */
export interface RosterContext {
  /** Accounts that exist, by lower-case e-mail. */
  accounts: ReadonlyMap<string, { name: string; role: Role }>;
  /** People in the class already, by lower-case e-mail. */
  members: ReadonlyMap<string, 'instructor' | 'learner'>;
  /** Whoever is importing (an instructor of the class or an admin). */
  selfEmail: string;
}

/** add: an existing learner account joins the class; invite: no account yet, an invitation is sent. */
export type RosterAction = 'add' | 'invite';

export interface PlannedRow extends RosterRow {
  action: RosterAction | null;
}

export interface RosterPlan {
  ok: boolean;
  rows: PlannedRow[];
  counts: { add: number; invite: number; withErrors: number };
}

/** Adds the problems only the database can reveal and decides what happens to each row. */
export function planRoster(rows: RosterRow[], context: RosterContext): RosterPlan {
  const planned = rows.map((row): PlannedRow => {
    const errors = [...row.errors];
    const account = context.accounts.get(row.email);
    const member = context.members.get(row.email);
    if (row.email === context.selfEmail.toLowerCase()) errors.push('This is your own address');
    else if (member === 'instructor') errors.push('Teaches this class');
    else if (member === 'learner') errors.push('Already in this class');
    else if (account && account.role !== 'learner') errors.push(`Belongs to an ${account.role} account; only learner accounts join as learners`);
    const action = errors.length ? null : account ? 'add' : 'invite';
    return { ...row, errors, action };
  });
  const counts = {
    add: planned.filter((r) => r.action === 'add').length,
    invite: planned.filter((r) => r.action === 'invite').length,
    withErrors: planned.filter((r) => r.errors.length > 0).length,
  };
  return { ok: counts.withErrors === 0, rows: planned, counts };
}
