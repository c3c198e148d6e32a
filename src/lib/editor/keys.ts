// New keys for things the instructor adds. Step keys are shown to learners, so they must not give the
// order away ("step-1", "step-2"): they are random.

const LETTERS = 'abcdefghjkmnpqrstuvwxyz23456789';

/** 'step-k3fq' style key not in `taken`; `random` returns numbers in [0, 1). */
export function newStepKey(taken: readonly string[], random: () => number = Math.random): string {
  for (;;) {
    let tail = '';
    for (let i = 0; i < 4; i++) tail += LETTERS[Math.floor(random() * LETTERS.length)];
    const key = `step-${tail}`;
    if (!taken.includes(key)) return key;
  }
}
