import { State, TypeConvert, createEmptyCard, fsrs, Rating, type Card, type Grade } from 'ts-fsrs';

// The spaced-review schedule of one rework item, over ts-fsrs (FSRS-6 default weights, version pinned in
// package.json because defaults change between majors). Pure and clock-free: every call takes `now`.

/**
 * Library defaults on purpose: learning steps of 1 and 10 minutes bring a missed step back in the same
 * session, then it graduates to days. No fuzz, so the same answers always give the same dates.
 */
const scheduler = fsrs({ enable_fuzz: false, enable_short_term: true });

/** The card as stored in rework_items.card (JSON: dates as ISO strings). */
export type StoredCard = Record<string, unknown>;

export { Rating, State };
export type { Card, Grade };

/** A card for a step just missed: new, due at once. */
export function newCard(now: Date): Card {
  return createEmptyCard(now);
}

/** One review with the given rating at `now`. */
export function review(card: Card, rating: Grade, now: Date): Card {
  return scheduler.next(card, now, rating).card;
}

/**
 * The learner missed the step again in the trainer. A card never reviewed stays new (and due); a card
 * already in the schedule lapses as if answered wrong, so it returns within minutes with lower stability.
 */
export function refreshAfterMiss(card: Card, now: Date): Card {
  if (card.state === State.New) return { ...card, due: card.due < now ? card.due : now };
  return review(card, Rating.Again, now);
}

export function toStored(card: Card): StoredCard {
  return JSON.parse(JSON.stringify(card)) as StoredCard;
}

/** Reads a stored card back; ts-fsrs turns the ISO strings into dates and checks the state. */
export function fromStored(stored: StoredCard): Card {
  return TypeConvert.card(stored as unknown as Card);
}
