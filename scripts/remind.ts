// Sends the reminders for drills due in the next 24 hours; run through `npm run remind` (scripts/remind.mjs).
//   --now=2030-05-01T09:00:00Z   act as if it were that instant (tests use a fixed clock)
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../src/db/schema';
import { createMailer, mailSettingsFromEnv } from '../src/lib/server/mailer';
import { sendDrillReminders } from '../src/lib/server/reminders';

function nowFromArgs(args: string[]): Date {
  const given = args.find((a) => a.startsWith('--now='))?.slice('--now='.length);
  if (given === undefined) return new Date();
  const now = new Date(given);
  if (Number.isNaN(now.getTime())) {
    console.error(`--now must be an ISO 8601 date and time, e.g. --now=2030-05-01T09:00:00Z (got "${given}")`);
    process.exit(2);
  }
  return now;
}

if (!process.env.DATABASE_URL) {
  console.error('DATABASE_URL is not set; run through `npm run remind`.');
  process.exit(2);
}

const now = nowFromArgs(process.argv.slice(2));
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
const db = drizzle(pool, { schema });
const mailer = createMailer(mailSettingsFromEnv(process.env));

try {
  const run = await sendDrillReminders(db, mailer, now, process.env.APP_URL || 'http://localhost:4321');
  console.log(`drill reminders at ${now.toISOString()}: ${run.sent} sent, ${run.alreadyReminded} reminded before, ${run.failed} failed`);
  // A failed send is retried by the next run; the exit code lets the scheduler notice.
  if (run.failed > 0) process.exitCode = 1;
} catch (err) {
  console.error(err);
  process.exitCode = 1;
} finally {
  await pool.end();
}
