import Papa from 'papaparse';
import { checkEntries, ROSTER_LIMITS, type RawEntry, type RosterRow } from './rows';

export type RosterParse = { ok: true; header: boolean; rows: RosterRow[] } | { ok: false; error: string };

// Header labels are compared in lower case with spaces, dashes and underscores folded to one space.
const NAME_LABELS = new Set(['name', 'full name', 'learner', 'learner name', 'student', 'student name']);
const FIRST_NAME_LABELS = new Set(['first name', 'given name', 'first']);
const LAST_NAME_LABELS = new Set(['last name', 'family name', 'surname', 'last']);
const EMAIL_LABELS = new Set(['email', 'e mail', 'email address', 'e mail address', 'mail']);

const label = (cell: string) => cell.toLowerCase().replace(/[\s_-]+/g, ' ').trim();

interface Columns {
  name: number[];
  email: number;
}

type HeaderCheck = { header: false } | { header: true; columns: Columns } | { header: true; error: string };

/** A first row with no address in it and at least one known label is a header. */
function readHeader(cells: string[]): HeaderCheck {
  if (cells.some((c) => c.includes('@'))) return { header: false };
  const labels = cells.map(label);
  const find = (set: Set<string>) => labels.findIndex((l) => set.has(l));
  const name = find(NAME_LABELS);
  const first = find(FIRST_NAME_LABELS);
  const last = find(LAST_NAME_LABELS);
  const email = find(EMAIL_LABELS);
  if (name === -1 && first === -1 && last === -1 && email === -1) return { header: false };
  if (email === -1) return { header: true, error: 'The header row has no e-mail column: call it “email” or “e-mail”.' };
  const nameColumns = name !== -1 ? [name] : [first, last].filter((i) => i !== -1);
  if (nameColumns.length === 0) return { header: true, error: 'The header row has no name column: call it “name”.' };
  return { header: true, columns: { name: nameColumns, email } };
}

/** Without a header the columns are name then e-mail, unless the first row plainly has them the other way round. */
function guessColumns(cells: string[]): Columns {
  const swapped = (cells[0] ?? '').includes('@') && !(cells[1] ?? '').includes('@');
  return swapped ? { name: [1], email: 0 } : { name: [0], email: 1 };
}

function quoteProblem(code: string): string {
  return code === 'MissingQuotes' ? 'A quote (") is opened and never closed' : 'A quote (") is out of place';
}

function utf8Length(text: string): number {
  return new TextEncoder().encode(text).length;
}

/**
 * Reads a roster CSV (name and e-mail per row) into rows with their problems. Whole-file problems
 * (empty, too large, too many rows, a header without the needed columns) come back as one error.
 * Row numbers count every record of the file, blank ones and the header included, as a spreadsheet does.
 */
export function parseRosterCsv(text: string): RosterParse {
  if (utf8Length(text) > ROSTER_LIMITS.maxBytes) {
    return { ok: false, error: `The file is too large: at most ${ROSTER_LIMITS.maxBytes / 1024} KB` };
  }
  // Spreadsheet programs often start UTF-8 files with a byte-order mark.
  const source = text.replace(/^\uFEFF/, '');
  // Blank lines would spoil the delimiter guess (comma, or semicolon and tab as some locales save), so the
  // guess skips them; the real pass keeps them so row numbers match the file.
  const { delimiter } = Papa.parse<string[]>(source, { preview: 20, skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] }).meta;
  const parsed = Papa.parse<string[]>(source, { header: false, skipEmptyLines: false, delimiter });

  const problemsAt = new Map<number, string[]>();
  for (const err of parsed.errors) {
    const at = err.row ?? 0;
    const known = problemsAt.get(at) ?? [];
    // One broken quote can raise two codes; the row needs to hear about it once each way.
    if (!known.includes(quoteProblem(err.code))) problemsAt.set(at, [...known, quoteProblem(err.code)]);
  }

  const records = parsed.data
    .map((cells, index) => ({ cells: cells.map((c) => c.trim()), index }))
    .filter((r) => r.cells.some((c) => c !== ''));
  if (records.length === 0) return { ok: false, error: 'The file has no rows: put one person per row, name and e-mail.' };

  const head = readHeader(records[0]!.cells);
  if (head.header && 'error' in head) return { ok: false, error: head.error };
  const data = head.header ? records.slice(1) : records;
  if (data.length === 0) return { ok: false, error: 'The file has a header row and nobody under it.' };
  if (data.length > ROSTER_LIMITS.maxRows) {
    return { ok: false, error: `The file has ${data.length} rows; import at most ${ROSTER_LIMITS.maxRows} at a time.` };
  }
  const columns = head.header ? head.columns : guessColumns(data[0]!.cells);

  const entries: RawEntry[] = data.map(({ cells, index }) => ({
    row: index + 1,
    name: columns.name.map((i) => cells[i] ?? '').join(' '),
    email: cells[columns.email] ?? '',
    errors: problemsAt.get(index),
  }));
  return { ok: true, header: head.header, rows: checkEntries(entries, { requireName: true }) };
}
