import { and, eq } from 'drizzle-orm';
import { db } from './db';
import { procedureVersions, reworkAnswers, reworkItems } from '../../db/schema';
import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { ratingFor, RATING_WORDS } from '../rework/rating';
import { scoreAnswer } from '../rework/questions';
import { fromStored, review, toStored, type Grade } from '../rework/schedule';
import { reworkAnswerSchema, type ReworkAnswer, type ReworkAnswerRequest } from '../schemas/rework';

// Answering a rework question: judged on the server with the question rebuilt from the stored procedure,
// then the item's schedule moves on. A clientId already used returns the stored answer, as attempts do.

export interface ReworkAnswerView {
  id: string;
  itemId: string;
  answer: ReworkAnswer;
  correct: boolean;
  rating: number;
  ratingWord: string;
  results: StepResult[];
  notes: string[];
  /** Every choice that was right, now that the learner has answered. */
  accepted: string[];
  dueBefore: Date;
  dueAfter: Date;
  createdAt: Date;
}

export type AnswerResult =
  | { kind: 'created' | 'replayed'; answer: ReworkAnswerView }
  | { kind: 'not-found' }
  | { kind: 'invalid'; message: string }
  | { kind: 'client-id-reused' };

/** Thrown inside the transaction when a concurrent request stored this clientId first: roll back, then replay. */
class ClientIdTaken extends Error {}

export async function answerItem(userId: string, itemId: string, request: ReworkAnswerRequest, now = new Date()): Promise<AnswerResult> {
  const earlier = await storedAnswer(userId, request.clientId);
  if (earlier) return replay(earlier, itemId, request.answer);

  try {
    return await db.transaction(async (tx) => {
      // The row lock keeps two answers to one item from both scheduling from the same card.
      const [item] = await tx
        .select({ id: reworkItems.id, stage: reworkItems.stage, itemKey: reworkItems.itemKey, card: reworkItems.card, due: reworkItems.due, versionId: reworkItems.procedureVersionId })
        .from(reworkItems)
        .where(and(eq(reworkItems.id, itemId), eq(reworkItems.userId, userId)))
        .for('update');
      if (!item) return { kind: 'not-found' } as const;
      const [version] = await tx.select({ document: procedureVersions.document }).from(procedureVersions).where(eq(procedureVersions.id, item.versionId));
      const { answer } = request;
      const verdict = scoreAnswer(version!.document, item.stage, item.itemKey, answer.variant, answer.choice);
      if (!verdict.ok) return { kind: 'invalid', message: verdict.message } as const;

      const rating = ratingFor({ correct: verdict.correct, hinted: answer.hinted });
      const card = review(fromStored(item.card), rating, now);
      const [inserted] = await tx
        .insert(reworkAnswers)
        .values({
          itemId: item.id, userId, clientId: request.clientId, answer, correct: verdict.correct, rating,
          results: verdict.results, dueBefore: item.due, dueAfter: card.due, createdAt: now,
        })
        .onConflictDoNothing({ target: [reworkAnswers.userId, reworkAnswers.clientId] })
        .returning({ id: reworkAnswers.id, createdAt: reworkAnswers.createdAt });
      if (!inserted) throw new ClientIdTaken();
      await tx.update(reworkItems).set({ card: toStored(card), due: card.due }).where(eq(reworkItems.id, item.id));
      return {
        kind: 'created',
        answer: {
          id: inserted.id, itemId: item.id, answer, correct: verdict.correct, rating, ratingWord: RATING_WORDS[rating],
          results: verdict.results, notes: verdict.notes, accepted: verdict.accepted, dueBefore: item.due, dueAfter: card.due, createdAt: inserted.createdAt,
        },
      } as const;
    });
  } catch (error) {
    if (!(error instanceof ClientIdTaken)) throw error;
    const stored = await storedAnswer(userId, request.clientId);
    if (!stored) throw new Error('rework answer conflict without a stored row');
    return replay(stored, itemId, request.answer);
  }
}

interface StoredAnswer {
  id: string;
  itemId: string;
  answer: unknown;
  correct: boolean;
  rating: number;
  results: StepResult[];
  dueBefore: Date;
  dueAfter: Date;
  createdAt: Date;
  document: Procedure;
  stage: Stage;
  itemKey: string;
}

async function storedAnswer(userId: string, clientId: string): Promise<StoredAnswer | null> {
  const [row] = await db
    .select({
      id: reworkAnswers.id,
      itemId: reworkAnswers.itemId,
      answer: reworkAnswers.answer,
      correct: reworkAnswers.correct,
      rating: reworkAnswers.rating,
      results: reworkAnswers.results,
      dueBefore: reworkAnswers.dueBefore,
      dueAfter: reworkAnswers.dueAfter,
      createdAt: reworkAnswers.createdAt,
      document: procedureVersions.document,
      stage: reworkItems.stage,
      itemKey: reworkItems.itemKey,
    })
    .from(reworkAnswers)
    .innerJoin(reworkItems, eq(reworkItems.id, reworkAnswers.itemId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, reworkItems.procedureVersionId))
    .where(and(eq(reworkAnswers.userId, userId), eq(reworkAnswers.clientId, clientId)));
  return row ?? null;
}

/** The same clientId again: the stored answer when it is the same answer to the same item, else a conflict. */
function replay(stored: StoredAnswer, itemId: string, answer: ReworkAnswer): AnswerResult {
  const previous = reworkAnswerSchema.parse(stored.answer);
  const same =
    stored.itemId === itemId && previous.choice === answer.choice && previous.variant === answer.variant && previous.hinted === answer.hinted;
  if (!same) return { kind: 'client-id-reused' };
  // The question is rebuilt from the same variant, so notes and accepted choices come out as they did.
  const verdict = scoreAnswer(stored.document, stored.stage, stored.itemKey, previous.variant, previous.choice);
  return {
    kind: 'replayed',
    answer: {
      id: stored.id,
      itemId: stored.itemId,
      answer: previous,
      correct: stored.correct,
      rating: stored.rating,
      ratingWord: RATING_WORDS[stored.rating as Grade] ?? String(stored.rating),
      results: stored.results,
      notes: verdict.ok ? verdict.notes : [],
      accepted: verdict.ok ? verdict.accepted : [],
      dueBefore: stored.dueBefore,
      dueAfter: stored.dueAfter,
      createdAt: stored.createdAt,
    },
  };
}

/** The JSON shape of an answer (docs/api.md documents it). */
export function reworkAnswerJson(a: ReworkAnswerView) {
  return {
    id: a.id,
    itemId: a.itemId,
    answer: a.answer,
    correct: a.correct,
    rating: a.rating,
    ratingWord: a.ratingWord,
    results: a.results,
    notes: a.notes,
    accepted: a.accepted,
    dueBefore: a.dueBefore,
    dueAfter: a.dueAfter,
    createdAt: a.createdAt,
  };
}
