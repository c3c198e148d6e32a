import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { demoBenchPhoto } from '../../scripts/demo-photo';
import { islandsReady, shot, signIn, signOut } from './helpers';

const SUMP = 'Wren 160: install the sump';


test('a learner uploads a bench photo, the instructor signs the sump off with it, the learner sees the pass', async ({ page }) => {
  const photoName = `finished-sump-${randomUUID().slice(0, 6)}.png`;
  const notes = `Cross pattern, two passes to spec; 8 of 8 bolts (${photoName}).`;

  // The learner: from "My bench" to the bench page; the cautions sit beside the work.
  await signIn(page, 'learner1@larkspur.example');
  await page.getByRole('link', { name: /Bench work/ }).click();
  await expect(page).toHaveURL(/\/learn\/bench$/);
  await expect(page.getByTestId('cautions')).toContainText('spark plug lead');
  await expect(page.getByTestId('cautions')).toContainText("The engine maker's data, local codes and licensed practice rule");

  await islandsReady(page);
  const sump = page.getByTestId('bench-wren-160-sump');
  // A text file dressed up as a photo is refused with what it really is.
  await sump.getByLabel(`Add photos of ${SUMP}`).setInputFiles({
    name: 'notes.jpg',
    mimeType: 'image/jpeg',
    buffer: Buffer.from('torque notes, not a photo\n'),
  });
  await expect(sump.getByRole('alert')).toContainText('notes.jpg: The file\'s content is plain text (text/plain)');

  await sump.getByLabel(`Add photos of ${SUMP}`).setInputFiles({ name: photoName, mimeType: 'image/png', buffer: Buffer.from(demoBenchPhoto()) });
  await expect(sump.getByRole('status')).toContainText('Photo uploaded');
  const tile = sump.getByRole('img', { name: photoName });
  await expect(tile).toBeVisible();
  // Tiles load lazily: with many procedures listed above the sump, the picture only loads once scrolled to.
  await tile.scrollIntoViewIfNeeded();
  // The picture really came back from the server (a broken image has no natural width).
  await expect.poll(() => tile.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(160);
  await shot(page, 'bench-learner-uploaded');
  await signOut(page);

  // The instructor: class page → sign-offs, picks the learner, the procedure and that photo.
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: 'Small Engines I', exact: true }).click();
  await page.getByRole('link', { name: 'Bench sign-offs' }).click();
  await expect(page.getByRole('heading', { name: 'Bench sign-offs' })).toBeVisible();
  await islandsReady(page);
  const form = page.getByTestId('sign-off-form');
  await form.getByLabel('Learner').selectOption({ label: 'Ava Lindqvist' });
  await form.getByLabel('Procedure').selectOption({ label: SUMP });
  await expect(form.getByLabel('Bench date')).not.toHaveValue('');

  // Sending without an outcome puts the problem next to the field.
  await form.getByRole('button', { name: 'Record sign-off' }).click();
  await expect(form.locator('fieldset').filter({ hasText: 'Outcome' }).getByRole('alert')).toContainText('Choose pass or redo');

  await form.getByLabel(`Attach ${photoName}`).check();
  await form.getByText('✓ Pass').click();
  await form.getByLabel('Notes').fill(notes);
  await shot(page, 'bench-instructor-form');
  await form.getByRole('button', { name: 'Record sign-off' }).click();

  await expect(page.getByRole('status').filter({ hasText: 'Sign-off recorded' })).toContainText(`Ava Lindqvist, ${SUMP}, pass`);
  const recorded = page.getByTestId('sign-off').filter({ hasText: notes });
  await expect(recorded).toContainText('Pass');
  await expect(recorded.getByRole('img', { name: photoName })).toBeVisible();
  await shot(page, 'bench-instructor-list');
  await signOut(page);

  // The learner sees the sign-off, and the photo is now kept with it.
  await signIn(page, 'learner1@larkspur.example');
  await page.goto('/learn/bench');
  const signedOff = page.getByTestId('bench-wren-160-sump').getByTestId('sign-off').filter({ hasText: notes });
  await expect(signedOff).toContainText('✓ Pass');
  await expect(signedOff).toContainText('signed off by Dana Whitcombe');
  await expect(signedOff.getByRole('img', { name: photoName })).toBeVisible();
  const mine = page.getByTestId('bench-wren-160-sump').getByTestId('bench-photos-wren-160-sump');
  await expect(mine.getByTestId('photo-tile').filter({ hasText: photoName })).toContainText('On a sign-off');
  await shot(page, 'bench-learner-signed-off');
});
