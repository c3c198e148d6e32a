import type { Procedure } from '../../src/lib/procedure/schema';
import type { LoadResult } from './endpoint';
import type { ScoringReport } from './scoring';

// Plain-text tables; every figure the benchmark produces is printed here and nowhere else.

// Text columns (the first `textColumns`) align left, figures align right.
function table(head: string[], rows: (string | number)[][], textColumns = 1): string {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => String(r[i]).length)));
  const pad = (cells: (string | number)[]) =>
    cells.map((c, i) => (i < textColumns ? String(c).padEnd(widths[i]!) : String(c).padStart(widths[i]!))).join('  ');
  return [pad(head), pad(widths.map((w) => '-'.repeat(w))), ...rows.map(pad)]
    .map((line) => `  ${line}`)
    .join('\n');
}

const us = (x: number) => x.toFixed(1);

export function printScoring(procedure: Procedure, report: ScoringReport): void {
  console.log(`\n== Scoring: scoreAttempt on "${procedure.slug}" (${procedure.steps.length} steps, the largest demo procedure)`);
  console.log('\n  Answers used (each scored once to show the mix):');
  console.log(
    table(
      ['stage', 'answer', 'score', 'passed', 'expected'],
      report.outcomes.map((o) => [
        o.item.stage,
        o.item.label,
        `${o.score}/${o.maxScore}`,
        o.passed ? 'yes' : 'no',
        o.passed === o.item.expectPass ? (o.item.expectPass ? 'pass' : 'fail') : `${o.item.expectPass ? 'pass' : 'fail'}  <- UNEXPECTED`,
      ]),
      2,
    ),
  );
  console.log(`\n  ${report.attempts} timed attempts after a warm-up, one process.hrtime.bigint() pair per call:`);
  console.log(
    table(
      ['stage', 'attempts', 'median µs', 'p99 µs', 'max µs'],
      [
        ...report.byStage.map(({ stage, summary: s }) => [stage, s.count, us(s.median), us(s.p99), us(s.max)]),
        ['all', report.overall.count, us(report.overall.median), us(report.overall.p99), us(report.overall.max)],
      ],
    ),
  );
  console.log('  Aim: well under 1 ms (1000 µs) per attempt.');
}

export function printLoad(result: LoadResult): void {
  const codes = Object.entries(result.statusCodes).map(([code, n]) => `${code}×${n}`).join(', ') || 'none';
  console.log(
    `  ${result.label}: ${result.requestsPerSec.toFixed(0)} req/s, p50 ${result.p50} ms, p99 ${result.p99} ms,` +
      ` ${result.total} responses (${codes}), non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts},` +
      ` ${result.rowsWritten} rows written (requests still in flight at the end count here too)`,
  );
}

export function printComparison(scenario: string, app: LoadResult, baseline: LoadResult, connections: number, seconds: number): void {
  console.log(`\n== POST /api/attempts, ${scenario}: ${connections} connections, ${seconds} s each, loopback`);
  console.log(
    table(
      ['server', 'req/s', 'p50 ms', 'p99 ms', 'non-2xx', 'errors'],
      [app, baseline].map((r) => [r.label, r.requestsPerSec.toFixed(0), r.p50, r.p99, r.non2xx, r.errors]),
    ),
  );
  const ratio = app.requestsPerSec / baseline.requestsPerSec;
  console.log(`\n  app / baseline throughput: ${ratio.toFixed(2)}  (aim: at least 0.50)`);
}

/** Failed requests make the run fail: figures measured over errors mean nothing. */
export function printFailure(r: LoadResult): void {
  console.error(`\n  !!! FAILED: ${r.label} had ${r.non2xx} non-2xx responses, ${r.errors} errors and ${r.timeouts} timeouts`);
  console.error(`  !!! status codes: ${JSON.stringify(r.statusCodes)}; the figures above are not valid.`);
}
