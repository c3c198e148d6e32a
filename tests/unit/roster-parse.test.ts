import { describe, expect, it } from 'vitest';
import { parseRosterCsv } from '../../src/lib/roster/parse';
import { ROSTER_LIMITS } from '../../src/lib/roster/rows';

function rowsOf(csv: string) {
  const parsed = parseRosterCsv(csv);
  if (!parsed.ok) throw new Error(`expected rows, got: ${parsed.error}`);
  return parsed;
}

describe('roster CSV: columns and header', () => {
  it('reads name, e-mail rows without a header and lower-cases the addresses', () => {
    const parsed = rowsOf('Ava Lindqvist,Ava@Example.org\nBen Okafor,ben@example.org\n');
    expect(parsed.header).toBe(false);
    expect(parsed.rows).toEqual([
      { row: 1, name: 'Ava Lindqvist', email: 'ava@example.org', errors: [] },
      { row: 2, name: 'Ben Okafor', email: 'ben@example.org', errors: [] },
    ]);
  });

  it('recognises a header in any order and case, "email" or "e-mail", and numbers rows as a spreadsheet does', () => {
    for (const head of ['E-mail,Name', 'EMAIL,name', 'e-mail address, Full Name']) {
      const parsed = rowsOf(`${head}\nava@example.org,Ava Lindqvist\n`);
      expect(parsed.header).toBe(true);
      expect(parsed.rows).toEqual([{ row: 2, name: 'Ava Lindqvist', email: 'ava@example.org', errors: [] }]);
    }
  });

  it('ignores extra columns and joins first and last name columns', () => {
    // First name then last name, whatever order the file has the columns in.
    const parsed = rowsOf('Student ID,Last name,First name,Email\n17,Okafor,Ben,ben@example.org\n');
    expect(parsed.rows).toEqual([{ row: 2, name: 'Ben Okafor', email: 'ben@example.org', errors: [] }]);
    expect(rowsOf('First name,Last name,Email\nBen,Okafor,ben@example.org\n').rows[0]!.name).toBe('Ben Okafor');
  });

  it('takes e-mail, name order without a header when the first column holds the address', () => {
    expect(rowsOf('ava@example.org,Ava Lindqvist').rows[0]).toMatchObject({ name: 'Ava Lindqvist', email: 'ava@example.org' });
  });

  it('refuses a header without an e-mail or a name column, with words that say which', () => {
    expect(parseRosterCsv('Name,Phone\nAva,555\n')).toEqual({ ok: false, error: expect.stringContaining('no e-mail column') });
    expect(parseRosterCsv('Email,Phone\nava@example.org,555\n')).toEqual({ ok: false, error: expect.stringContaining('no name column') });
  });
});

describe('roster CSV: encoding and quoting', () => {
  it('drops a UTF-8 byte-order mark so the header is still recognised, and keeps accented names', () => {
    const parsed = rowsOf('\uFEFFname,email\nElif Aydın,elif@example.org\r\nJosé Núñez,jose@example.org\r\n');
    expect(parsed.header).toBe(true);
    expect(parsed.rows.map((r) => r.name)).toEqual(['Elif Aydın', 'José Núñez']);
  });

  it('keeps a quoted comma inside the name (RFC 4180 §2.6: fields with commas are enclosed in double quotes)', () => {
    const parsed = rowsOf('name,email\n"Okafor, Ben",ben@example.org\n"Say ""Finn"" Gallagher",finn@example.org\n');
    expect(parsed.rows.map((r) => r.name)).toEqual(['Okafor, Ben', 'Say "Finn" Gallagher']);
    expect(parsed.rows.every((r) => r.errors.length === 0)).toBe(true);
  });

  it('reads semicolon- and tab-separated files as spreadsheets in some locales save them', () => {
    expect(rowsOf('name;email\nAva;ava@example.org\nBen;ben@example.org\n').rows.map((r) => r.email)).toEqual(['ava@example.org', 'ben@example.org']);
    expect(rowsOf('name\temail\nAva\tava@example.org\n').rows[0]!.email).toBe('ava@example.org');
  });

  it('reports an unclosed quote on the row where it starts', () => {
    const parsed = rowsOf('name,email\nAva,ava@example.org\n"Ben,ben@example.org\n');
    expect(parsed.rows[0]!.errors).toEqual([]);
    expect(parsed.rows[1]!.row).toBe(3);
    expect(parsed.rows[1]!.errors).toContain('A quote (") is opened and never closed');
  });
});

describe('roster CSV: per-row problems with row numbers', () => {
  it('names every problem on its row: missing name, missing or bad e-mail, repeated address', () => {
    const parsed = rowsOf(
      ['name,email', 'Ava,ava@example.org', ',ben@example.org', 'Carmen,', 'Deshawn,deshawn(at)example.org', 'Ava again,AVA@example.org'].join('\n'),
    );
    expect(parsed.rows.map((r) => [r.row, r.errors])).toEqual([
      [2, []],
      [3, ['Name is missing']],
      [4, ['E-mail is missing']],
      [5, ['“deshawn(at)example.org” is not a valid e-mail address']],
      [6, ['Same e-mail as row 2']],
    ]);
  });

  it('skips blank lines but keeps counting them, so row numbers match the file', () => {
    const parsed = rowsOf('name,email\n\nAva,ava@example.org\n   ,  \nBen,ben@example.org\n');
    expect(parsed.rows.map((r) => r.row)).toEqual([3, 5]);
  });

  it('a one-column file reports the missing e-mail on every row', () => {
    const parsed = rowsOf('Ava\nBen\n');
    expect(parsed.rows.map((r) => r.errors)).toEqual([['E-mail is missing'], ['E-mail is missing']]);
  });

  it('a name over 80 characters is refused like at sign-up', () => {
    const parsed = rowsOf(`${'x'.repeat(81)},long@example.org`);
    expect(parsed.rows[0]!.errors).toEqual(['Name is at most 80 characters']);
  });
});

describe('roster CSV: whole-file limits', () => {
  it('an empty file or a header alone is refused', () => {
    expect(parseRosterCsv('')).toMatchObject({ ok: false });
    expect(parseRosterCsv('\n \n')).toMatchObject({ ok: false });
    expect(parseRosterCsv('name,email\n')).toEqual({ ok: false, error: 'The file has a header row and nobody under it.' });
  });

  it(`refuses more than ${ROSTER_LIMITS.maxRows} rows, and accepts exactly that many`, () => {
    const lines = (n: number) => Array.from({ length: n }, (_, i) => `Learner ${i},l${i}@example.org`).join('\n');
    expect(rowsOf(lines(ROSTER_LIMITS.maxRows)).rows).toHaveLength(ROSTER_LIMITS.maxRows);
    expect(parseRosterCsv(lines(ROSTER_LIMITS.maxRows + 1))).toEqual({ ok: false, error: 'The file has 501 rows; import at most 500 at a time.' });
  });

  it('refuses a file over 256 KB counted in UTF-8 bytes', () => {
    // "ı" is two bytes in UTF-8: 131,073 of them are 262,146 bytes, over 262,144.
    const big = 'ı'.repeat(131_073);
    expect(big.length).toBeLessThan(ROSTER_LIMITS.maxBytes);
    expect(parseRosterCsv(big)).toEqual({ ok: false, error: 'The file is too large: at most 256 KB' });
  });
});
