import type { APIRoute } from 'astro';
import { signOffListQuerySchema, signOffRequestSchema } from '../../../../lib/schemas/sign-offs';
import { classTaughtBy } from '../../../../lib/server/class-access';
import { requireRole } from '../../../../lib/server/guard';
import { procedureFilter } from '../../../../lib/server/procedure-filter';
import { jsonError, readJson, validationError } from '../../../../lib/server/http';
import { createSignOff, latestSignOffsForClass, listClassSignOffs, signOffJson } from '../../../../lib/server/sign-offs';

/** An instructor of the class (or an admin) records a learner's bench sign-off. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const taught = await classTaughtBy(gate.user, params.id);
  if (!taught.ok) return jsonError(taught.status, taught.error);
  const body = await readJson(request, 16 * 1024);
  if (!body.ok) return body.response;
  const parsed = signOffRequestSchema(new Date()).safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await createSignOff(taught.cls.id, gate.user.id, parsed.data);
  if (!result.ok) return jsonError(400, result.error, result.fields);
  return Response.json(signOffJson(result.signOff), { status: 201 });
};

/** The class's sign-offs with their photos; ?learner=id and ?procedure=slug narrow the list, ?latest=true keeps the latest per pair. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const taught = await classTaughtBy(gate.user, params.id);
  if (!taught.ok) return jsonError(taught.status, taught.error);
  const parsed = signOffListQuerySchema.safeParse({
    learner: url.searchParams.get('learner') ?? undefined,
    procedure: url.searchParams.get('procedure') ?? undefined,
    latest: url.searchParams.get('latest') ?? undefined,
  });
  if (!parsed.success) return validationError(parsed.error);
  const procedure = await procedureFilter(parsed.data.procedure);
  if (!procedure.ok) return procedure.response;
  const { procedureId } = procedure;
  const filter = { learnerId: parsed.data.learner, procedureId };
  const list = parsed.data.latest === 'true' ? await latestSignOffsForClass(taught.cls.id, filter) : await listClassSignOffs(taught.cls.id, filter);
  return Response.json(list.map(signOffJson));
};
