import type { APIRoute } from 'astro';
import { resultsQuery } from '../../../../lib/schemas/results';
import { classResults, resultsAccess, resultsAccessError } from '../../../../lib/server/class-results';
import { requireRole } from '../../../../lib/server/guard';
import { validationError } from '../../../../lib/server/http';

/** The class results with the step analysis, for the class's instructors and admins. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const access = await resultsAccess(gate.user, params.id);
  if (!access.ok) return resultsAccessError(access.status);
  const query = resultsQuery(url);
  if (!query.success) return validationError(query.error);

  const results = await classResults(access.classId, query.data.groups);
  if (!results) return resultsAccessError(404);
  return Response.json(results);
};
