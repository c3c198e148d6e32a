import { describe, expect, it } from 'vitest';
import { answersHidden, withoutAnswers } from '~/lib/drills/answers';
import { scoreAttempt } from '~/lib/scoring';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';

const due = new Date('2030-04-08T15:00:00Z');

describe('answersHidden', () => {
  it('holds answers back only on a drill that asks for it, and only before the due date', () => {
    expect(answersHidden({ answersAfterDue: true, dueAt: due }, new Date('2030-04-08T14:59:59Z'))).toBe(true);
    expect(answersHidden({ answersAfterDue: true, dueAt: due }, due)).toBe(false);
    expect(answersHidden({ answersAfterDue: true, dueAt: due }, new Date('2030-04-09T00:00:00Z'))).toBe(false);
    expect(answersHidden({ answersAfterDue: false, dueAt: due }, new Date('2030-04-01T00:00:00Z'))).toBe(false);
  });
});

describe('withoutAnswers', () => {
  const sump = demoProcedure('wren-160-sump');

  it('keeps each line and whether it was right, drops the words and the worked notes', () => {
    // A wrench setting in the wrong unit: the full feedback names the right setting.
    const scored = scoreAttempt(sump, 'wrench', { setting: 11, unit: 'N·m' });
    if (!scored.ok) throw new Error('not scored');
    const full = { id: 'a1', results: scored.score.results, notes: scored.score.notes ?? [], score: scored.score.score };
    const hidden = withoutAnswers(full);
    expect(hidden.results.map((r) => [r.key, r.ok])).toEqual(full.results.map((r) => [r.key, r.ok]));
    expect(hidden.notes).toEqual([]);
    expect(hidden.score).toBe(full.score);
    expect(hidden.id).toBe('a1');
    const expectedSetting = (correctAnswer(sump, 'wrench') as { setting: number }).setting;
    for (const line of hidden.results) {
      expect(line.message).not.toContain(String(Math.round(expectedSetting)));
      expect(line.message).toMatch(line.ok ? /: right$/ : /: not right yet\. The right answer shows after the due date\.$/);
    }
    // The original is left as it was (it is what the database keeps).
    expect(full.results.some((r) => r.message.includes('not right yet'))).toBe(false);
  });

  it('does not name the decoy on a right line either', () => {
    // An empty Pins answer: the decoy "left in the kit" line is right and would say it is not for this job.
    const scored = scoreAttempt(sump, 'pins', { placements: [] });
    if (!scored.ok) throw new Error('not scored');
    expect(scored.score.results.some((r) => r.ok && /not for this job/.test(r.message))).toBe(true);
    const hidden = withoutAnswers({ results: scored.score.results, notes: scored.score.notes ?? [] });
    expect(hidden.results.some((r) => /not for this job|mm/.test(r.message))).toBe(false);
  });

  it('names the line from its key so the learner knows which one it is', () => {
    const hidden = withoutAnswers({ results: [{ key: 'pass-2-torque', ok: false, message: 'pass 2 at 5 N·m; it goes to 11 N·m' }], notes: ['x'] });
    expect(hidden.results[0]!.message).toBe('Pass 2 torque: not right yet. The right answer shows after the due date.');
  });
});
