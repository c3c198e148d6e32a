import type { APIRoute } from 'astro';
import { procedureJsonSchema } from '../../../lib/editor/json-schema';

// The JSON Schema of the procedure exchange file. Public: editors and tools fetch it from an exported
// file's "$schema" without a session, and it holds no data.
const body = `${JSON.stringify(procedureJsonSchema(), null, 2)}\n`;

export const GET: APIRoute = () =>
  new Response(body, { status: 200, headers: { 'content-type': 'application/schema+json; charset=utf-8' } });
