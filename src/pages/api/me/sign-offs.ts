import type { APIRoute } from 'astro';
import { requireRole } from '../../../lib/server/guard';
import { listLearnerSignOffs, signOffJson } from '../../../lib/server/sign-offs';

/** The signed-in learner's bench sign-offs from every class, newest bench date first. */
export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;
  const list = await listLearnerSignOffs(gate.user.id);
  return Response.json(list.map(signOffJson));
};
