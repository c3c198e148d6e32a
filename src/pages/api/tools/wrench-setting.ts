import type { APIRoute } from 'astro';
import { wrenchSettingRequestSchema } from '../../../lib/schemas/tools';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { wrenchSetting, WrenchSetupError } from '../../../lib/wrench';

/** The wrench calculator: pure arithmetic, open to everyone (no data of anyone's is read). */
export const POST: APIRoute = async ({ request }) => {
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = wrenchSettingRequestSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);
  try {
    return Response.json(wrenchSetting(parsed.data));
  } catch (err) {
    if (err instanceof WrenchSetupError) return jsonError(400, err.message);
    throw err;
  }
};
