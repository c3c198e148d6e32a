import { cpus } from 'node:os';
import { databaseUrl } from '../lib/config.mjs';
import { answerCases } from './answers';
import { benchLearnerEmail, createBenchLearner } from './bench-user';
import type { RunningServer } from './child-server';
import { openDatabase } from './db';
import { preflight, runLoad, type AttemptBody, type LoadResult } from './endpoint';
import { largestDemoProcedure } from './procedure';
import { printComparison, printFailure, printLoad, printScoring } from './report';
import { benchmarkScoring } from './scoring';
import { appIsBuilt, startApp, startBaseline } from './servers';

// npm run bench: scoring alone, then POST /api/attempts on the built app and on a bare node:http
// baseline. A report, not a test: no figure is compared with a limit; only failed requests fail it.

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

async function measure(server: RunningServer, bodies: AttemptBody[], seconds: number, countRows: () => Promise<number>, cookie?: string) {
  const common = { origin: server.origin, cookie, connections: CONNECTIONS, bodies, countRows };
  await preflight({ ...common, label: server.name });
  // The first seconds fill the connection pool and let the JIT settle; they are not reported.
  await runLoad({ ...common, label: `${server.name} warm-up`, seconds: WARM_UP_SECONDS });
  const result = await runLoad({ ...common, label: server.name, seconds });
  printLoad(result);
  return result;
}

const failures = (r: LoadResult) => r.non2xx + r.errors + r.timeouts;

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
  const email = benchLearnerEmail();
  const running: RunningServer[] = [];
  let cleaned: Promise<void> | null = null;
  const cleanUp = () =>
    (cleaned ??= (async () => {
      await Promise.all(running.map((s) => s.stop()));
      const removed = await db.deleteUserByEmail(email);
      console.log(`\n  Clean-up: servers stopped; removed ${removed.users} temporary learner and its ${removed.attempts} attempt rows.`);
      await db.close();
    })());
  const onSignal = (signal: NodeJS.Signals) => void cleanUp().finally(() => process.exit(signal === 'SIGINT' ? 130 : 143));
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);

  try {
    console.log(`\n== Endpoint runs: ${CONNECTIONS} connections, ${WARM_UP_SECONDS} s warm-up + ${seconds} s measured, one server at a time`);
    const app = await startApp(url);
    running.push(app);
    const learner = await createBenchLearner(app.origin, email);
    console.log(`  Signed in as a temporary learner made for this run (${learner.email}).`);
    const bodies: AttemptBody[] = cases.map((c) => ({ procedure: procedure.slug, stage: c.stage, answer: c.answer }));
    const countRows = () => db.attemptRowsOf(learner.id);

    const appResult = await measure(app, bodies, seconds, countRows, learner.cookie);
    await app.stop();
    const baseline = await startBaseline(url, learner.id);
    running.push(baseline);
    const baseResult = await measure(baseline, bodies, seconds, countRows);
    await baseline.stop();

    printComparison(appResult, baseResult, CONNECTIONS, seconds);
    const failed = [appResult, baseResult].filter((r) => failures(r) > 0);
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
