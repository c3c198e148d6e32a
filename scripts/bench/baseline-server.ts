import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../../src/db/schema';
import { attemptRequestSchema } from '../../src/lib/schemas/attempts';
import { scoreAttempt } from '../../src/lib/scoring';
import { attemptJson, attemptRow, createdAttempt } from '../../src/lib/server/attempt-row';
import { findVersion } from '../../src/lib/server/procedure-store';
import { queueMisses } from '../../src/lib/server/rework-queue';

// Baseline for POST /api/attempts without Astro, sessions or the clientId pre-check: read the JSON,
// validate it, look the version up, score, insert the same row and queue its misses for rework with the
// app's own writer, so both servers do the same database work and the ratio measures what the app adds.
// Run as a child of the benchmark.

const { DATABASE_URL, PORT, BENCH_USER_IDS } = process.env;
if (!DATABASE_URL || !PORT || !BENCH_USER_IDS) {
  console.error('baseline-server needs DATABASE_URL, PORT and BENCH_USER_IDS');
  process.exit(1);
}
// No sessions here: a request names its learner in a header, one of the run's own.
const learners = new Set(BENCH_USER_IDS.split(','));

// Same pool size as the app's db module, so both have the same number of database connections.
const pool = new pg.Pool({ connectionString: DATABASE_URL, max: 10 });
const db = drizzle(pool, { schema });
const { attempts } = schema;

function send(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(text) });
  res.end(text);
}

async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

async function postAttempt(req: IncomingMessage, res: ServerResponse): Promise<void> {
  const userId = req.headers['x-bench-learner'];
  if (typeof userId !== 'string' || !learners.has(userId)) return send(res, 400, { error: 'Name one of the run\'s learners in x-bench-learner' });
  let body: unknown;
  try {
    body = JSON.parse(await readBody(req));
  } catch {
    return send(res, 400, { error: 'The body is not valid JSON' });
  }
  const parsed = attemptRequestSchema.safeParse(body);
  if (!parsed.success) return send(res, 400, { error: parsed.error.issues[0]?.message ?? 'Invalid input' });
  const input = parsed.data;

  const stored = await findVersion(db, input.procedure, input.version);
  if (!stored) return send(res, 404, { error: `No procedure "${input.procedure}"` });
  const scored = scoreAttempt(stored.document, input.stage, input.answer);
  if (!scored.ok) return send(res, 400, { error: scored.issues[0]?.message ?? 'The answer is not valid', issues: scored.issues });

  const { score } = scored;
  const [row] = await db
    .insert(attempts)
    .values(attemptRow(userId, input, stored.id, score))
    .onConflictDoNothing({ target: [attempts.userId, attempts.clientId] })
    .returning({ id: attempts.id, createdAt: attempts.createdAt });
  if (!row) return send(res, 409, { error: 'This clientId was already used' });
  await queueMisses(db, { userId, attemptId: row.id, procedureVersionId: stored.id, document: stored.document, stage: input.stage, results: score.results, at: row.createdAt });
  send(res, 201, attemptJson(createdAttempt(userId, input, stored, score, row)));
}

const server = createServer((req, res) => {
  if (req.method === 'GET' && req.url === '/health') return send(res, 200, { ok: true });
  if (req.method !== 'POST' || req.url !== '/api/attempts') return send(res, 404, { error: 'Not found' });
  postAttempt(req, res).catch((err: unknown) => {
    console.error(err);
    if (!res.headersSent) send(res, 500, { error: 'Internal error' });
  });
});

server.listen(Number(PORT), '127.0.0.1');
process.once('SIGTERM', () => {
  server.close();
  server.closeAllConnections();
  void pool.end().finally(() => process.exit(0));
});
