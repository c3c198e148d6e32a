import type { APIRoute } from 'astro';
import { uploadFieldsSchema, type UploadPurpose } from '../../../lib/schemas/uploads';
import type { SessionUser } from '../../../lib/roles';
import { cleanFileName, formatBytes } from '../../../lib/uploads/check';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, validationError } from '../../../lib/server/http';
import { readMultipartWithin } from '../../../lib/server/multipart';
import { canEditProcedure, findProcedure } from '../../../lib/server/procedure-drafts';
import { findVersion } from '../../../lib/server/procedure-store';
import { countUploads, referenceFileJson, saveUpload, UPLOAD_KINDS, uploadJson } from '../../../lib/server/uploads';

// Room for the form's boundaries and text fields around a file of the largest accepted size.
const FORM_OVERHEAD = 64 * 1024;
const MAX_FILE_BYTES = Math.max(...Object.values(UPLOAD_KINDS).map((k) => k.rule.maxBytes));

type Target = { ok: true; procedure: { id: string; slug: string } } | { ok: false; response: Response };
const noSuchProcedure = (slug: string) => jsonError(400, `No procedure "${slug}"`, { procedure: ['No such procedure'] });

/** Who may upload what: learners photograph their own bench work; a procedure's editors attach its reference files. */
async function targetFor(user: SessionUser, purpose: UploadPurpose, slug: string): Promise<Target> {
  if (purpose === 'bench-photo') {
    if (user.role !== 'learner') return { ok: false, response: jsonError(403, 'Only learners upload bench photos') };
    const version = await findVersion(db, slug);
    return version ? { ok: true, procedure: { id: version.procedureId, slug: version.slug } } : { ok: false, response: noSuchProcedure(slug) };
  }
  const procedure = await findProcedure(slug);
  if (!procedure) return { ok: false, response: noSuchProcedure(slug) };
  if (!canEditProcedure(user, procedure.createdBy)) {
    return { ok: false, response: jsonError(403, 'Only the instructor who created this procedure, or an admin, can attach files to it') };
  }
  return { ok: true, procedure: { id: procedure.id, slug: procedure.slug } };
}

/**
 * Multipart: file, purpose, procedure (and a caption for a reference file). A learner's bench photo of their finished assembly, or a reference
 * file (photo or PDF) attached to a procedure by someone who may edit it. Both go through the same checks.
 */
export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;

  const tooLarge = `The file is too large: at most ${formatBytes(MAX_FILE_BYTES)}`;
  const read = await readMultipartWithin(request, MAX_FILE_BYTES + FORM_OVERHEAD, tooLarge);
  if (!read.ok) return read.response;
  const { form } = read;

  const parsed = uploadFieldsSchema.safeParse({
    purpose: form.get('purpose') ?? undefined,
    procedure: form.get('procedure') ?? undefined,
    caption: form.get('caption') ?? undefined,
  });
  if (!parsed.success) return validationError(parsed.error);
  const { purpose } = parsed.data;
  const file = form.get('file');
  if (!(file instanceof File)) return jsonError(400, 'Choose a file to upload', { file: ['Choose a file to upload'] });

  const target = await targetFor(gate.user, purpose, parsed.data.procedure);
  if (!target.ok) return target.response;

  // Checked again when the row is written; this spares storing a file that would be refused.
  const kind = UPLOAD_KINDS[purpose];
  if ((await countUploads(purpose, target.procedure.id, gate.user.id)) >= kind.max) return jsonError(409, kind.full, { file: [kind.full] });

  const saved = await saveUpload({
    purpose,
    ownerId: gate.user.id,
    procedure: target.procedure,
    bytes: new Uint8Array(await file.arrayBuffer()),
    originalName: cleanFileName(file.name, purpose === 'bench-photo' ? 'photo' : 'file'),
    caption: parsed.data.caption,
  });
  if (!saved.ok) {
    const status = saved.reason === 'too-large' ? 413 : saved.reason === 'full' ? 409 : 400;
    return jsonError(status, saved.message, { file: [saved.message] });
  }
  return Response.json(purpose === 'bench-photo' ? uploadJson(saved.upload) : referenceFileJson(saved.upload), { status: 201 });
};
