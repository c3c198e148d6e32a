import type { APIRoute } from 'astro';
import { requireRole } from '../../lib/server/guard';

export const GET: APIRoute = ({ locals }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  return Response.json(gate.user);
};
