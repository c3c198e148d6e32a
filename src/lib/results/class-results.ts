import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { drillProgress, type DrillStatus } from '../drills/progress';
import { analyseItems, GROUP_SPLITS, type GroupSplit, type ItemStats } from './item-analysis';
import { drillSteps, stepRight } from './steps';

// The instructor's view of a class, built from plain rows so it can be tested without a database.
// One row a learner: per drill its standing (drillProgress) with each stage's best score and attempt
// count, and the latest bench sign-off per procedure. Then, per drill, the step analysis.
//
// Which attempts the step analysis counts: each learner's FIRST attempt on each stage of the drill,
// i.e. what the learner knew before practising it; later attempts measure practice, not the step.
// Only learners with a first attempt on every stage of the drill are counted, so each total is out of
// the same steps; the others are reported as not counted.

export interface ResultsInput {
  classInfo: { id: string; name: string };
  /** Learners in the order the results list them (ties in the step analysis keep this order). */
  learners: { id: string; name: string; email: string }[];
  drills: {
    id: string;
    procedureId: string;
    slug: string;
    title: string;
    version: number;
    document: Procedure;
    stages: Stage[];
    dueAt: Date;
    passMarkPct: number;
    attemptLimit: number | null;
    closedAt: Date | null;
  }[];
  attempts: {
    id: string;
    userId: string;
    drillId: string;
    stage: Stage;
    score: number;
    maxScore: number;
    results: StepResult[];
    createdAt: Date;
  }[];
  signOffs: { learnerId: string; procedureId: string; benchDate: string; outcome: 'pass' | 'redo'; notes: string; createdAt: Date }[];
  /** Procedures named by drills or sign-offs, with the title of their latest version. */
  procedures: { id: string; slug: string; title: string }[];
  now: Date;
  groups: GroupSplit;
}

export interface StageCell {
  stage: Stage;
  attempts: number;
  /** Best score in percent, one decimal; null before the first attempt. */
  bestPct: number | null;
  passed: boolean;
  /** The latest attempt on the stage, for the attempt review. */
  latestAttemptId: string | null;
}

export interface LearnerDrill {
  drillId: string;
  status: DrillStatus;
  passed: boolean;
  bestPct: number | null;
  attempts: number;
  lastActivity: string | null;
  stages: StageCell[];
}

export interface LearnerSignOff {
  procedureId: string;
  outcome: 'pass' | 'redo';
  benchDate: string;
  notes: string;
}

export interface LearnerRow {
  id: string;
  name: string;
  email: string;
  lastActivity: string | null;
  drills: LearnerDrill[];
  /** The latest sign-off per procedure (by bench date, then when recorded); procedures without one are absent. */
  signOffs: LearnerSignOff[];
}

export interface StepStats extends ItemStats {
  stage: Stage;
  key: string;
  label: string;
}

export interface StepAnalysis {
  drillId: string;
  /** Learners with a first attempt on every stage. */
  counted: number;
  notCounted: number;
  groupSize: number;
  steps: StepStats[];
  /** Counted learners from the highest total to the lowest, with their first-try answers (1 right, 0 missed) per step. */
  learners: { id: string; name: string; total: number; group: 'upper' | 'lower' | null; answers: (0 | 1)[]; firstAttempts: Partial<Record<Stage, string>> }[];
}

export interface ClassResults {
  class: { id: string; name: string };
  generatedAt: string;
  groups: GroupSplit;
  groupShare: number;
  drills: {
    id: string;
    procedure: string;
    title: string;
    version: number;
    stages: Stage[];
    dueAt: string;
    passMarkPct: number;
    attemptLimit: number | null;
    closedAt: string | null;
  }[];
  signOffProcedures: { id: string; slug: string; title: string }[];
  learners: LearnerRow[];
  stepAnalysis: StepAnalysis[];
}

/** Percent to one decimal: what the table shows and the CSV holds, so the two always agree. */
export const roundPct = (pct: number | null) => (pct === null ? null : Math.round(pct * 10) / 10);

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const byTime = (a: { createdAt: Date; id: string }, b: { createdAt: Date; id: string }) =>
  a.createdAt.getTime() - b.createdAt.getTime() || a.id.localeCompare(b.id);

