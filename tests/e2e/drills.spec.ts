import { readFile } from 'node:fs/promises';
import { expect, test } from '@playwright/test';
import Papa from 'papaparse';
import { demoProcedure } from '../support/demo-procedures';
import { islandsReady, shot, signIn, signOut } from './helpers';
import { answerStage, checkStage } from './trainer-steps';

// The browser runs in US Central time, so the due date the instructor picks is read in that zone and the
// learner's page shows it back in that zone.
test.use({ timezoneId: 'America/Chicago' });
test.describe.configure({ timeout: 180_000 });

const flywheel = demoProcedure('wren-160-flywheel');

test('an instructor assigns a drill; a learner passes it in the trainer; the instructor sees the score, the step analysis and the export', async ({ page }) => {
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: 'Small Engines I', exact: true }).click();
  const form = page.getByRole('form', { name: 'Assign a drill' });
  await expect(form).toBeVisible();
  await islandsReady(page);

  await form.getByLabel('Procedure').selectOption({ label: `${flywheel.title} (version 1)` });
  await form.getByLabel('Wrench').uncheck();
  await form.getByLabel('Final check').uncheck();
  await expect(form.getByLabel('Order')).toBeChecked();
  await form.getByLabel('Due date and time').fill('2031-07-15T17:30');
  await expect(form.getByText('In your time zone (America/Chicago).')).toBeVisible();
  await form.getByLabel('Pass mark (%)').fill('0');
  await form.getByLabel('Attempts per stage').fill('3');

  // The server's field error shows next to the field, and nothing is assigned.
  await form.getByRole('button', { name: 'Assign drill' }).click();
  const passMark = form.getByLabel('Pass mark (%)');
  await expect(passMark).toHaveAttribute('aria-invalid', 'true');
  await expect(passMark).toHaveAccessibleDescription(/The pass mark is at least 1 %/);
  await expect(form.getByRole('alert').first()).toContainText('The pass mark is at least 1 %');
  await shot(page, 'drill-assign-error');

  await form.getByLabel('Pass mark (%)').fill('80');
  const created = page.waitForResponse((r) => r.request().method() === 'POST' && /\/api\/classes\/[^/]+\/drills$/.test(r.url()));
  await form.getByRole('button', { name: 'Assign drill' }).click();
  const drill = (await (await created).json()) as { id: string; dueAt: string; learners: number };
  // 17:30 on 15 July in US Central daylight time (UTC−5, from memory) is 22:30 UTC.
  expect(drill.dueAt).toBe('2031-07-15T22:30:00.000Z');
  await expect(form.getByRole('status')).toContainText(`Drill assigned: ${flywheel.title}`);

  const row = page.locator(`[data-drill-id="${drill.id}"]`);
  await expect(row).toContainText(flywheel.title);
  await expect(row).toContainText('Order · pass mark 80 % · 3 attempts per stage');
  // Every learner of the class (the demo's eight, and any another test added) has not started yet.
  await expect(row.getByTestId('status-counts')).toContainText(`○ ${drill.learners} not started`);
  await expect(row.locator('time')).toContainText('CDT');
  await shot(page, 'drill-assigned');
  await signOut(page);

  await signIn(page, 'learner1@larkspur.example');
  await expect(page).toHaveURL(/\/learn$/);
  const mine = page.locator(`[data-drill-id="${drill.id}"]`);
  await expect(mine).toContainText('Not started');
  await expect(mine).toContainText('Small Engines I');
  await expect(mine.getByTestId('best-score')).toHaveText('—');
  await expect(mine.getByTestId('attempts-left')).toHaveText('3 attempts left (3 per stage)');
  // The due date in the learner's own zone, written by the page's script.
  await expect(mine.locator('time')).toHaveAttribute('datetime', '2031-07-15T22:30:00.000Z');
  await expect(mine.locator('time')).toContainText(/5:30\sPM CDT/);
  await shot(page, 'drill-learner-home');

  // Work saved on this version from an earlier run would come back into the trainer: start from an empty draft.
  const cleared = await page.request.put('/api/drafts/wren-160-flywheel?version=1', { data: { drafts: {}, savedAt: new Date().toISOString() } });
  expect(cleared.status()).toBe(204);
  await mine.getByRole('link', { name: flywheel.title }).click();
  await expect(page).toHaveURL(new RegExp(`/train/wren-160-flywheel\\?drill=${drill.id}$`));
  await expect(page.getByTestId('drill-banner')).toContainText('Drill for Small Engines I');
  // Only the drill's stage is offered.
  await expect(page.getByRole('tab')).toHaveCount(1);
  await expect(page.getByRole('tab', { name: /^1\. Order/ })).toBeVisible();
  await expect(page.getByTestId('attempts-left')).toHaveText('3 of 3 attempts left on this stage of the drill.');

  await answerStage(page, flywheel, 'order');
  const verdict = await checkStage(page);
  await expect(verdict).toHaveText(/^(✓ )?Passed/);
  await expect(page.getByTestId('attempts-left')).toHaveText('2 of 3 attempts left on this stage of the drill.');
  await expect(page.getByTestId('stage-best')).toHaveText('Your best on this stage: 100 % (pass mark 80 %).');
  await shot(page, 'drill-trainer-passed');

  await page.goto('/learn');
  const after = page.locator(`[data-drill-id="${drill.id}"]`);
  await expect(after).toContainText('Passed');
  await expect(after.getByTestId('best-score')).toHaveText('100 %');
  await shot(page, 'drill-learner-passed');
  await signOut(page);

  // Back to the instructor: the score is in the class results, the drill in the step analysis, and the grade export.
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: 'Small Engines I', exact: true }).click();
  await page.getByRole('link', { name: /Class results and grade export/ }).click();
  await islandsReady(page);
  await page.getByLabel('Search by name').fill('Ava');
  await expect(page.getByTestId('results-table').getByRole('link', { name: /^Ava Lindqvist, Order: best 100 %/ })).toBeVisible();
  await page.getByRole('tab', { name: 'Step analysis' }).click();
  await page.getByLabel('Drill').selectOption({ label: `${flywheel.title} (due 2031-07-15)` });
  await expect(page.getByTestId('analysis-basis')).toContainText('1 learner has tried every stage');
  await expect(page.getByTestId('step-table').locator('tbody tr')).not.toHaveCount(0);
  await shot(page, 'drill-step-analysis');

  await page.getByRole('tab', { name: 'Learners' }).click();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
  const rows = Papa.parse<Record<string, string>>((await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: true,
  }).data;
  const ava = rows.find((r) => r['E-mail'] === 'learner1@larkspur.example');
  const drillColumn = `${flywheel.title} v1, due 2031-07-15`;
  expect(ava?.[`${drillColumn}: Order best %`]).toBe('100');
  expect(ava?.[`${drillColumn}: status`]).toBe('passed');
});

