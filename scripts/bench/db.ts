import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { count, eq, inArray } from 'drizzle-orm';
import * as schema from '../../src/db/schema';

// The benchmark's own small connection, for counting and removing what the run wrote.

export function openDatabase(url: string) {
  const pool = new pg.Pool({ connectionString: url, max: 2 });
  const db = drizzle(pool, { schema });
  const { attempts, users } = schema;
  return {
    async attemptRowsOf(userIds: string[]): Promise<number> {
      const [row] = await db.select({ n: count() }).from(attempts).where(inArray(attempts.userId, userIds));
      return row?.n ?? 0;
    },
    /** Deletes the account; its sessions and attempts go with it (foreign keys cascade). */
    async deleteUserByEmail(email: string): Promise<{ users: number; attempts: number }> {
      const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
      if (!user) return { users: 0, attempts: 0 };
      const rows = await this.attemptRowsOf([user.id]);
      const deleted = await db.delete(users).where(eq(users.id, user.id)).returning({ id: users.id });
      return { users: deleted.length, attempts: rows };
    },
    close: () => pool.end(),
  };
}
export type BenchDatabase = ReturnType<typeof openDatabase>;
