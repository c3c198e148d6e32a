import type { APIRoute } from 'astro';
import { toPublicProcedure } from '../../../lib/procedure/public-view';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, versionParam } from '../../../lib/server/http';
import { findVersion } from '../../../lib/server/procedure-store';

/**
 * What the trainer needs to draw and run a procedure, without the answer key.
 * ?version=N serves an older version (attempts keep scoring against the one they were made on).
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const version = versionParam(url);
  if (version === null) {
    return jsonError(400, 'version must be a whole number from 1', { version: ['Not a version number'] });
  }
  const stored = await findVersion(db, params.slug ?? '', version);
  if (!stored) return jsonError(404, 'No such procedure');
  // Seeded per learner: the same learner sees the same shuffle after a reload.
  return Response.json(toPublicProcedure(stored.document, `${gate.user.id}:${stored.slug}:${stored.version}`));
};
