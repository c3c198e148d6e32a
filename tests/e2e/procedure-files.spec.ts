import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { encodePdf } from '../../scripts/demo-pdf';
import { demoBenchPhoto } from '../../scripts/demo-photo';
import { coverProcedure } from '../support/cover-procedure';
import { islandsReady, shot, signIn, signOut } from './helpers';

// An instructor attaches a spec sheet (PDF) and a photo to a procedure they created and captions the PDF; a
// learner finds both beside the cautions on the trainer page, the PDF under its caption, and it opens as a PDF.

/** Publishes the cover job as the signed-in instructor's own procedure, through the editor's routes. */
async function publishOwnProcedure(page: Page, title: string): Promise<string> {
  const { slug: _slug, version: _version, ...document } = coverProcedure();
  const draft = await page.request.post('/api/procedure-drafts', { data: {} });
  expect(draft.status()).toBe(201);
  const { id, revision } = (await draft.json()) as { id: string; revision: number };
  expect((await page.request.put(`/api/procedure-drafts/${id}`, { data: { document: { ...document, title }, revision } })).status()).toBe(200);
  const published = await page.request.post(`/api/procedure-drafts/${id}/publish`, { data: {} });
  expect(published.status()).toBe(201);
  return ((await published.json()) as { slug: string }).slug;
}

