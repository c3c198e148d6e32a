import type { APIRoute } from 'astro';
import { createClassSchema } from '../../../lib/schemas/classes';
import { allClasses, classesOf, createClass } from '../../../lib/server/classes';
import { requireRole } from '../../../lib/server/guard';
import { readJson, validationError } from '../../../lib/server/http';

export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals, 'instructor');
  if (!gate.ok) return gate.response;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = createClassSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const created = await createClass(parsed.data.name, gate.user.id);
  return Response.json(created, { status: 201 });
};

/** The caller's classes: taught, joined, or (for admins) all of them. */
export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const { user } = gate;
  const list =
    user.role === 'admin' ? await allClasses() : await classesOf(user.id, user.role === 'instructor' ? 'instructor' : 'learner');
  // Learners never see join codes: the code is the instructor's to hand out.
  return Response.json(user.role === 'learner' ? list.map(({ joinCode: _code, ...rest }) => rest) : list);
};
