import type { APIRoute } from 'astro';
import { invitationsSchema } from '../../../../lib/schemas/invitations';
import { checkEntries } from '../../../../lib/roster/rows';
import { linkOrigin } from '../../../../lib/server/app-url';
import { classForStaff } from '../../../../lib/server/class-access';
import { enrol, listInvitations } from '../../../../lib/server/enrolment';
import { readJson, validationError } from '../../../../lib/server/http';
import { rowsRefused } from '../../../../lib/server/roster-responses';

/** Who was invited to the class and when, newest first. */
export const GET: APIRoute = async ({ locals, params }) => {
  const access = await classForStaff(locals, params.id);
  if (!access.ok) return access.response;
  return Response.json(await listInvitations(access.cls.id));
};

/**
 * POST {invites: [{email, name?}]}: addresses without an account get a sign-up link that joins the class;
 * existing learner accounts are put in the class and told so. All or nothing, like the roster import.
 */
export const POST: APIRoute = async ({ locals, params, request, url }) => {
  const access = await classForStaff(locals, params.id);
  if (!access.ok) return access.response;
  const body = await readJson(request, 512 * 1024);
  if (!body.ok) return body.response;
  const parsed = invitationsSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const rows = checkEntries(
    parsed.data.invites.map((invite, i) => ({ row: i + 1, name: invite.name ?? '', email: invite.email })),
    { requireName: false },
  );
  const result = await enrol(access.cls, access.user, rows, linkOrigin(url));
  if (!result.ok) return rowsRefused(result.plan, 'address', 'nothing was sent');
  return Response.json({ added: result.added, invited: result.invited }, { status: 201 });
};
