import { describe, expect, it } from 'vitest';
import { hasNul } from '../../src/lib/text/nul';

// PostgreSQL text and jsonb cannot hold U+0000 (PostgreSQL manual, "Character Types" and "JSON Types":
// jsonb rejects \u0000), so input with it is refused before it reaches a query.
describe('hasNul', () => {
  it('finds a NUL anywhere in nested strings and keys', () => {
    expect(hasNul('a\u0000b')).toBe(true);
    expect(hasNul(['ok', { deep: ['x', 'y\u0000'] }])).toBe(true);
    expect(hasNul({ ['k\u0000']: 1 })).toBe(true);
    expect(hasNul(JSON.parse('{"name": "a\\u0000b"}'))).toBe(true);
  });

  it('passes text without one, other control characters and non-strings included', () => {
    expect(hasNul('tab\there, new\nline, \u0001, ☃')).toBe(false);
    expect(hasNul({ n: 0, b: false, nothing: null, list: [1, 2, 'three'] })).toBe(false);
    // A backslash followed by u0000 is six ordinary characters.
    expect(hasNul(JSON.parse('{"text": "\\\\u0000"}'))).toBe(false);
    expect(hasNul(undefined)).toBe(false);
  });
});
