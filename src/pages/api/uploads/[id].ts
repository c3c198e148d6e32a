import type { APIRoute } from 'astro';
import { z } from 'zod';
import { captionUpdateSchema } from '../../../lib/schemas/uploads';
import { inlineDisposition } from '../../../lib/uploads/disposition';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { canEditProcedure } from '../../../lib/server/procedure-drafts';
import { deleteUpload, readUpload, referenceFileJson, setCaption, uploadForViewer, type StoredUpload } from '../../../lib/server/uploads';
import type { SessionUser } from '../../../lib/roles';

const uuid = z.string().uuid();

type Found = { ok: true; user: SessionUser; upload: StoredUpload } | { ok: false; response: Response };

/** Signed in, a well-formed id, and a file this person may see; anything else answers as no such file. */
async function visibleUpload(locals: App.Locals, rawId: string | undefined): Promise<Found> {
  const gate = requireRole(locals);
  if (!gate.ok) return gate;
  const id = uuid.safeParse(rawId);
  const upload = id.success ? await uploadForViewer(gate.user, id.data) : null;
  return upload ? { ok: true, user: gate.user, upload } : { ok: false, response: jsonError(404, 'No such file') };
}

/**
 * The file's bytes. A procedure's reference file: anyone signed in. A bench photo: its owner, instructors
 * of a class the owner is a learner in, and admins; anyone else gets 404. Served as the type found in its
 * bytes, never sniffed again by the browser, under the name it was uploaded with.
 */
export const GET: APIRoute = async ({ locals, params }) => {
  const found = await visibleUpload(locals, params.id);
  if (!found.ok) return found.response;
  const { upload } = found;
  const object = await readUpload(upload.storageKey);
  if (!object) return jsonError(404, 'The file is no longer stored');
  // The S3 client hands back a plain ArrayBuffer-backed array; its type only allows for shared memory.
  return new Response(object.body as Uint8Array<ArrayBuffer>, {
    status: 200,
    headers: {
      'content-type': upload.contentType,
      'content-length': String(object.body.byteLength),
      'content-disposition': inlineDisposition(upload.originalName),
      'x-content-type-options': 'nosniff',
      // Opened on its own, the file runs nothing, whatever it might contain.
      'content-security-policy': 'sandbox',
      // Per person and never changed under this id: the browser may keep it a while, shared caches never.
      'cache-control': 'private, max-age=3600',
    },
  });
};

/**
 * A bench photo: its owner deletes it while no sign-off uses it (409 after); others who may see it get 403.
 * A reference file: anyone who may edit its procedure (its creator, admins), whoever uploaded it; others 403.
 */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const found = await visibleUpload(locals, params.id);
  if (!found.ok) return found.response;
  const { user, upload } = found;
  let result;
  if (upload.purpose === 'procedure-reference') {
    if (!canEditProcedure(user, upload.procedureCreatedBy)) {
      return jsonError(403, 'Only the instructor who created this procedure, or an admin, can remove its files');
    }
    result = await deleteUpload(upload.id);
  } else {
    if (upload.ownerId !== user.id) return jsonError(403, 'Only the learner who uploaded a photo can delete it');
    result = await deleteUpload(upload.id, user.id);
  }
  if (result === 'not-found') return jsonError(404, 'No such file');
  if (result === 'attached') return jsonError(409, 'This photo is part of a sign-off and stays with it');
  return new Response(null, { status: 204 });
};

/** A reference file's caption, set or cleared ({caption: null} or blank) by anyone who may edit its procedure. */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const found = await visibleUpload(locals, params.id);
  if (!found.ok) return found.response;
  const { user, upload } = found;
  if (upload.purpose !== 'procedure-reference') return jsonError(400, 'Only a reference file takes a caption', { caption: ['Only a reference file takes a caption'] });
  if (!canEditProcedure(user, upload.procedureCreatedBy)) {
    return jsonError(403, 'Only the instructor who created this procedure, or an admin, can caption its files');
  }
  const body = await readJson(request, 4 * 1024);
  if (!body.ok) return body.response;
  const parsed = captionUpdateSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);
  const updated = await setCaption(upload.id, parsed.data.caption);
  return updated ? Response.json(referenceFileJson(updated)) : jsonError(404, 'No such file');
};
