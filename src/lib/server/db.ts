import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { DATABASE_URL } from 'astro:env/server';
import * as schema from '../../db/schema';

// One pool per app process; several processes may share the database.
const pool = new pg.Pool({ connectionString: DATABASE_URL, max: 10 });

export const db = drizzle(pool, { schema });
export type Db = typeof db;

/** True when PostgreSQL answers; the health endpoint reports it. */
export async function databaseIsUp(): Promise<boolean> {
  try {
    await pool.query('select 1');
    return true;
  } catch {
    return false;
  }
}
