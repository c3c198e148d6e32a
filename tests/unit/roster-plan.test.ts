import { describe, expect, it } from 'vitest';
import { planRoster, type RosterContext } from '../../src/lib/roster/plan';
import { checkEntries } from '../../src/lib/roster/rows';

const context: RosterContext = {
  accounts: new Map([
    ['ava@example.org', { name: 'Ava Lindqvist', role: 'learner' }],
    ['ben@example.org', { name: 'Ben Okafor', role: 'learner' }],
    ['teacher@example.org', { name: 'Dana Whitcombe', role: 'instructor' }],
    ['other-teacher@example.org', { name: 'Marcus Oyelaran', role: 'instructor' }],
    ['office@example.org', { name: 'Priya Castellanos', role: 'admin' }],
  ]),
  members: new Map([
    ['ben@example.org', 'learner'],
    ['teacher@example.org', 'instructor'],
  ]),
  selfEmail: 'Teacher@example.org',
};

const rows = (...entries: [string, string][]) =>
  checkEntries(
    entries.map(([name, email], i) => ({ row: i + 1, name, email })),
    { requireName: true },
  );

describe('planRoster', () => {
  it('adds existing learner accounts and invites unknown addresses', () => {
    const plan = planRoster(rows(['Ava', 'ava@example.org'], ['New Person', 'new@example.org']), context);
    expect(plan.ok).toBe(true);
    expect(plan.rows.map((r) => r.action)).toEqual(['add', 'invite']);
    expect(plan.counts).toEqual({ add: 1, invite: 1, withErrors: 0 });
  });

  it('refuses the importer, people already in the class and staff accounts, each with its own words', () => {
    const plan = planRoster(
      rows(['Me', 'teacher@example.org'], ['Ben', 'ben@example.org'], ['Marcus', 'other-teacher@example.org'], ['Priya', 'office@example.org']),
      context,
    );
    expect(plan.ok).toBe(false);
    expect(plan.rows.map((r) => [r.row, r.action, r.errors])).toEqual([
      [1, null, ['This is your own address']],
      [2, null, ['Already in this class']],
      [3, null, ['Belongs to an instructor account; only learner accounts join as learners']],
      [4, null, ['Belongs to an admin account; only learner accounts join as learners']],
    ]);
    expect(plan.counts).toEqual({ add: 0, invite: 0, withErrors: 4 });
  });

  it('one bad row makes the whole plan not ok while the good rows keep their action', () => {
    const plan = planRoster(rows(['Ava', 'ava@example.org'], ['', 'x@example.org']), context);
    expect(plan.ok).toBe(false);
    expect(plan.rows.map((r) => r.action)).toEqual(['add', null]);
    expect(plan.rows[1]!.errors).toEqual(['Name is missing']);
  });

  it('invitations may leave the name out', () => {
    const checked = checkEntries([{ row: 1, name: '', email: ' New@Example.org ' }], { requireName: false });
    expect(checked).toEqual([{ row: 1, name: '', email: 'new@example.org', errors: [] }]);
    expect(planRoster(checked, context).rows[0]!.action).toBe('invite');
  });
});
