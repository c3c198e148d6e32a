import type { APIRoute } from 'astro';
import { z } from 'zod';
import { reworkAnswerRequestSchema } from '../../../../lib/schemas/rework';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../../lib/server/http';
import { answerItem, reworkAnswerJson } from '../../../../lib/server/rework-answers';

/** Judges one answer to a rework question and moves the item's schedule; a repeated clientId replays. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const id = z.string().uuid().safeParse(params.id);
  if (!id.success) return jsonError(404, 'No such rework item');
  const body = await readJson(request, 16 * 1024);
  if (!body.ok) return body.response;
  const parsed = reworkAnswerRequestSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await answerItem(gate.user.id, id.data, parsed.data);
  switch (result.kind) {
    case 'not-found':
      return jsonError(404, 'No such rework item');
    case 'invalid':
      return jsonError(400, result.message, { 'answer.choice': [result.message] });
    case 'client-id-reused':
      return jsonError(409, 'This clientId was already used for a different answer');
    case 'created':
    case 'replayed':
      return Response.json(reworkAnswerJson(result.answer), { status: result.kind === 'created' ? 201 : 200 });
  }
};
