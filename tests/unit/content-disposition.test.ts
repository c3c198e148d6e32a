import { describe, expect, it } from 'vitest';
import { inlineDisposition } from '../../src/lib/uploads/disposition';

describe('Content-Disposition for a stored file', () => {
  it('gives a plain ASCII name as a quoted filename (RFC 6266 §4.1)', () => {
    expect(inlineDisposition('wren-160-sump-spec-card.pdf')).toBe('inline; filename="wren-160-sump-spec-card.pdf"');
    expect(inlineDisposition('my sump (final).png')).toBe('inline; filename="my sump (final).png"');
  });

  it('adds filename* in UTF-8 for other characters, with an ASCII fallback (RFC 6266 §4.3, RFC 8187 §3.2)', () => {
    // RFC 8187 §3.2.2 example: the euro sign is UTF-8 E2 82 AC, percent-encoded as %E2%82%AC.
    expect(inlineDisposition('€ rates.pdf')).toBe(`inline; filename="_ rates.pdf"; filename*=UTF-8''%E2%82%AC%20rates.pdf`);
    // "ı" (U+0131) is UTF-8 C4 B1 (Unicode Standard, UTF-8 encoding form).
    expect(inlineDisposition('Aydın.jpg')).toBe(`inline; filename="Ayd_n.jpg"; filename*=UTF-8''Ayd%C4%B1n.jpg`);
  });

  it('never lets a quote, backslash or line break escape the header value', () => {
    const header = inlineDisposition('a"b\\c\r\nSet-Cookie: x=1.pdf');
    expect(header).not.toMatch(/[\r\n]/);
    expect(header.startsWith('inline; filename="a_b_c__Set-Cookie: x=1.pdf";')).toBe(true);
    // ' ( ) * are outside RFC 8187's attr-char, so they are percent-encoded in filename*.
    expect(inlineDisposition("it's (1)*.pdf\u00e9")).toContain(`filename*=UTF-8''it%27s%20%281%29%2A.pdf%C3%A9`);
  });

  it('falls back to "file" when nothing printable is left', () => {
    expect(inlineDisposition('日本')).toBe(`inline; filename="__"; filename*=UTF-8''%E6%97%A5%E6%9C%AC`);
    expect(inlineDisposition('')).toBe('inline; filename="file"');
  });
});
