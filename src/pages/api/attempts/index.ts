import type { APIRoute } from 'astro';
import { answersHidden } from '../../../lib/drills/answers';
import { attemptRequestSchema } from '../../../lib/schemas/attempts';
import { attemptJson } from '../../../lib/server/attempt-row';
import { recordAttempt } from '../../../lib/server/attempts';
import { progressJson } from '../../../lib/server/drill-json';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../lib/server/http';

/** Scores one stage on the server and keeps it; a repeated clientId returns the stored attempt. */
export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = attemptRequestSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await recordAttempt(gate.user, parsed.data);
  switch (result.kind) {
    case 'unknown-procedure':
      return jsonError(404, `No procedure "${parsed.data.procedure}"${parsed.data.version ? ` version ${parsed.data.version}` : ''}`);
    case 'invalid':
      return Response.json({ error: result.issues[0]?.message ?? 'The answer is not valid', issues: result.issues }, { status: 400 });
    case 'client-id-reused':
      return jsonError(409, 'This clientId was already used for a different attempt');
    case 'drill-not-found':
      return jsonError(404, 'No such drill among yours', { drillId: ['This drill is not assigned to you'] });
    case 'drill-refused': {
      const { refusal } = result;
      return refusal.status === 400 ? jsonError(400, refusal.error, { [refusal.path]: [refusal.error] }) : jsonError(409, refusal.error);
    }
    case 'created':
    case 'replayed': {
      const { drill } = result;
      const hidden = drill !== null && answersHidden(drill, new Date());
      const json = attemptJson(result.attempt, { answersHidden: hidden });
      // On a drill the learner also gets their standing after this attempt (attempts left per stage).
      const answer = drill ? { ...json, drill: { id: drill.id, ...progressJson(drill.progress) } } : json;
      return Response.json(answer, { status: result.kind === 'created' ? 201 : 200 });
    }
  }
};
