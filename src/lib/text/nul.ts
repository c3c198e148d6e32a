// PostgreSQL text cannot hold the NUL character (U+0000): a string carrying one makes the query fail. Input
// is checked for it where it comes in, so it is refused in words instead of failing deep in a query.

export const NUL_MESSAGE = 'Text may not contain the NUL character (\\u0000)';

/** True when any string in the value (nested in arrays and objects, keys included) holds a NUL. */
export function hasNul(value: unknown): boolean {
  if (typeof value === 'string') return value.includes('\u0000');
  if (Array.isArray(value)) return value.some(hasNul);
  if (value && typeof value === 'object') return Object.entries(value).some(([key, v]) => key.includes('\u0000') || hasNul(v));
  return false;
}
