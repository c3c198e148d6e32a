import type { Procedure, Stage } from '../../src/lib/procedure/schema';
import { scoreAttempt } from '../../src/lib/scoring';
import type { AnswerCase } from './answers';
import { summarize, type Summary } from './stats';

// Times scoreAttempt alone, one call at a time, the way the server calls it once per request.

export interface CaseOutcome {
  item: AnswerCase;
  score: number;
  maxScore: number;
  passed: boolean;
}

export interface ScoringReport {
  attempts: number;
  overall: Summary;
  byStage: { stage: Stage; summary: Summary }[];
  outcomes: CaseOutcome[];
}

/** Scores each case once and keeps the result; a malformed case is a bug in the benchmark. */
function scoreOnce(procedure: Procedure, item: AnswerCase): CaseOutcome {
  const result = scoreAttempt(procedure, item.stage, item.answer);
  if (!result.ok) throw new Error(`answer "${item.label}" (${item.stage}) was refused: ${result.issues[0]?.message}`);
  return { item, score: result.score.score, maxScore: result.score.maxScore, passed: result.score.passed };
}

/** The i-th attempt: stages in turn, and within a stage its cases in turn, so stages get equal shares. */
function caseAt(stages: Stage[], byStage: Map<Stage, AnswerCase[]>, i: number): AnswerCase {
  const list = byStage.get(stages[i % stages.length]!)!;
  return list[Math.floor(i / stages.length) % list.length]!;
}

export function benchmarkScoring(procedure: Procedure, cases: AnswerCase[], attempts = 10_000, warmUp = 3_000): ScoringReport {
  const outcomes = cases.map((c) => scoreOnce(procedure, c));
  const stages = [...new Set(cases.map((c) => c.stage))];
  const byStage = new Map(stages.map((s) => [s, cases.filter((c) => c.stage === s)] as const));

  // Warm-up lets the JIT settle before anything is timed.
  let sink = 0;
  for (let i = 0; i < warmUp; i++) {
    const c = caseAt(stages, byStage, i);
    const r = scoreAttempt(procedure, c.stage, c.answer);
    sink += r.ok ? r.score.score : 0;
  }

  const micros = new Float64Array(attempts);
  const stageOf: Stage[] = new Array(attempts);
  for (let i = 0; i < attempts; i++) {
    const c = caseAt(stages, byStage, i);
    const start = process.hrtime.bigint();
    const r = scoreAttempt(procedure, c.stage, c.answer);
    const end = process.hrtime.bigint();
    sink += r.ok ? r.score.score : 0;
    micros[i] = Number(end - start) / 1000;
    stageOf[i] = c.stage;
  }
  // Using the results keeps the calls from being optimised away.
  if (sink < 0) console.log(sink);

  return {
    attempts,
    overall: summarize(micros),
    byStage: stages.map((stage) => ({ stage, summary: summarize(micros.filter((_, i) => stageOf[i] === stage)) })),
    outcomes,
  };
}
