import { parseRosterCsv } from '../roster/parse';
import type { RosterRow } from '../roster/rows';
import { rosterCsvSchema } from '../schemas/invitations';
import type { SessionUser } from '../roles';
import { classForStaff, type StaffClass } from './class-access';
import { jsonError, readJson, validationError } from './http';

// JSON escaping can double a CSV's size (quotes, line breaks); the CSV's own limit is checked after.
const BODY_LIMIT = 512 * 1024;

type RosterRequest =
  | { ok: true; user: SessionUser; cls: StaffClass; parsed: { header: boolean; rows: RosterRow[] } }
  | { ok: false; response: Response };

/** The checks preview and import share: who may, the body, the CSV's size, rows and header. */
export async function readRosterRequest(locals: App.Locals, classId: string | undefined, request: Request): Promise<RosterRequest> {
  const access = await classForStaff(locals, classId);
  if (!access.ok) return access;
  const body = await readJson(request, BODY_LIMIT);
  if (!body.ok) return body;
  const shape = rosterCsvSchema.safeParse(body.body);
  if (!shape.success) return { ok: false, response: validationError(shape.error) };
  const parsed = parseRosterCsv(shape.data.csv);
  if (!parsed.ok) return { ok: false, response: jsonError(400, parsed.error, { csv: [parsed.error] }) };
  return { ok: true, user: access.user, cls: access.cls, parsed };
}
