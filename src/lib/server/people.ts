import { asc, eq, and, ne, count } from 'drizzle-orm';
import { db } from './db';
import { users } from '../../db/schema';
import type { Role } from '../roles';

export async function listUsers() {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, createdAt: users.createdAt })
    .from(users)
    .orderBy(asc(users.role), asc(users.name));
}

export type RoleChangeResult =
  | { ok: true; user: { id: string; name: string; email: string; role: Role } }
  | { ok: false; reason: 'not-found' | 'last-admin' };

/** Changes a role; refuses to demote the last admin so the school never locks itself out. */
export async function changeRole(userId: string, role: Role): Promise<RoleChangeResult> {
  return db.transaction(async (tx) => {
    const [target] = await tx.select({ role: users.role }).from(users).where(eq(users.id, userId)).for('update');
    if (!target) return { ok: false, reason: 'not-found' } as const;
    if (target.role === 'admin' && role !== 'admin') {
      const [{ others }] = await tx
        .select({ others: count() })
        .from(users)
        .where(and(eq(users.role, 'admin'), ne(users.id, userId)));
      if (others === 0) return { ok: false, reason: 'last-admin' } as const;
    }
    const [user] = await tx
      .update(users)
      .set({ role })
      .where(eq(users.id, userId))
      .returning({ id: users.id, name: users.name, email: users.email, role: users.role });
    return { ok: true, user } as const;
  });
}
