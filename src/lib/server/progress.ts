import { asc, eq } from 'drizzle-orm';
import { db } from './db';
import { attempts, procedures, procedureVersions, reworkAnswers, reworkItems } from '../../db/schema';
import { catchUpMisses } from './rework';
import { STAGES, type Stage } from '../procedure/schema';
import { fromStored } from '../rework/schedule';
import { standingOf, streakOf, dayIn, type ItemStanding, type Streak } from '../rework/progress';

// One learner's progress: scores over time per procedure and stage, rework items mastered against due,
// and the streak of days practised in the learner's time zone. Shared by the learner's own page and the
// instructor's view of one learner.

export interface ScorePoint {
  at: Date;
  score: number;
  maxScore: number;
  percent: number;
  passed: boolean;
}

export interface ProcedureProgress {
  slug: string;
  title: string;
  stages: { stage: Stage; attempts: ScorePoint[]; best: number; latest: number }[];
  rework: Record<ItemStanding, number>;
}

export interface Progress {
  timeZone: string;
  today: string;
  procedures: ProcedureProgress[];
  rework: Record<ItemStanding, number> & { total: number };
  streak: Streak;
}

const emptyCounts = (): Record<ItemStanding, number> => ({ mastered: 0, due: 0, learning: 0 });

export async function progressOf(learnerId: string, timeZone: string, now = new Date()): Promise<Progress> {
  await catchUpMisses(learnerId);
  const [attemptRows, itemRows, answerRows] = await Promise.all([
    db
      .select({
        slug: procedures.slug,
        title: procedureVersions.title,
        stage: attempts.stage,
        score: attempts.score,
        maxScore: attempts.maxScore,
        passed: attempts.passed,
        at: attempts.createdAt,
      })
      .from(attempts)
      .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
      .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
      .where(eq(attempts.userId, learnerId))
      .orderBy(asc(attempts.createdAt)),
    db
      .select({ slug: procedures.slug, title: procedureVersions.title, card: reworkItems.card })
      .from(reworkItems)
      .innerJoin(procedureVersions, eq(procedureVersions.id, reworkItems.procedureVersionId))
      .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
      .where(eq(reworkItems.userId, learnerId)),
    db.select({ at: reworkAnswers.createdAt }).from(reworkAnswers).where(eq(reworkAnswers.userId, learnerId)),
  ]);

  const bySlug = new Map<string, ProcedureProgress>();
  const entry = (slug: string, title: string) => {
    let p = bySlug.get(slug);
    if (!p) bySlug.set(slug, (p = { slug, title, stages: [], rework: emptyCounts() }));
    // The newest version's title wins: attempts come oldest first.
    p.title = title;
    return p;
  };

  for (const row of attemptRows) {
    const p = entry(row.slug, row.title);
    let stage = p.stages.find((s) => s.stage === row.stage);
    if (!stage) p.stages.push((stage = { stage: row.stage, attempts: [], best: 0, latest: 0 }));
    const percent = row.maxScore > 0 ? Math.round((row.score / row.maxScore) * 100) : 0;
    stage.attempts.push({ at: row.at, score: row.score, maxScore: row.maxScore, percent, passed: row.passed });
    stage.best = Math.max(stage.best, percent);
    stage.latest = percent;
  }

  for (const p of bySlug.values()) p.stages.sort((a, b) => STAGES.indexOf(a.stage) - STAGES.indexOf(b.stage));

  const totals = { ...emptyCounts(), total: 0 };
  for (const row of itemRows) {
    const standing = standingOf(fromStored(row.card), now);
    const p = bySlug.get(row.slug) ?? entry(row.slug, row.title);
    p.rework[standing] += 1;
    totals[standing] += 1;
    totals.total += 1;
  }

  const instants = [...attemptRows.map((r) => r.at), ...answerRows.map((r) => r.at)];
  return {
    timeZone,
    today: dayIn(now, timeZone),
    procedures: [...bySlug.values()].sort((a, b) => a.title.localeCompare(b.title)),
    rework: totals,
    streak: streakOf(instants, now, timeZone),
  };
}
