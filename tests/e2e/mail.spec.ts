import { randomUUID } from 'node:crypto';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { shot, signIn, signOut } from './helpers';
import { linkIn, waitForMail } from '../support/mail-catcher';

const tag = () => randomUUID().slice(0, 8);

/** A fresh learner account made through the API, so the demo accounts' passwords never change. */
async function freshLearner(request: APIRequestContext, name: string, password = 'first password 123') {
  const email = `${name.toLowerCase().replace(/\W+/g, '-')}-${tag()}@test.example`;
  const res = await request.post('/api/auth/sign-up', { data: { name, email, password } });
  expect(res.status()).toBe(201);
  return { email, password };
}

test('a learner who forgot the password sets a new one from the e-mailed link and signs in with it', async ({ page, request }) => {
  const { email } = await freshLearner(request, 'Iris Fairweather');

  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page).toHaveURL(/\/forgot-password$/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send the reset link' }).click();
  await expect(page.getByRole('status')).toContainText('If an account uses this address');
  await shot(page, 'mail-forgot-password-sent');

  const [mail] = await waitForMail(email);
  expect(mail!.subject).toBe('Set a new Benchwright password');
  const link = linkIn(mail!, '/reset-password');
  await page.goto(link.pathname + link.search);

  // Two different passwords: the error sits next to the second field.
  await page.getByLabel('New password', { exact: true }).fill('new bench password 1');
  await page.getByLabel('New password again').fill('something else entirely');
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page.locator('#field-repeat-error')).toContainText('The two passwords are not the same');
  await shot(page, 'mail-reset-password-mismatch');

  await page.getByLabel('New password', { exact: true }).fill('new bench password 1');
  await page.getByLabel('New password again').fill('new bench password 1');
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page).toHaveURL(/\/sign-in\?reset=done$/);
  await expect(page.getByRole('status')).toContainText('Your password is changed');
  await shot(page, 'mail-reset-password-done');

  await signIn(page, email, 'first password 123');
  await expect(page.getByRole('alert')).toContainText('E-mail or password is wrong');
  await signIn(page, email, 'new bench password 1');
  await expect(page).toHaveURL(/\/learn$/);
  await signOut(page);

  // The link was spent: opening it again says so.
  await page.goto(link.pathname + link.search);
  await expect(page.getByRole('alert')).toContainText('already been used');
});

test('an instructor invites by e-mail and imports a roster: preview with an error row, fix it, import', async ({ page, request }) => {
  const existing = await freshLearner(request, 'Jonah Pike');
  const newcomer = `noor-haddad-${tag()}@test.example`;
  const invitee = `tess-moreau-${tag()}@test.example`;

  await signIn(page, 'instructor@larkspur.example');
  await expect(page).toHaveURL(/\/teach$/);
  const className = `Small Engines roster ${tag()}`;
  const created = await page.request.post('/api/classes', { data: { name: className } });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  await page.goto(`/teach/classes/${id}`);

  // One address by the invitation form.
  await page.getByLabel('E-mail', { exact: true }).fill(invitee);
  await page.getByLabel('Name (optional)').fill('Tess Moreau');
  await page.getByRole('button', { name: 'Send 1 invitation' }).click();
  await expect(page.getByTestId('invite-result')).toContainText(`${invitee} · ✓ e-mail sent`);

  // A spreadsheet's CSV (with a byte-order mark) with one bad row.
  const csv = `\uFEFFName,E-mail\nJonah Pike,${existing.email}\n"Haddad, Noor",${newcomer}\nPat Quarry,pat.quarry.example.org\n`;
  await page.getByLabel('CSV file').setInputFiles({ name: 'roster.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
  await expect(page.getByLabel('Rows (name, e-mail)')).toHaveValue(/Pat Quarry/);
  await page.getByRole('button', { name: 'Check the rows' }).click();
  const preview = page.getByTestId('roster-preview');
  await expect(preview.locator('tr[data-row="4"]')).toContainText('“pat.quarry.example.org” is not a valid e-mail address');
  await expect(preview.locator('tr[data-row="2"]')).toContainText('Joins the class now');
  await expect(preview.locator('tr[data-row="3"]')).toContainText('Gets an invitation');
  await expect(page.getByTestId('roster-counts')).toContainText('1 row has problems');
  await expect(page.getByRole('button', { name: /^Import/ })).toHaveCount(0);
  await shot(page, 'mail-roster-preview-error');

  // Fix the row in the text and check again.
  const rows = page.getByLabel('Rows (name, e-mail)');
  await rows.fill((await rows.inputValue()).replace('pat.quarry.example.org', `pat-quarry-${tag()}@test.example`));
  await expect(preview).toHaveCount(0);
  await page.getByRole('button', { name: 'Check the rows' }).click();
  await expect(page.getByTestId('roster-counts')).toHaveText('1 person joins now · 2 invitations to send');
  await shot(page, 'mail-roster-preview-ok');
  await page.getByRole('button', { name: 'Import 3 people' }).click();
  const result = page.getByTestId('roster-result');
  await expect(result).toContainText('1 person joined the class, 2 invitations recorded');
  await expect(result).toContainText(`Jonah Pike · ${existing.email} · ✓ e-mail sent`);
  await shot(page, 'mail-roster-imported');

  await result.getByRole('link', { name: 'Show the updated class' }).click();
  await expect(page.getByTestId('roster')).toContainText('Jonah Pike');
  const invitations = page.getByTestId('invitations');
  await expect(invitations).toContainText(newcomer);
  await expect(invitations).toContainText(invitee);
  await expect(invitations).toContainText('Dana Whitcombe');
  await shot(page, 'mail-class-invitations');

  // The newcomer's invitation link opens a filled-in sign-up form that joins the class.
  const [mail] = await waitForMail(newcomer);
  const link = linkIn(mail!, '/sign-up');
  await signOut(page);
  await page.goto(link.pathname + link.search);
  await expect(page.getByTestId('invited-to')).toContainText(className);
  await expect(page.getByLabel('E-mail')).toHaveValue(newcomer);
  await page.getByLabel('Name').fill('Noor Haddad');
  await page.getByLabel('Password').fill('noor bench password');
  await shot(page, 'mail-invited-sign-up');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page).toHaveURL(/\/learn$/);
  await expect(page.getByTestId('my-classes')).toContainText(className);
});

test('an admin reads the sent mail on /admin/mail', async ({ page, request }) => {
  const { email } = await freshLearner(request, 'Wade Ellery');
  expect((await request.post('/api/auth/password-reset', { data: { email } })).status()).toBe(202);
  await waitForMail(email);

  await signIn(page, 'admin@larkspur.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sent mail' }).click();
  await expect(page).toHaveURL(/\/admin\/mail$/);
  await expect(page.getByTestId('mail-list')).toContainText('Set a new Benchwright password');
  await shot(page, 'mail-admin-all');

  await page.getByLabel('Recipient').fill(email);
  await page.getByRole('button', { name: 'Show', exact: true }).click();
  await expect(page.getByTestId('mail-count')).toHaveText(`1 message to ${email}, newest first.`);
  const item = page.getByTestId('mail-list').getByRole('listitem');
  await expect(item.getByText('/reset-password?token=')).toBeHidden();
  await item.getByText('Set a new Benchwright password').click();
  await expect(item.getByText('/reset-password?token=')).toBeVisible();
  await shot(page, 'mail-admin-expanded');
});
