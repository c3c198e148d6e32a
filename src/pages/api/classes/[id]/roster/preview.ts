import type { APIRoute } from 'astro';
import { readRosterRequest } from '../../../../../lib/server/roster-request';
import { previewEnrolment } from '../../../../../lib/server/enrolment';

/** POST {csv}: what an import would do with each row, and every row's problems. Changes nothing. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const read = await readRosterRequest(locals, params.id, request);
  if (!read.ok) return read.response;
  const plan = await previewEnrolment(read.cls.id, read.user, read.parsed.rows);
  return Response.json({ ok: plan.ok, header: read.parsed.header, rows: plan.rows, counts: plan.counts });
};
