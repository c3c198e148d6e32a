import { db } from './db';
import { jsonError } from './http';
import { findVersion } from './procedure-store';

type Filter = { ok: true; procedureId: string | undefined } | { ok: false; response: Response };

/**
 * A list's optional ?procedure=slug filter, turned into the procedure's id: no slug, no filter; a slug that
 * names no procedure is a 400 on the field, so a typo never reads as an empty list.
 */
export async function procedureFilter(slug: string | undefined): Promise<Filter> {
  if (!slug) return { ok: true, procedureId: undefined };
  const version = await findVersion(db, slug);
  return version ? { ok: true, procedureId: version.procedureId } : { ok: false, response: jsonError(400, `No procedure "${slug}"`, { procedure: ['No such procedure'] }) };
}
