import type { APIRoute } from 'astro';
import { uploadFieldsSchema } from '../../../lib/schemas/uploads';
import { BENCH_PHOTO_RULE, checkUpload, cleanFileName, formatBytes, MAX_BENCH_PHOTOS_PER_PROCEDURE } from '../../../lib/uploads/check';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, validationError } from '../../../lib/server/http';
import { readMultipartWithin } from '../../../lib/server/multipart';
import { findVersion } from '../../../lib/server/procedure-store';
import { countBenchPhotos, detectType, saveBenchPhoto, uploadJson } from '../../../lib/server/uploads';

// Room for the form's boundaries and text fields around a file of the largest accepted size.
const FORM_OVERHEAD = 64 * 1024;

/** A learner uploads a photo of their finished assembly (multipart: file, purpose, procedure). */
export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;

  const rule = BENCH_PHOTO_RULE;
  const tooLarge = `The file is too large: at most ${formatBytes(rule.maxBytes)}`;
  const read = await readMultipartWithin(request, rule.maxBytes + FORM_OVERHEAD, tooLarge);
  if (!read.ok) return read.response;
  const { form } = read;

  const parsed = uploadFieldsSchema.safeParse({ purpose: form.get('purpose') ?? undefined, procedure: form.get('procedure') ?? undefined });
  if (!parsed.success) return validationError(parsed.error);
  const file = form.get('file');
  if (!(file instanceof File)) return jsonError(400, 'Choose a file to upload', { file: ['Choose a file to upload'] });

  const procedure = await findVersion(db, parsed.data.procedure);
  if (!procedure) return jsonError(400, `No procedure "${parsed.data.procedure}"`, { procedure: ['No such procedure'] });

  if ((await countBenchPhotos(gate.user.id, procedure.procedureId)) >= MAX_BENCH_PHOTOS_PER_PROCEDURE) {
    const message = `You already keep ${MAX_BENCH_PHOTOS_PER_PROCEDURE} photos of this procedure; delete one that is not on a sign-off first`;
    return jsonError(409, message, { file: [message] });
  }

  const bytes = new Uint8Array(await file.arrayBuffer());
  const checked = checkUpload({ detected: await detectType(bytes), name: file.name, size: bytes.byteLength }, rule);
  if (!checked.ok) {
    return jsonError(checked.reason === 'too-large' ? 413 : 400, checked.message, { file: [checked.message] });
  }

  const saved = await saveBenchPhoto(
    gate.user.id,
    { id: procedure.procedureId, slug: procedure.slug },
    bytes,
    checked.contentType,
    cleanFileName(file.name),
  );
  return Response.json(uploadJson(saved), { status: 201 });
};
