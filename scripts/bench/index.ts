import { cpus } from 'node:os';
import { databaseUrl } from '../lib/config.mjs';
import { answerCases } from './answers';
import { benchLearnerEmail, createBenchLearner, type BenchLearner } from './bench-user';
import type { RunningServer } from './child-server';
import { openDatabase } from './db';
import { preflight, runLoad, type AttemptBody, type LoadResult, type Sender } from './endpoint';
import { largestDemoProcedure } from './procedure';
import { printComparison, printFailure, printLoad, printScoring } from './report';
import { benchmarkScoring } from './scoring';
import { appIsBuilt, startApp, startBaseline } from './servers';

// npm run bench: scoring alone, then POST /api/attempts on the built app and on a bare node:http
// baseline, sent by a class of learners and by one learner. A report, not a test: no figure is compared
// with a limit; only failed requests fail it.

const CONNECTIONS = 20;
const WARM_UP_SECONDS = 2;

function benchSeconds(): number {
  const raw = process.env.BENCH_SECONDS ?? '15';
  const seconds = Number(raw);
  // Bounded so a typo cannot keep the database busy for hours.
  if (!Number.isFinite(seconds) || seconds < 1 || seconds > 300) {
    console.error(`BENCH_SECONDS must be a number of seconds from 1 to 300, not "${raw}"`);
    process.exit(1);
  }
  return seconds;
}

async function measure(server: RunningServer, senders: Sender[], bodies: AttemptBody[], seconds: number, countRows: () => Promise<number>) {
  const common = { origin: server.origin, senders, connections: CONNECTIONS, bodies, countRows };
  await preflight({ ...common, label: server.name });
  // The first seconds fill the connection pool and let the JIT settle; they are not reported.
  await runLoad({ ...common, label: `${server.name} warm-up`, seconds: WARM_UP_SECONDS });
  const result = await runLoad({ ...common, label: server.name, seconds });
  printLoad(result);
  return result;
}

const failures = (r: LoadResult) => r.non2xx + r.errors + r.timeouts;

/**
 * Who sends: a class of learners, a connection each (a class checking its work at once), and one learner
 * on every connection (the worst case for the rework queue: every miss lands on the same few items).
 */
const SCENARIOS = [
  { name: `a class: ${CONNECTIONS} learners, one connection each`, learners: CONNECTIONS },
  { name: `one learner on all ${CONNECTIONS} connections`, learners: 1 },
] as const;

async function main(): Promise<number> {
  const seconds = benchSeconds();
  console.log(`Benchwright benchmark: Node ${process.version}, ${cpus().length} CPUs (${cpus()[0]?.model ?? 'unknown'})`);

  const procedure = largestDemoProcedure();
  const cases = answerCases(procedure);
  printScoring(procedure, benchmarkScoring(procedure, cases));

  if (!appIsBuilt()) {
    console.error('\nThe app is not built (dist/server/entry.mjs is missing). Run `npm start` first.');
    return 1;
  }
  const url = databaseUrl('dev');
  const db = openDatabase(url);
  const emails = Array.from({ length: CONNECTIONS }, benchLearnerEmail);
  const running: RunningServer[] = [];
  let cleaned: Promise<void> | null = null;
  const cleanUp = () =>
    (cleaned ??= (async () => {
      await Promise.all(running.map((s) => s.stop()));
      let users = 0;
      let rows = 0;
      for (const email of emails) {
        const removed = await db.deleteUserByEmail(email);
        users += removed.users;
        rows += removed.attempts;
      }
      console.log(`\n  Clean-up: servers stopped; removed ${users} temporary learners and their ${rows} attempt rows.`);
      await db.close();
    })());
  const onSignal = (signal: NodeJS.Signals) => void cleanUp().finally(() => process.exit(signal === 'SIGINT' ? 130 : 143));
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);

  try {
    console.log(`\n== Endpoint runs: ${CONNECTIONS} connections, ${WARM_UP_SECONDS} s warm-up + ${seconds} s measured, one server at a time`);
    let app = await startApp(url);
    running.push(app);
    const learners: BenchLearner[] = [];
    for (const email of emails) learners.push(await createBenchLearner(app.origin, email));
    console.log(`  Signed in as ${learners.length} temporary learners made for this run.`);
    const bodies: AttemptBody[] = cases.map((c) => ({ procedure: procedure.slug, stage: c.stage, answer: c.answer }));

    const failed: LoadResult[] = [];
    for (const [index, scenario] of SCENARIOS.entries()) {
      const group = learners.slice(0, scenario.learners);
      const countRows = () => db.attemptRowsOf(group.map((l) => l.id));
      console.log(`\n-- ${scenario.name}`);
      if (index > 0) {
        app = await startApp(url);
        running.push(app);
      }
      const appResult = await measure(app, group.map((l) => ({ headers: { cookie: l.cookie } })), bodies, seconds, countRows);
      await app.stop();
      const baseline = await startBaseline(url, group.map((l) => l.id));
      running.push(baseline);
      const baseResult = await measure(baseline, group.map((l) => ({ headers: { 'x-bench-learner': l.id } })), bodies, seconds, countRows);
      await baseline.stop();
      printComparison(scenario.name, appResult, baseResult, CONNECTIONS, seconds);
      failed.push(...[appResult, baseResult].filter((r) => failures(r) > 0));
    }
    failed.forEach(printFailure);
    return failed.length > 0 ? 1 : 0;
  } finally {
    await cleanUp();
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error('\nBenchmark failed:', err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
