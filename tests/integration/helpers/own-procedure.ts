import { randomUUID } from 'node:crypto';
import { coverProcedure } from '../../support/cover-procedure';
import type { Client } from './client';

/**
 * Publishes the small cover job as a new procedure of the signed-in instructor (or admin) through the
 * editor's routes, as the editor does: a draft, its document, publish. Its creator may then edit it.
 */
export async function publishOwnProcedure(client: Client, tag = 'files'): Promise<{ slug: string; title: string }> {
  const { slug: _slug, version: _version, ...document } = coverProcedure();
  const title = `Cover with ${tag} ${randomUUID().slice(0, 6)}`;
  const created = await client.post('/api/procedure-drafts', {});
  if (created.status !== 201) throw new Error(`draft not created: ${created.status}`);
  const saved = await client.request('PUT', `/api/procedure-drafts/${created.body.id}`, { document: { ...document, title }, revision: created.body.revision });
  if (saved.status !== 200) throw new Error(`draft not saved: ${saved.status}`);
  const published = await client.post(`/api/procedure-drafts/${created.body.id}/publish`);
  if (published.status !== 201) throw new Error(`not published: ${published.status} ${JSON.stringify(published.body)}`);
  return { slug: published.body.slug as string, title };
}
