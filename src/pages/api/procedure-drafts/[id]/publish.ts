import type { APIRoute } from 'astro';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError } from '../../../../lib/server/http';
import { findOwnDraft, publishDraft } from '../../../../lib/server/procedure-drafts';
import { issuesResponse } from '../../../../lib/server/issues';

/**
 * Checks the draft in full (the procedure schema and every cross-reference rule) and publishes it as a new,
 * immutable version: 201 {slug, version} (200 with created false when it equals the latest version);
 * 400 {error, issues: [{path, message}]} with every problem.
 */
export const POST: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const found = await findOwnDraft(params.id ?? '', gate.user.id);
  if (!found) return jsonError(404, 'No such draft');

  const result = await publishDraft(found.row, gate.user);
  if (result.ok) {
    const { slug, version } = result.version;
    return Response.json({ slug, version, created: result.created }, { status: result.created ? 201 : 200 });
  }
  if (result.reason === 'invalid') return issuesResponse(result.issues);
  if (result.reason === 'forbidden') return jsonError(403, 'Only the instructor who created this procedure can publish new versions of it');
  return jsonError(404, 'The procedure this draft was based on no longer exists');
};
