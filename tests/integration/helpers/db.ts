import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../../../src/db/schema';

/** Direct access to the test database, for checks the API does not expose. */
export function testDb() {
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
  return { db: drizzle(pool, { schema }), close: () => pool.end() };
}
