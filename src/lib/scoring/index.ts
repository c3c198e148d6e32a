import type { z } from 'zod';
import { stageSchema, type Procedure, type Vec3 } from '../procedure/schema';
import type { Issue } from '../procedure/validate';
import { answerSchemas } from './answers';
import { scoreOrder } from './order';
import { scorePins } from './pins';
import { scorePattern } from './pattern';
import { scoreWrench } from './wrench';
import { scoreFinalCheck } from './final-check';
import type { StageScore } from './types';

// One entry point for the server: check the stage and the answer's shape, then hand the answer to the
// stage's scorer. A malformed answer comes back as issues (HTTP 400); a wrong answer as a low score.

export type ScoreAttemptResult = { ok: true; score: StageScore } | { ok: false; issues: Issue[] };

const zodIssues = (error: z.ZodError, prefix = 'answer'): Issue[] =>
  error.issues.map((i) => ({ path: [prefix, ...i.path].join('.'), message: i.message }));

/** Scores one stage of an attempt against a validated procedure. */
export function scoreAttempt(procedure: Procedure, stage: string, answer: unknown): ScoreAttemptResult {
  const s = stageSchema.safeParse(stage);
  if (!s.success) return { ok: false, issues: [{ path: 'stage', message: `there is no stage "${stage}"` }] };
  if (!procedure.stages.includes(s.data)) {
    return { ok: false, issues: [{ path: 'stage', message: `procedure ${procedure.slug} has no ${s.data} stage` }] };
  }

  switch (s.data) {
    case 'order': {
      const a = answerSchemas.order.safeParse(answer);
      return a.success ? { ok: true, score: scoreOrder(procedure, a.data) } : { ok: false, issues: zodIssues(a.error) };
    }
    case 'pins': {
      const a = answerSchemas.pins.safeParse(answer);
      return a.success ? { ok: true, score: scorePins(procedure, a.data) } : { ok: false, issues: zodIssues(a.error) };
    }
    case 'pattern': {
      const a = answerSchemas.pattern.safeParse(answer);
      if (!a.success) return { ok: false, issues: zodIssues(a.error) };
      const groupKey = a.data.group ?? procedure.fastenerGroups[0]?.key;
      const group = procedure.fastenerGroups.find((g) => g.key === groupKey);
      if (!group) return { ok: false, issues: [{ path: 'answer.group', message: `there is no fastener group "${groupKey ?? ''}"` }] };
      const positions: Record<string, Vec3> = Object.fromEntries(procedure.anchors.map((x) => [x.key, x.position]));
      return { ok: true, score: scorePattern(group, positions, { passes: a.data.passes }) };
    }
    case 'wrench': {
      const a = answerSchemas.wrench.safeParse(answer);
      if (!a.success) return { ok: false, issues: zodIssues(a.error) };
      const task = procedure.wrench;
      const group = task && procedure.fastenerGroups.find((g) => g.key === task.group);
      // Validation guarantees both; a procedure that skipped validation is refused, not scored.
      if (!task || !group) return { ok: false, issues: [{ path: 'stage', message: `procedure ${procedure.slug} has no wrench task` }] };
      return { ok: true, score: scoreWrench(task, group.torque, a.data) };
    }
    case 'final-check': {
      const a = answerSchemas['final-check'].safeParse(answer);
      if (!a.success) return { ok: false, issues: zodIssues(a.error) };
      if (!procedure.finalCheck) return { ok: false, issues: [{ path: 'stage', message: `procedure ${procedure.slug} has no final check` }] };
      return { ok: true, score: scoreFinalCheck(procedure, a.data) };
    }
  }
}
