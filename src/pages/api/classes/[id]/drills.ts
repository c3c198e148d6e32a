import type { APIRoute } from 'astro';
import { APP_URL } from 'astro:env/server';
import { z } from 'zod';
import { createDrillSchema } from '../../../../lib/schemas/drills';
import { db } from '../../../../lib/server/db';
import { classDrillJson, drillJson, progressJson } from '../../../../lib/server/drill-json';
import { sendDrillNotices } from '../../../../lib/server/drill-notices';
import { classAccess } from '../../../../lib/server/class-access';
import { createDrill, drillsOfClass, drillsOfLearner, withClassCounts } from '../../../../lib/server/drills';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../../lib/server/http';
import { mailer } from '../../../../lib/server/mail';

const classId = (params: Record<string, string | undefined>) => z.string().uuid().safeParse(params.id);
const notYours = () => jsonError(404, 'No such class among yours');

/** The class's instructors (and admins) assign a drill; each learner of the class gets a notice. */
export const POST: APIRoute = async ({ locals, params, request, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const id = classId(params);
  if (!id.success || (await classAccess(id.data, gate.user)) !== 'manage') return notYours();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const now = new Date();
  const parsed = createDrillSchema(now).safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const created = await createDrill(id.data, gate.user.id, parsed.data);
  if (!created.ok) return jsonError(400, created.error, created.fields);
  // After the commit and off the request's path: a slow or failing mail relay never fails the drill.
  void sendDrillNotices(db, mailer, created.drill, APP_URL || url.origin).catch((err) =>
    console.error(`drill ${created.drill.id}: notices not sent: ${err instanceof Error ? err.message : String(err)}`),
  );
  return Response.json(classDrillJson(await withClassCounts(created.drill, now)), { status: 201 });
};

/**
 * The class's drills: with every learner's status counted for its instructors and admins, with the
 * learner's own standing for a learner in the class. Anyone else gets 404.
 */
export const GET: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const id = classId(params);
  const access = id.success ? await classAccess(id.data, gate.user) : null;
  if (!id.success || access === null) return notYours();
  const now = new Date();
  if (access === 'manage') {
    const list = await drillsOfClass(id.data, now);
    return Response.json(list.map(classDrillJson));
  }
  const list = await drillsOfLearner(gate.user.id, now, id.data);
  return Response.json(list.map((d) => ({ ...drillJson(d), progress: progressJson(d.progress) })));
};
