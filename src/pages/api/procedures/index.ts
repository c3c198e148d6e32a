import type { APIRoute } from 'astro';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { listLatestVersions } from '../../../lib/server/procedure-store';

/** The catalogue: each procedure at its latest version. */
export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const versions = await listLatestVersions(db);
  return Response.json(
    versions.map(({ document: d }) => ({
      slug: d.slug,
      title: d.title,
      version: d.version,
      engine: d.engine,
      stages: d.stages,
      demoValues: d.demoValues,
    })),
  );
};
