import type { APIRoute } from 'astro';
import { resultsCsv, resultsFileName } from '../../../../lib/results/results-csv';
import { classResults, resultsAccess, resultsAccessError } from '../../../../lib/server/class-results';
import { requireRole } from '../../../../lib/server/guard';

/** The grade export: the class results as CSV (columns in docs/api.md), for the class's instructors and admins. */
export const GET: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const access = await resultsAccess(gate.user, params.id);
  if (!access.ok) return resultsAccessError(access.status);

  const now = new Date();
  const results = await classResults(access.classId, 'halves', now);
  if (!results) return resultsAccessError(404);
  // The byte-order mark tells spreadsheet programs the file is UTF-8, so names like "Aydın" open intact.
  return new Response(`\uFEFF${resultsCsv(results)}`, {
    status: 200,
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="${resultsFileName(access.className, now)}"`,
    },
  });
};
