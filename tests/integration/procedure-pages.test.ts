import { describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner } from './helpers/client';
import { BASE_URL } from './helpers/server';

// The instructors' procedures page works with plain form posts: new, clone, edit, delete, import.

async function postForm(client: Client, fields: Record<string, string | Blob>) {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  // FormData sets its own multipart content type; the page's origin comes along, as from a browser.
  // The shared Client only sends JSON, so this borrows its session cookie and address.
  const res = await fetch(`${BASE_URL}/teach/procedures`, {
    method: 'POST',
    body: form,
    redirect: 'manual',
    headers: { origin: BASE_URL, cookie: (client as unknown as { cookie: string }).cookie, 'x-forwarded-for': client.address },
  });
  return { status: res.status, location: res.headers.get('location'), text: await res.text() };
}

describe('/teach/procedures', () => {
  it('lists the demo procedures to clone; learners get the forbidden page, the signed-out the sign-in page', async () => {
    const { client } = await demoUser('instructor2@larkspur.example');
    const page = await client.get('/teach/procedures');
    expect(page.status).toBe(200);
    expect(page.body).toContain('Wren 160: install the sump');
    const { client: learner } = await newLearner('pages');
    expect((await learner.get('/teach/procedures')).status).toBe(403);
    const anon = await new Client().get('/teach/procedures');
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toMatch(/^\/sign-in\?next=/);
  });

  it('"New procedure" and "Clone" open a draft in the editor; "Edit" of a procedure that is not yours is refused', async () => {
    const { client } = await demoUser('instructor2@larkspur.example');
    const created = await postForm(client, { action: 'new' });
    expect(created.status).toBe(303);
    expect(created.location).toMatch(/^\/teach\/procedures\/drafts\/[0-9a-f-]{36}$/);
    const editor = await client.get(created.location!);
    expect(editor.status).toBe(200);
    expect(editor.body).toContain('ProcedureEditor');

    const clone = await postForm(client, { action: 'clone', slug: 'wren-160-head' });
    expect(clone.status).toBe(303);
    const draft = await client.get(`/api/procedure-drafts/${clone.location!.split('/').pop()}`);
    expect(draft.body.title).toBe('Wren 160: install the cylinder head (copy)');

    const edit = await postForm(client, { action: 'edit', slug: 'wren-160-head' });
    expect(edit.status).toBe(403);
    expect(edit.text).toContain('Only the instructor who created this procedure');

    const deleted = await postForm(client, { action: 'delete', draft: draft.body.id });
    expect(deleted.status).toBe(200);
    expect((await client.get(`/api/procedure-drafts/${draft.body.id}`)).status).toBe(404);
  });

  it('importing a file makes a draft; a broken file lists every problem with its path', async () => {
    const { client } = await demoUser('instructor2@larkspur.example');
    const file = (await client.get('/api/procedures/wren-160-flywheel/export')).body;
    const ok = await postForm(client, { action: 'import', file: new Blob([JSON.stringify(file)], { type: 'application/json' }) });
    expect(ok.status).toBe(303);
    expect(ok.location).toMatch(/^\/teach\/procedures\/drafts\//);

    file.procedure.steps[0].parts = ['no-such-part'];
    file.procedure.wrench.group = 'no-such-group';
    const broken = await postForm(client, { action: 'import', file: new Blob([JSON.stringify(file)], { type: 'application/json' }) });
    expect(broken.status).toBe(400);
    expect(broken.text).toContain('procedure.steps.0.parts.0');
    expect(broken.text).toContain('procedure.wrench.group');

    const notJson = await postForm(client, { action: 'import', file: new Blob(['{oops'], { type: 'application/json' }) });
    expect(notJson.status).toBe(400);
    expect(notJson.text).toContain('The file is not JSON.');
  });
});
