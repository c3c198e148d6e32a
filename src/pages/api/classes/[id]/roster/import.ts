import type { APIRoute } from 'astro';
import { linkOrigin } from '../../../../../lib/server/app-url';
import { enrol } from '../../../../../lib/server/enrolment';
import { readRosterRequest } from '../../../../../lib/server/roster-request';
import { rowsRefused } from '../../../../../lib/server/roster-responses';

/**
 * POST {csv}: all or nothing. Any row with a problem → 400 with every row and nothing changed; otherwise
 * existing learner accounts join the class and the other addresses are invited (mail sent after the commit).
 */
export const POST: APIRoute = async ({ locals, params, request, url }) => {
  const read = await readRosterRequest(locals, params.id, request);
  if (!read.ok) return read.response;
  const result = await enrol(read.cls, read.user, read.parsed.rows, linkOrigin(url));
  if (!result.ok) return rowsRefused(result.plan, 'row', 'nothing was imported');
  return Response.json({ added: result.added, invited: result.invited });
};
