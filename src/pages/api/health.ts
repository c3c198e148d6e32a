import type { APIRoute } from 'astro';
import { databaseIsUp } from '../../lib/server/db';

export const GET: APIRoute = async () => {
  const up = await databaseIsUp();
  return Response.json({ ok: up, db: up ? 'up' : 'down' }, { status: up ? 200 : 503 });
};
