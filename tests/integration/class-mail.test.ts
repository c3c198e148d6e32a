import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { Client, demoUser, newLearner, uniqueEmail } from './helpers/client';
import { testDb } from './helpers/db';
import { BASE_URL } from './helpers/server';
import { linkIn, mailTo, waitForMail } from '../support/mail-catcher';
import { classInvitations, classMembers } from '../../src/db/schema';

const { db, close } = testDb();
afterAll(close);

let owner: Client;
let classId: string;
let joinCode: string;

beforeAll(async () => {
  owner = (await demoUser('instructor@larkspur.example')).client;
  const created = await owner.post('/api/classes', { name: 'Small Engines (mail)' });
  expect(created.status).toBe(201);
  classId = created.body.id;
  joinCode = created.body.joinCode;
});

async function learnerIds(id: string): Promise<string[]> {
  const rows = await db
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, id), eq(classMembers.role, 'learner')));
  return rows.map((r) => r.userId);
}

async function invitedEmails(id: string): Promise<string[]> {
  const rows = await db.select({ email: classInvitations.email }).from(classInvitations).where(eq(classInvitations.classId, id));
  return rows.map((r) => r.email);
}

describe('invitations by e-mail', () => {
  it('invites an unknown address with a sign-up link that joins the class, and adds an existing learner at once', async () => {
    const stranger = uniqueEmail('invitee');
    const existing = await newLearner('invited-existing');
    const res = await owner.post(`/api/classes/${classId}/invitations`, {
      invites: [
        { email: stranger.toUpperCase(), name: 'Rosa Quill' },
        { email: existing.email, name: '' },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body.invited).toEqual([{ row: 1, name: 'Rosa Quill', email: stranger, mail: 'sent' }]);
    expect(res.body.added).toEqual([{ row: 2, name: 'Test invited-existing', email: existing.email, mail: 'sent' }]);
    expect(await learnerIds(classId)).toContain(existing.user.id);

    const [added] = await mailTo(existing.email);
    expect(added!.subject).toBe('You were added to Small Engines (mail) on Benchwright');

    const [invitation] = await mailTo(stranger);
    expect(invitation!.subject).toBe('You are invited to Small Engines (mail) on Benchwright');
    expect(invitation!.text).toContain('Dana Whitcombe invited you');
    const link = linkIn(invitation!, '/sign-up');
    expect(link.origin).toBe(BASE_URL);
    expect(link.searchParams.get('code')).toBe(joinCode);
    expect(link.searchParams.get('email')).toBe(stranger);

    // The sign-up page fills the form in from the link.
    const page = await new Client().get(link.pathname + link.search);
    expect(page.status).toBe(200);
    expect(page.body).toContain(`value="${stranger}"`);
    expect(page.body).toContain(`value="${joinCode}"`);
    expect(page.body).toContain('Small Engines (mail)');

    // Signing up with the code puts the new learner in the class.
    const invitee = new Client();
    const signedUp = await invitee.post('/api/auth/sign-up', { name: 'Rosa Quill', email: stranger, password: 'a long password', joinCode });
    expect(signedUp.status).toBe(201);
    expect(signedUp.body.joined).toEqual({ classId, name: 'Small Engines (mail)' });
    const mine = await invitee.get('/api/classes');
    expect(mine.body.map((c: { id: string }) => c.id)).toEqual([classId]);

    const list = await owner.get(`/api/classes/${classId}/invitations`);
    expect(list.body).toEqual(
      expect.arrayContaining([expect.objectContaining({ email: stranger, name: 'Rosa Quill', invitedBy: 'Dana Whitcombe', joined: true, sentAt: expect.any(String) })]),
    );
    // Existing accounts were added, not invited.
    expect(list.body.some((i: { email: string }) => i.email === existing.email)).toBe(false);
  });

  it('refuses the whole batch when one address is bad, naming it, and sends nothing', async () => {
    const good = uniqueEmail('batch-good');
    const res = await owner.post(`/api/classes/${classId}/invitations`, { invites: [{ email: good }, { email: 'nobody@' }, { email: good }] });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('2 addresses have problems; nothing was sent.');
    expect(res.body.rows.map((r: { row: number; errors: string[] }) => [r.row, r.errors])).toEqual([
      [1, []],
      [2, ['“nobody@” is not a valid e-mail address']],
      [3, ['Same e-mail as row 1']],
    ]);
    expect(await invitedEmails(classId)).not.toContain(good);
    expect(await mailTo(good)).toEqual([]);
  });

  it('refuses the inviter’s own address, members and staff accounts', async () => {
    const res = await owner.post(`/api/classes/${classId}/invitations`, {
      invites: [{ email: 'instructor@larkspur.example' }, { email: 'instructor2@larkspur.example' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.rows.map((r: { errors: string[] }) => r.errors)).toEqual([
      ['This is your own address'],
      ['Belongs to an instructor account; only learner accounts join as learners'],
    ]);
  });

  it('checks the body shape: a list of 1 to 500 entries with an e-mail each', async () => {
    const none = await owner.post(`/api/classes/${classId}/invitations`, { invites: [] });
    expect(none.status).toBe(400);
    expect(none.body.fields.invites).toEqual(['Add at least one address']);
    expect((await owner.post(`/api/classes/${classId}/invitations`, { invites: [{ name: 'No address' }] })).status).toBe(400);
    expect((await owner.post(`/api/classes/${classId}/invitations`, {})).status).toBe(400);
    const many = Array.from({ length: 501 }, (_, i) => ({ email: `l${i}@test.example` }));
    const tooMany = await owner.post(`/api/classes/${classId}/invitations`, { invites: many });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.fields.invites).toEqual(['At most 500 addresses at a time']);
  });

  it('sign-up with an unknown join code is 404 and makes no account', async () => {
    const email = uniqueEmail('badcode-signup');
    const res = await new Client().post('/api/auth/sign-up', { name: 'Nobody', email, password: 'a long password', joinCode: 'ZZZZZZZZ' });
    expect(res.status).toBe(404);
    expect(res.body.fields.joinCode).toBeDefined();
    expect((await new Client().post('/api/auth/sign-up', { name: 'Nobody', email, password: 'a long password' })).status).toBe(201);
  });
});

describe('roster import', () => {
  it('previews every row with what would happen, and changes nothing', async () => {
    const existing = await newLearner('preview-existing');
    const stranger = uniqueEmail('preview-new');
    const res = await owner.post(`/api/classes/${classId}/roster/preview`, {
      csv: `\uFEFFE-mail,Name\n${existing.email},Existing One\n${stranger},"New, Person"\n`,
    });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      ok: true,
      header: true,
      rows: [
        { row: 2, name: 'Existing One', email: existing.email, errors: [], action: 'add' },
        { row: 3, name: 'New, Person', email: stranger, errors: [], action: 'invite' },
      ],
      counts: { add: 1, invite: 1, withErrors: 0 },
    });
    expect(await learnerIds(classId)).not.toContain(existing.user.id);
    expect(await invitedEmails(classId)).not.toContain(stranger);
  });

  it('one bad row: 400 naming that row, no member added, no invitation recorded, no mail sent', async () => {
    const existing = await newLearner('import-bad-existing');
    const stranger = uniqueEmail('import-bad-new');
    const csv = ['name,email', `Existing One,${existing.email}`, `New Person,${stranger}`, 'Broken Row,broken.example.org'].join('\n');
    const res = await owner.post(`/api/classes/${classId}/roster/import`, { csv });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('1 row has problems; nothing was imported.');
    expect(res.body.rows.filter((r: { errors: string[] }) => r.errors.length)).toEqual([
      { row: 4, name: 'Broken Row', email: 'broken.example.org', errors: ['“broken.example.org” is not a valid e-mail address'], action: null },
    ]);
    expect(await learnerIds(classId)).not.toContain(existing.user.id);
    expect(await invitedEmails(classId)).not.toContain(stranger);
    // Mail for an import goes out before the answer, so nothing can still be on its way.
    expect(await mailTo(existing.email)).toEqual([]);
    expect(await mailTo(stranger)).toEqual([]);
  });

  it('a good import adds existing learners, invites the rest, and mails both', async () => {
    const existing = await newLearner('import-existing');
    const strangers = [uniqueEmail('import-new-a'), uniqueEmail('import-new-b')];
    const csv = `Existing One,${existing.email}\r\nNew A,${strangers[0]}\r\nNew B,${strangers[1]}\r\n`;
    const res = await owner.post(`/api/classes/${classId}/roster/import`, { csv });
    expect(res.status).toBe(200);
    expect(res.body.added).toEqual([{ row: 1, name: 'Test import-existing', email: existing.email, mail: 'sent' }]);
    expect(res.body.invited).toEqual([
      { row: 2, name: 'New A', email: strangers[0], mail: 'sent' },
      { row: 3, name: 'New B', email: strangers[1], mail: 'sent' },
    ]);
    expect(await learnerIds(classId)).toContain(existing.user.id);
    expect(await invitedEmails(classId)).toEqual(expect.arrayContaining(strangers));
    expect((await mailTo(existing.email))[0]!.subject).toBe('You were added to Small Engines (mail) on Benchwright');
    for (const address of strangers) {
      const [mail] = await waitForMail(address);
      expect(linkIn(mail!, '/sign-up').searchParams.get('code')).toBe(joinCode);
    }

    // Importing the same file again: everyone is now in the class or already invited; members are refused.
    const again = await owner.post(`/api/classes/${classId}/roster/import`, { csv });
    expect(again.status).toBe(400);
    expect(again.body.rows[0].errors).toEqual(['Already in this class']);
  });

  it('whole-file problems are a 400 with the reason: empty, too many rows, too large, not text', async () => {
    const path = `/api/classes/${classId}/roster/preview`;
    const empty = await owner.post(path, { csv: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.fields.csv).toBeDefined();
    const rows = Array.from({ length: 501 }, (_, i) => `Learner ${i},l${i}@test.example`).join('\n');
    const tooMany = await owner.post(path, { csv: rows });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error).toBe('The file has 501 rows; import at most 500 at a time.');
    const tooLarge = await owner.post(path, { csv: `Name,${'x'.repeat(300 * 1024)}@test.example` });
    expect(tooLarge.status).toBe(400);
    expect(tooLarge.body.error).toBe('The file is too large: at most 256 KB');
    const huge = await owner.post(path, { csv: 'x'.repeat(600 * 1024) });
    expect(huge.status).toBe(400);
    expect((await owner.post(path, { csv: 42 })).status).toBe(400);
    expect((await owner.request('POST', path, 'name,email', { 'content-type': 'text/csv' })).status).toBe(400);
  });

  it('the class page shows the invitations with who sent them', async () => {
    const page = await owner.get(`/teach/classes/${classId}`);
    expect(page.status).toBe(200);
    expect(page.body).toContain('data-testid="invitations"');
    expect(page.body).toContain('Import a roster');
  });
});
