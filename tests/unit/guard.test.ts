import { describe, expect, it } from 'vitest';
import { requireRole } from '../../src/lib/server/guard';
import type { SessionUser } from '../../src/lib/roles';

const locals = (user: SessionUser | null) => ({ user, session: null }) as App.Locals;
const learner: SessionUser = { id: 'u1', name: 'L', email: 'l@x.example', role: 'learner' };
const admin: SessionUser = { ...learner, id: 'u2', role: 'admin' };

describe('requireRole', () => {
  it('answers 401 with a JSON error when nobody is signed in', async () => {
    const gate = requireRole(locals(null), 'learner');
    expect(gate.ok).toBe(false);
    if (gate.ok) return;
    expect(gate.response.status).toBe(401);
    expect(await gate.response.json()).toEqual({ error: 'Sign in first' });
  });

  it('answers 403 when the role is not among those allowed', () => {
    const gate = requireRole(locals(learner), 'instructor', 'admin');
    expect(gate.ok ? 200 : gate.response.status).toBe(403);
  });

  it('lets an allowed role through with its user', () => {
    const gate = requireRole(locals(admin), 'instructor', 'admin');
    expect(gate).toEqual({ ok: true, user: admin });
  });

  it('with no roles listed, any signed-in user passes', () => {
    expect(requireRole(locals(learner)).ok).toBe(true);
  });
});
