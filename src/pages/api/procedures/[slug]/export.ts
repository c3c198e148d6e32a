import type { APIRoute } from 'astro';
import { exchangeFileName, toExchangeFile } from '../../../../lib/editor/exchange';
import { db } from '../../../../lib/server/db';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError, versionParam } from '../../../../lib/server/http';
import { findVersion } from '../../../../lib/server/procedure-store';

/** The whole procedure, answer key included, as a downloadable file of our exchange format (instructors and admins). */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const version = versionParam(url);
  if (version === null) return jsonError(400, 'version must be a whole number from 1', { version: ['Not a version number'] });
  const stored = await findVersion(db, params.slug ?? '', version);
  if (!stored) return jsonError(404, 'No such procedure');
  const file = toExchangeFile(stored.document, new URL('/api/procedures/schema.json', url).href);
  return new Response(`${JSON.stringify(file, null, 2)}\n`, {
    status: 200,
    headers: {
      'content-type': 'application/json; charset=utf-8',
      'content-disposition': `attachment; filename="${exchangeFileName(stored.document)}"`,
    },
  });
};
