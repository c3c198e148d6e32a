import { describe, expect, it } from 'vitest';
import { Rating, State } from 'ts-fsrs';
import { fromStored, newCard, refreshAfterMiss, review, toStored } from '~/lib/rework/schedule';
import { ratingFor } from '~/lib/rework/rating';

// A fixed clock: every date below follows from it, never from the machine's time.
const NOW = new Date('2024-03-04T09:00:00Z');
const DAY = 86_400_000;

describe('the schedule wrapper against ts-fsrs 5.4.2 (FSRS-6 defaults)', () => {
  // Source: ts-fsrs's own test suite, first review of a new card (CHECK-VALUES.md, "Spaced review").
  const ratings = [Rating.Again, Rating.Hard, Rating.Good, Rating.Easy] as const;
  const stability = [0.212, 1.2931, 2.3065, 8.2956];
  const difficulty = [6.4133, 5.11217071, 2.11810397, 1];
  const scheduledDays = [0, 0, 0, 8];

  ratings.forEach((rating, i) => {
    it(`first review rated ${Rating[rating]}: stability ${stability[i]}, difficulty ${difficulty[i]}, ${scheduledDays[i]} days`, () => {
      const card = review(newCard(NOW), rating, NOW);
      expect(card.stability).toBeCloseTo(stability[i]!, 4);
      expect(card.difficulty).toBeCloseTo(difficulty[i]!, 6);
      expect(card.scheduled_days).toBe(scheduledDays[i]);
      expect(card.reps).toBe(1);
      expect(card.last_review).toEqual(NOW);
    });
  });

  it('Easy on a new card is due 8 days out, as scheduled_days says', () => {
    // Source: same ts-fsrs first-review values; with no fuzz the due date is exactly now + 8 days.
    expect(review(newCard(NOW), Rating.Easy, NOW).due).toEqual(new Date(NOW.getTime() + 8 * DAY));
  });

  it('a new card is due at once', () => {
    const card = newCard(NOW);
    expect(card.state).toBe(State.New);
    expect(card.due).toEqual(NOW);
  });

  it('an item answered right moves further out than one answered wrong', () => {
    const right = review(newCard(NOW), ratingFor({ correct: true, hinted: false }), NOW);
    const hinted = review(newCard(NOW), ratingFor({ correct: true, hinted: true }), NOW);
    const wrong = review(newCard(NOW), ratingFor({ correct: false, hinted: false }), NOW);
    expect(right.due.getTime()).toBeGreaterThan(hinted.due.getTime());
    expect(hinted.due.getTime()).toBeGreaterThan(wrong.due.getTime());
    expect(wrong.due.getTime()).toBeGreaterThan(NOW.getTime());
  });

  it('answered right twice it leaves the day for days; then wrong, it comes back within the hour', () => {
    const first = review(newCard(NOW), Rating.Good, NOW);
    const second = review(first, Rating.Good, first.due);
    expect(second.state).toBe(State.Review);
    expect(second.due.getTime() - first.due.getTime()).toBeGreaterThanOrEqual(DAY);
    const lapse = review(second, Rating.Again, second.due);
    expect(lapse.due.getTime() - second.due.getTime()).toBeLessThanOrEqual(3_600_000);
    expect(lapse.lapses).toBe(1);
  });

  it('the same answers at the same times always give the same dates (no fuzz)', () => {
    const run = () => review(review(newCard(NOW), Rating.Good, NOW), Rating.Good, new Date(NOW.getTime() + DAY)).due.getTime();
    expect(run()).toBe(run());
  });

  it('a card survives a trip through JSON storage', () => {
    const card = review(review(newCard(NOW), Rating.Good, NOW), Rating.Hard, new Date(NOW.getTime() + 600_000));
    const back = fromStored(JSON.parse(JSON.stringify(toStored(card))));
    expect(back).toEqual(card);
    expect(back.due).toBeInstanceOf(Date);
  });
});

describe('a new miss of an item already in the schedule', () => {
  it('leaves a new card new and due', () => {
    const card = newCard(NOW);
    const later = new Date(NOW.getTime() + DAY);
    const refreshed = refreshAfterMiss(card, later);
    expect(refreshed.state).toBe(State.New);
    expect(refreshed.due.getTime()).toBeLessThanOrEqual(later.getTime());
  });

  it('pulls a card that had moved out back in, as a lapse', () => {
    const graduated = review(review(newCard(NOW), Rating.Good, NOW), Rating.Good, new Date(NOW.getTime() + 600_000));
    const missedAt = new Date(NOW.getTime() + DAY);
    expect(graduated.due.getTime()).toBeGreaterThan(missedAt.getTime());
    const refreshed = refreshAfterMiss(graduated, missedAt);
    expect(refreshed.due.getTime()).toBeLessThan(graduated.due.getTime());
    expect(refreshed.lapses).toBe(1);
  });
});

describe('rating map', () => {
  it('wrong → Again, right after a hint → Hard, right first try → Good; never Easy', () => {
    expect(ratingFor({ correct: false, hinted: false })).toBe(Rating.Again);
    expect(ratingFor({ correct: false, hinted: true })).toBe(Rating.Again);
    expect(ratingFor({ correct: true, hinted: true })).toBe(Rating.Hard);
    expect(ratingFor({ correct: true, hinted: false })).toBe(Rating.Good);
  });
});