test('an instructor edits a drill and closes it; the learner then sees it closed, with nothing to open', async ({ page }) => {
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: 'Small Engines I', exact: true }).click();
  const classId = page.url().split('/').pop()!;
  // Made through the API the page itself uses; this test is about editing and closing.
  const made = await page.request.post(`/api/classes/${classId}/drills`, {
    data: { procedure: 'wren-160-head', stages: ['order', 'pins'], dueAt: '2032-03-01T18:00:00Z', passMarkPct: 70, attemptLimit: 2 },
  });
  expect(made.status()).toBe(201);
  const { id, learners } = (await made.json()) as { id: string; learners: number };
  await page.reload();

  await islandsReady(page);
  const row = page.locator(`[data-drill-id="${id}"]`);
  await row.getByRole('button', { name: /^Edit drill/ }).click();
  const edit = row.getByRole('form', { name: /^Edit drill/ });
  await expect(edit.getByLabel('Due date and time')).toHaveValue('2032-03-01T12:00'); // 18:00 UTC is noon in US Central standard time (UTC−6), from memory
  await edit.getByLabel('Pins').uncheck();
  await edit.getByLabel('Attempts per stage').fill('');
  await edit.getByLabel('Pass mark (%)').fill('90');
  await edit.getByRole('button', { name: 'Save changes' }).click();
  await expect(row).toContainText('Order · pass mark 90 % · no attempt limit');
  await expect(edit).toBeHidden();

  await row.getByRole('button', { name: /^Close drill/ }).click();
  await expect(row.getByRole('group', { name: 'Close this drill?' })).toContainText('every attempt made on it is kept');
  await row.getByRole('button', { name: 'Yes, close it' }).click();
  await expect(row).toContainText('Closed');
  // Closed: nobody can pass it any more.
  await expect(row.getByTestId('status-counts')).toContainText(`✗ ${learners} missed`);
  await expect(row.getByRole('button', { name: /^Reopen drill/ })).toBeVisible();
  await shot(page, 'drill-closed-instructor');
  await signOut(page);

  await signIn(page, 'learner2@larkspur.example');
  const mine = page.locator(`[data-drill-id="${id}"]`);
  await expect(mine).toContainText('Missed');
  await expect(mine).toContainText('closed');
  await expect(mine.getByRole('link')).toHaveCount(0);
  await page.goto(`/train/wren-160-head?drill=${id}`);
  await expect(page.getByTestId('drill-closed')).toContainText('This drill is closed');
});