export function buildClassResults(input: ResultsInput): ClassResults {
  const attempts = [...input.attempts].sort(byTime);
  const mine = new Map<string, ResultsInput['attempts']>();
  for (const a of attempts) {
    const key = `${a.userId}/${a.drillId}`;
    mine.set(key, [...(mine.get(key) ?? []), a]);
  }
  const attemptsOf = (userId: string, drillId: string) => mine.get(`${userId}/${drillId}`) ?? [];

  const learners = input.learners.map((learner): LearnerRow => {
    const drills = input.drills.map((drill): LearnerDrill => {
      const own = attemptsOf(learner.id, drill.id);
      const progress = drillProgress(drill, own, input.now);
      return {
        drillId: drill.id,
        status: progress.status,
        passed: progress.passed,
        bestPct: roundPct(progress.bestPct),
        attempts: progress.attempts,
        lastActivity: iso(progress.lastActivity),
        stages: progress.stages.map((s) => ({
          stage: s.stage,
          attempts: s.attempts,
          bestPct: roundPct(s.bestPct),
          passed: s.passed,
          latestAttemptId: own.filter((a) => a.stage === s.stage).at(-1)?.id ?? null,
        })),
      };
    });
    const last = drills.map((d) => d.lastActivity).filter((d): d is string => d !== null);
    return {
      ...learner,
      lastActivity: last.length ? last.reduce((a, b) => (a > b ? a : b)) : null,
      drills,
      signOffs: latestSignOffs(input.signOffs.filter((s) => s.learnerId === learner.id)),
    };
  });

  const signed = new Set(input.signOffs.map((s) => s.procedureId));
  const drilled = new Set(input.drills.map((d) => d.procedureId));
  const signOffProcedures = input.procedures
    .filter((p) => signed.has(p.id) || drilled.has(p.id))
    .sort((a, b) => a.title.localeCompare(b.title) || a.slug.localeCompare(b.slug));

  return {
    class: input.classInfo,
    generatedAt: input.now.toISOString(),
    groups: input.groups,
    groupShare: GROUP_SPLITS[input.groups],
    drills: input.drills.map((d) => ({
      id: d.id,
      procedure: d.slug,
      title: d.title,
      version: d.version,
      stages: d.stages,
      dueAt: d.dueAt.toISOString(),
      passMarkPct: d.passMarkPct,
      attemptLimit: d.attemptLimit,
      closedAt: iso(d.closedAt),
    })),
    signOffProcedures,
    learners,
    stepAnalysis: input.drills.map((drill) => stepAnalysis(drill, input.learners, attemptsOf, input.groups)),
  };
}

function latestSignOffs(rows: ResultsInput['signOffs']): LearnerSignOff[] {
  const latest = new Map<string, ResultsInput['signOffs'][number]>();
  for (const row of rows) {
    const held = latest.get(row.procedureId);
    const newer = !held || row.benchDate > held.benchDate || (row.benchDate === held.benchDate && row.createdAt > held.createdAt);
    if (newer) latest.set(row.procedureId, row);
  }
  return [...latest.values()].map(({ procedureId, outcome, benchDate, notes }) => ({ procedureId, outcome, benchDate, notes }));
}

function stepAnalysis(
  drill: ResultsInput['drills'][number],
  learners: ResultsInput['learners'],
  attemptsOf: (userId: string, drillId: string) => ResultsInput['attempts'],
  groups: GroupSplit,
): StepAnalysis {
  const steps = drillSteps(drill.document, drill.stages);
  const counted: { learner: ResultsInput['learners'][number]; answers: (0 | 1)[]; firstAttempts: Partial<Record<Stage, string>> }[] = [];
  for (const learner of learners) {
    const own = attemptsOf(learner.id, drill.id);
    // Attempts are in time order, so find() gives the first attempt on each stage.
    const first = new Map(drill.stages.map((stage) => [stage, own.find((a) => a.stage === stage)] as const));
    if ([...first.values()].some((a) => !a)) continue;
    counted.push({
      learner,
      answers: steps.map((step) => stepRight(first.get(step.stage)!.results, step.key)),
      firstAttempts: Object.fromEntries([...first].map(([stage, a]) => [stage, a!.id])),
    });
  }

  const analysis = analyseItems(
    counted.map((c) => c.answers),
    { groupShare: GROUP_SPLITS[groups], items: steps.length },
  );
  const upper = new Set(analysis.upper);
  const lower = new Set(analysis.lower);
  return {
    drillId: drill.id,
    counted: counted.length,
    notCounted: learners.length - counted.length,
    groupSize: analysis.groupSize,
    steps: steps.map((step, j) => ({ ...step, ...analysis.items[j]! })),
    learners: analysis.ranking.map((i) => ({
      id: counted[i]!.learner.id,
      name: counted[i]!.learner.name,
      total: analysis.totals[i]!,
      group: upper.has(i) ? 'upper' : lower.has(i) ? 'lower' : null,
      answers: counted[i]!.answers,
      firstAttempts: counted[i]!.firstAttempts,
    })),
  };
}

