import type { APIRoute } from 'astro';
import { z } from 'zod';
import { editDocument } from '../../../lib/editor/drafts';
import { readExchangeFile } from '../../../lib/editor/exchange';
import { requireRole } from '../../../lib/server/guard';
import { readJson, validationError } from '../../../lib/server/http';
import { createDraft, draftView } from '../../../lib/server/procedure-drafts';
import { issuesResponse } from '../../../lib/server/issues';

const MAX_IMPORT_BYTES = 512 * 1024;
const importSchema = z.object({ document: z.unknown().refine((d) => d !== undefined, 'Send the file as "document"') });

/**
 * {document: the exported file} → 201 a new draft holding its procedure (published later under a new slug);
 * 400 {error, issues} with every problem and its path in the file.
 */
export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const body = await readJson(request, MAX_IMPORT_BYTES);
  if (!body.ok) return body.response;
  const parsed = importSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const read = readExchangeFile(parsed.data.document);
  if (!read.ok) return issuesResponse(read.issues);
  const row = await createDraft(gate.user.id, editDocument(read.procedure));
  return Response.json(draftView(row, null), { status: 201 });
};
