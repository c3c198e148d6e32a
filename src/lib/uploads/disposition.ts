// The Content-Disposition header an upload is served with: shown in the browser (inline), saved under the
// name it was uploaded with. Pure, so the quoting rules can be unit-tested.

/**
 * `inline; filename="…"` with a plain-ASCII fallback name, plus `filename*=UTF-8''…` when the name has
 * characters outside printable ASCII (RFC 6266 §4.1 and §4.3, encoding per RFC 8187 §3.2).
 */
export function inlineDisposition(name: string): string {
  // Quotes and backslashes would need escaping inside a quoted-string; controls never belong in a header.
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_').trim() || 'file';
  if (!/[^\x20-\x7e]|["\\]/.test(name)) return `inline; filename="${ascii}"`;
  return `inline; filename="${ascii}"; filename*=UTF-8''${encodeExtValue(name)}`;
}

/**
 * Percent-encodes UTF-8 bytes except RFC 8187's attr-char set. encodeURIComponent also leaves
 * ' ( ) * alone, which are not attr-chars, so those are encoded on top.
 */
function encodeExtValue(value: string): string {
  // eslint-disable-next-line no-control-regex
  const clean = value.replace(/[\u0000-\u001f\u007f]/g, '');
  return encodeURIComponent(clean).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}
