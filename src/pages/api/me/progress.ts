import type { APIRoute } from 'astro';
import { timeZoneSchema } from '../../../lib/schemas/rework';
import { requireRole } from '../../../lib/server/guard';
import { jsonError } from '../../../lib/server/http';
import { progressOf } from '../../../lib/server/progress';

/** The signed-in user's progress; ?tz= names their time zone for days and the streak (UTC by default). */
export const GET: APIRoute = async ({ locals, url }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const tz = timeZoneSchema.safeParse(url.searchParams.get('tz') ?? undefined);
  if (!tz.success) return jsonError(400, tz.error.issues[0]!.message, { tz: tz.error.issues.map((i) => i.message) });
  const progress = await progressOf(gate.user.id, tz.data);
  return Response.json({ learner: { id: gate.user.id, name: gate.user.name }, ...progress });
};
