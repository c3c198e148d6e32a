import { emailSchema, personNameSchema } from '../schemas/auth';

/** How much one roster import or one batch of invitations may hold. */
export const ROSTER_LIMITS = { maxBytes: 256 * 1024, maxRows: 500 } as const;

/** One person to enrol, with every problem found in it. */
export interface RosterRow {
  /** The row as a spreadsheet numbers it (a header row is row 1), or the entry's position from 1. */
  row: number;
  name: string;
  /** Lower-cased when it is a valid address; as typed otherwise, so the preview shows what was wrong. */
  email: string;
  errors: string[];
}

export interface RawEntry {
  row: number;
  name: string;
  email: string;
  /** Problems found before the fields were read (a broken quote in the CSV). */
  errors?: string[];
}

/** Long junk in a cell is shortened in messages so the preview stays readable. */
function quoted(text: string): string {
  return `“${text.length > 60 ? `${text.slice(0, 57)}…` : text}”`;
}

/**
 * Checks each entry on its own and against the ones before it: name, address format, repeated address.
 * A repeat is reported on the later row, naming the first, so the instructor knows which line to delete.
 */
export function checkEntries(entries: RawEntry[], options: { requireName: boolean }): RosterRow[] {
  const firstRowOf = new Map<string, number>();
  return entries.map((entry) => {
    const errors = [...(entry.errors ?? [])];
    const name = entry.name.replace(/\s+/g, ' ').trim();
    const typed = entry.email.trim();
    let email = typed;

    if (!name) {
      if (options.requireName) errors.push('Name is missing');
    } else {
      const checked = personNameSchema.safeParse(name);
      if (!checked.success) errors.push(checked.error.issues[0]!.message);
    }

    if (!typed) {
      errors.push('E-mail is missing');
    } else {
      const checked = emailSchema.safeParse(typed);
      if (!checked.success) {
        errors.push(`${quoted(typed)} is not a valid e-mail address`);
      } else {
        email = checked.data;
        const first = firstRowOf.get(email);
        if (first !== undefined) errors.push(`Same e-mail as row ${first}`);
        else firstRowOf.set(email, entry.row);
      }
    }
    return { row: entry.row, name, email, errors };
  });
}