test('an instructor attaches a PDF and a photo to their procedure; a learner opens them from the trainer page', async ({ page }) => {
  const title = `Sump cover with spec sheet ${randomUUID().slice(0, 4)}`;
  const pdfName = `cover-spec-${randomUUID().slice(0, 4)}.pdf`;
  // A one-page PDF made here: "%PDF-1.4" header, objects, xref table and trailer (ISO 32000-1 §7.5).
  const pdf = encodePdf(
    [{ text: 'Sump cover: 4 flange bolts, cross pattern, 2 passes to 11 N·m', bold: true }, { text: 'Demo values for a fictional engine.' }],
    'Cover spec sheet',
  );

  await signIn(page, 'instructor@larkspur.example');
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  const slug = await publishOwnProcedure(page, title);

  // From the procedures list to the procedure's files.
  await page.goto('/teach/procedures');
  await page.getByRole('link', { name: `Reference files of ${title} (0)` }).click();
  await expect(page.getByRole('heading', { name: title, level: 1 })).toBeVisible();
  await islandsReady(page);
  const panel = page.getByTestId('reference-files-panel');
  const input = panel.getByLabel('Attach files');
  await expect(panel).toContainText('JPEG, PNG, WebP, HEIC or PDF, up to 10 MB each; 0 of 20 files.');
  await expect(input).toHaveAttribute('accept', /application\/pdf/);

  // A text file dressed up as a PDF is refused, and the message sits next to the input.
  await input.setInputFiles({ name: 'spec.pdf', mimeType: 'application/pdf', buffer: Buffer.from('11 N·m, two passes\n') });
  await expect(panel.getByRole('alert')).toContainText("spec.pdf: The file's content is plain text (text/plain) although its name ends in .pdf.");
  await shot(page, 'procedure-files-refused');

  await input.setInputFiles([
    { name: pdfName, mimeType: 'application/pdf', buffer: Buffer.from(pdf) },
    { name: 'cover-fitted.png', mimeType: 'image/png', buffer: Buffer.from(demoBenchPhoto()) },
  ]);
  await expect(panel.getByRole('status')).toContainText('2 files attached');
  await expect(panel.getByRole('alert')).toBeEmpty();
  const rows = panel.getByTestId('reference-file');
  await expect(rows).toHaveCount(2);
  await expect(rows.nth(0)).toContainText(pdfName);
  await expect(rows.nth(0)).toContainText('PDF');
  await expect(rows.nth(1)).toContainText('cover-fitted.png');
  await expect(rows.nth(1)).toContainText('Photo');

  // The PDF gets a caption in the class's words: the field takes focus, Enter saves, focus comes back.
  const caption = 'Cover spec sheet: torque and order';
  await expect(rows.nth(0)).toContainText('No caption: learners see the file name.');
  await panel.getByRole('button', { name: `Edit the caption of ${pdfName}` }).click();
  const captionField = panel.getByLabel(`Caption for ${pdfName}`);
  await expect(captionField).toBeFocused();
  await captionField.fill(caption);
  await shot(page, 'procedure-files-caption');
  await page.keyboard.press('Enter');
  await expect(panel.getByRole('status')).toContainText(`Caption of ${pdfName} saved`);
  await expect(rows.nth(0)).toContainText(`Caption: ${caption}`);
  await expect(panel.getByRole('button', { name: `Edit the caption of ${pdfName}` })).toBeFocused();

  // A third file, removed again by keyboard: the confirmation takes focus, Enter deletes.
  await input.setInputFiles({ name: 'wrong-photo.png', mimeType: 'image/png', buffer: Buffer.from(demoBenchPhoto()) });
  await expect(rows).toHaveCount(3);
  await panel.getByRole('button', { name: 'Delete wrong-photo.png' }).click();
  const confirm = panel.getByRole('group', { name: 'Delete wrong-photo.png?' });
  await expect(confirm.getByRole('button', { name: 'Delete it' })).toBeFocused();
  await shot(page, 'procedure-files-confirm-delete');
  await page.keyboard.press('Enter');
  await expect(panel.getByRole('status')).toContainText('wrong-photo.png deleted');
  await expect(rows).toHaveCount(2);
  await expect(panel.getByRole('heading', { name: 'Reference files' })).toBeFocused();
  await shot(page, 'procedure-files-instructor');

  // The same files show beside a draft of the next version; they belong to the procedure, not the draft.
  await page.goto('/teach/procedures');
  await page.getByRole('button', { name: `Edit ${title} as a new version` }).click();
  await expect(page.getByRole('heading', { name: `New version of ${slug}`, level: 1 })).toBeVisible();
  await expect(page.getByTestId('reference-files-panel').getByTestId('reference-file')).toHaveCount(2);
  await expect(page.getByRole('button', { name: 'Publish new version' })).toBeVisible();
  await shot(page, 'procedure-files-editor');
  await signOut(page);

  // The learner: the files sit beside the cautions on the trainer page.
  await signIn(page, 'learner1@larkspur.example');
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.goto(`/train/${slug}`);
  await expect(page.getByTestId('cautions')).toBeVisible();
  const files = page.getByTestId('reference-files');
  await expect(files.getByRole('heading', { name: 'Reference files' })).toBeVisible();
  const listed = files.getByTestId('reference-file');
  await expect(listed).toHaveCount(2);
  await expect(listed.nth(0)).toContainText(`${caption} (opens in a new tab)`);
  await expect(listed.nth(0)).toContainText(`PDF · ${pdf.byteLength} bytes · ${pdfName}`);
  await expect(listed.nth(1)).toContainText('cover-fitted.png');
  await expect(listed.nth(1)).toContainText('Photo ·');
  await shot(page, 'procedure-files-trainer');

  const pdfLink = files.getByRole('link', { name: `${caption} (opens in a new tab)` });
  await expect(pdfLink).toHaveAttribute('target', '_blank');
  const href = (await pdfLink.getAttribute('href'))!;
  const opened = await page.request.get(href);
  expect(opened.status()).toBe(200);
  expect(opened.headers()['content-type']).toBe('application/pdf');
  expect(opened.headers()['content-disposition']).toBe(`inline; filename="${pdfName}"`);
  expect(Buffer.from(await opened.body()).equals(Buffer.from(pdf))).toBe(true);

  // Following the link opens a second tab on the file.
  const [tab] = await Promise.all([page.context().waitForEvent('page'), pdfLink.click()]);
  await expect.poll(() => tab.url()).toContain(href);
  await tab.waitForLoadState();
  await shot(tab, 'procedure-files-pdf-tab');
  await tab.close();

  // The learner cannot manage the files: the page for it is not theirs.
  const manage = await page.goto(`/teach/procedures/files/${slug}`);
  expect(manage?.status()).toBe(403);
});
