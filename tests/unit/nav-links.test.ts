import { describe, expect, it } from 'vitest';
import { currentNavLink, navLinksFor } from '../../src/lib/roles';

describe('the top bar', () => {
  const instructor = navLinksFor('instructor');

  it('marks the most specific link the page is under', () => {
    expect(currentNavLink(instructor, '/teach/procedures/drafts/abc')).toBe('/teach/procedures');
    expect(currentNavLink(instructor, '/teach/classes/abc/results')).toBe('/teach');
    expect(currentNavLink(instructor, '/teach')).toBe('/teach');
  });

  it('marks nothing for a page outside every link, and never a mere prefix of a word', () => {
    expect(currentNavLink(instructor, '/sign-in')).toBeNull();
    expect(currentNavLink(navLinksFor('learner'), '/learning')).toBeNull();
    expect(currentNavLink(navLinksFor('learner'), '/learn/bench')).toBe('/learn');
  });

  it('gives instructors the procedure editor and practice, and everyone the wrench calculator', () => {
    expect(instructor.map((l) => l.href)).toEqual(['/teach', '/teach/procedures', '/train', '/tools/wrench']);
    for (const role of ['learner', 'instructor', 'admin'] as const) {
      expect(navLinksFor(role).some((l) => l.href === '/tools/wrench')).toBe(true);
    }
  });
});
