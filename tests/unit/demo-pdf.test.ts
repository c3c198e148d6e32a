import { describe, expect, it } from 'vitest';
import { demoSpecCard, encodePdf } from '../../scripts/demo-pdf';

// The PDF the demo seeds and the tests attach must be one a reader opens: its structure is checked against
// ISO 32000-1:2008 (the PDF 1.7 standard), section by section.

const text = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1');

describe('encodePdf', () => {
  const pdf = text(demoSpecCard());

  it('starts with the header and a binary comment (ISO 32000-1 §7.5.2)', () => {
    expect(pdf.startsWith('%PDF-1.4\n%')).toBe(true);
    // "at least four binary characters (byte values of 128 or greater)" on the comment line after the header.
    const comment = pdf.split('\n')[1]!.slice(1);
    expect([...comment].filter((c) => c.charCodeAt(0) >= 128).length).toBeGreaterThanOrEqual(4);
  });

  it('ends with startxref pointing at the xref keyword, then %%EOF (§7.5.5)', () => {
    expect(pdf.endsWith('%%EOF\n')).toBe(true);
    const startxref = Number(/startxref\n(\d+)\n%%EOF\n$/.exec(pdf)![1]);
    expect(pdf.slice(startxref, startxref + 5)).toBe('xref\n');
  });

  it('has a cross-reference table of 20-byte entries, each pointing at its object (§7.5.4)', () => {
    const startxref = Number(/startxref\n(\d+)/.exec(pdf)![1]);
    const [, first, count] = /^xref\n(\d+) (\d+)\n/.exec(pdf.slice(startxref))!;
    expect(Number(first)).toBe(0);
    const tableStart = startxref + `xref\n0 ${count}\n`.length;
    const entries = pdf.slice(tableStart, tableStart + 20 * Number(count));
    // Entry 0 is the head of the free list: "0000000000 65535 f" and a two-character end of line.
    expect(entries.slice(0, 20)).toBe('0000000000 65535 f \n');
    for (let n = 1; n < Number(count); n++) {
      const entry = entries.slice(20 * n, 20 * n + 20);
      expect(entry).toMatch(/^\d{10} 00000 n \n$/);
      const offset = Number(entry.slice(0, 10));
      expect(pdf.slice(offset, offset + `${n} 0 obj`.length)).toBe(`${n} 0 obj`);
    }
    expect(pdf).toContain(`trailer\n<< /Size ${count} /Root 1 0 R`);
  });

  it("gives each content stream its exact length, without the end of line before endstream (§7.3.8.1)", () => {
    const match = /<< \/Length (\d+) >>\nstream\n([\s\S]*?)\nendstream/.exec(pdf)!;
    expect(match[2]!.length).toBe(Number(match[1]));
  });

  it('escapes parentheses and backslashes in strings, and sets · as WinAnsi 0xB7 (§7.3.4.2, Annex D.2)', () => {
    const one = text(encodePdf([{ text: 'a (b) \\ 11 N·m' }], 'x'));
    expect(one).toContain('(a \\(b\\) \\\\ 11 N\\267m) Tj');
  });
});
