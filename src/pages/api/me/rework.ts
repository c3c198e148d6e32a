import type { APIRoute } from 'astro';
import { requireRole } from '../../../lib/server/guard';
import { reworkFor } from '../../../lib/server/rework';

/** The signed-in user's rework: items due now, each with its question, and items coming later. */
export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const now = new Date();
  const { due, upcoming } = await reworkFor(gate.user.id, now);
  return Response.json({ now, due, upcoming });
};
