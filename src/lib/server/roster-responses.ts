import type { RosterPlan } from '../roster/plan';

/** The 400 for an all-or-nothing batch with bad rows: every row comes back, each with its problems. */
export function rowsRefused(plan: RosterPlan, noun: 'row' | 'address', consequence: string): Response {
  const n = plan.counts.withErrors;
  const what = n === 1 ? `1 ${noun} has` : `${n} ${noun === 'row' ? 'rows' : 'addresses'} have`;
  return Response.json({ error: `${what} problems; ${consequence}.`, rows: plan.rows, counts: plan.counts }, { status: 400 });
}
