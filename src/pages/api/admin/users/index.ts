import type { APIRoute } from 'astro';
import { requireRole } from '../../../../lib/server/guard';
import { listUsers } from '../../../../lib/server/people';

export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals, 'admin');
  if (!gate.ok) return gate.response;
  return Response.json(await listUsers());
};
