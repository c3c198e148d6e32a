import type { APIRoute } from 'astro';
import { drillJson, progressJson } from '../../../lib/server/drill-json';
import { drillsOfLearner } from '../../../lib/server/drills';
import { requireRole } from '../../../lib/server/guard';

/** The learner's drills in every class they are in, open ones first, each with their own standing. */
export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;
  const list = await drillsOfLearner(gate.user.id, new Date());
  return Response.json(list.map((d) => ({ ...drillJson(d), progress: progressJson(d.progress) })));
};
