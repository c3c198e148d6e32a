import { describe, expect, it } from 'vitest';
import { drillRefusal, type DrillForAttempt } from '~/lib/drills/attempt-rules';

const now = new Date('2030-04-05T12:00:00Z');
const drill: DrillForAttempt = { slug: 'wren-160-sump', version: 2, stages: ['order', 'wrench'], attemptLimit: 3, closedAt: null };
const asked = { procedure: 'wren-160-sump', stage: 'order' as const };

describe('drillRefusal', () => {
  it('lets an attempt through on an open drill with attempts left', () => {
    expect(drillRefusal(drill, asked, 2, now)).toBeNull();
    expect(drillRefusal(drill, { ...asked, version: 2 }, 0, now)).toBeNull();
    expect(drillRefusal({ ...drill, attemptLimit: null }, asked, 99, now)).toBeNull();
  });

  it('refuses a closed drill with 409', () => {
    expect(drillRefusal({ ...drill, closedAt: new Date('2030-04-05T11:00:00Z') }, asked, 0, now)).toMatchObject({ status: 409, error: expect.stringMatching(/closed/) });
  });

  it('refuses another procedure, another version or a stage the drill does not ask for with 400 on that field', () => {
    expect(drillRefusal(drill, { ...asked, procedure: 'wren-160-head' }, 0, now)).toMatchObject({ status: 400, path: 'procedure' });
    expect(drillRefusal(drill, { ...asked, version: 1 }, 0, now)).toMatchObject({ status: 400, path: 'version', error: expect.stringMatching(/pinned to version 2/) });
    expect(drillRefusal(drill, { ...asked, stage: 'pins' }, 0, now)).toMatchObject({
      status: 400,
      path: 'stage',
      error: 'The Pins stage is not part of this drill (it asks for: Order, Wrench)',
    });
  });

  it('counts the limit per stage: the fourth attempt at a 3-attempt stage is refused', () => {
    expect(drillRefusal(drill, asked, 3, now)).toEqual({ status: 409, error: 'You have used all 3 attempts on the Order stage of this drill' });
  });
});
