import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { expect, request, test, type APIRequestContext, type Page } from '@playwright/test';
import { shot, signIn, DEMO_PASSWORD } from './helpers';
import { fixtureDb } from '../support/drill-fixtures';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import type { Stage } from '../../src/lib/procedure/schema';
import { demoProcedure } from '../support/demo-procedures';

// The instructor's class results: a class of its own, learners who practise through the API, one drill
// on the spark plug procedure (written to the database, as no page of this branch makes drills).

const plug = demoProcedure('wren-160-spark-plug');
const STAGES: Stage[] = ['order', 'wrench', 'final-check'];
const torqueFirst = { sequence: ['check-gap', 'torque-plug', 'thread-by-hand', 'reconnect-lead'] };
const leadFirst = { sequence: ['reconnect-lead', 'check-gap', 'thread-by-hand', 'torque-plug'] };
const wrongUnit = { setting: 20, unit: 'N·m' };
const miscounted = { fastenersCounted: 2, crankTurns: 0, leftover: 0 };

// Each learner's submissions, in order: what makes the table and the step analysis worth reading.
const LEARNERS: { name: string; attempts: [Stage, unknown][] }[] = [
  { name: 'Ines Alvarez', attempts: [['order', 'right'], ['wrench', 'right'], ['final-check', 'right']] },
  { name: 'Jonas Berg', attempts: [['order', torqueFirst], ['order', 'right'], ['wrench', 'right'], ['final-check', 'right']] },
  { name: 'Kira Chen', attempts: [['order', torqueFirst], ['wrench', wrongUnit], ['final-check', 'right'], ['wrench', 'right']] },
  { name: 'Lars Dahl', attempts: [['order', leadFirst], ['wrench', wrongUnit], ['final-check', miscounted]] },
  { name: 'Mina Ek', attempts: [['order', 'right']] },
];

let classId = '';
let className = '';
const contexts: APIRequestContext[] = [];

test.beforeAll(async ({ baseURL }) => {
  const fixtures = fixtureDb();
  const session = async (body: object, path = '/api/auth/sign-in') => {
    const ctx = await request.newContext({ baseURL });
    contexts.push(ctx);
    const res = await ctx.post(path, { data: body });
    expect(res.ok()).toBe(true);
    return { ctx, user: (await res.json()) as { id: string } };
  };

  const teacher = await session({ email: 'instructor2@larkspur.example', password: DEMO_PASSWORD });
  className = `Small Engines E2E ${randomUUID().slice(0, 4)}`;
  const cls = await (await teacher.ctx.post('/api/classes', { data: { name: className } })).json();
  classId = cls.id;
  const { drillId } = await fixtures.insertDrill({ classId, slug: plug.slug, stages: STAGES, createdBy: teacher.user.id });

  for (const learner of LEARNERS) {
    const email = `e2e-${randomUUID().slice(0, 8)}@test.example`;
    const { ctx } = await session({ name: learner.name, email, password: 'correct horse battery' }, '/api/auth/sign-up');
    expect((await ctx.post('/api/classes/join', { data: { joinCode: cls.joinCode } })).ok()).toBe(true);
    const ids: string[] = [];
    for (const [stage, answer] of learner.attempts) {
      const res = await ctx.post('/api/attempts', {
        data: { procedure: plug.slug, stage, answer: answer === 'right' ? correctAnswer(plug, stage) : answer, clientId: randomUUID() },
      });
      expect(res.status()).toBe(201);
      ids.push((await res.json()).id);
    }
    await fixtures.linkAttempts(drillId, ids);
  }
  await fixtures.close();
});

/** Clicks a column's sort button until the column is sorted the wanted way (the cycle depends on the column type). */
async function sortBy(page: Page, name: RegExp, wanted: 'ascending' | 'descending') {
  const table = page.getByTestId('results-table');
  const header = table.getByRole('columnheader', { name });
  for (let i = 0; i < 3 && (await header.getAttribute('aria-sort')) !== wanted; i++) await header.getByRole('button').click();
  await expect(header).toHaveAttribute('aria-sort', wanted);
}

test.afterAll(async () => {
  for (const ctx of contexts) await ctx.dispose();
});

test('instructor reads the class results, the step analysis, an attempt review, and downloads the grades', async ({ page }) => {
  await signIn(page, 'instructor2@larkspur.example');
  await page.getByRole('link', { name: className }).click();
  await page.getByRole('link', { name: /Class results and grade export/ }).click();
  await expect(page).toHaveURL(new RegExp(`/teach/classes/${classId}/results$`));
  await expect(page.getByRole('heading', { name: 'Class results' })).toBeVisible();

  const table = page.getByTestId('results-table');
  const firstNames = () => table.locator('tbody tr th').allTextContents();
  await expect(table.locator('tbody tr')).toHaveCount(5);
  expect((await firstNames())[0]).toContain('Ines Alvarez');
  await shot(page, 'results-table');

  // Sort: by name descending, then by the Order stage's best score (highest first).
  await sortBy(page, /^Learner/, 'descending');
  expect((await firstNames())[0]).toContain('Mina Ek');
  await sortBy(page, /^Order/, 'descending');
  // Lars's order (lead first) scored lowest of all on its only try.
  expect((await firstNames()).at(-1)).toContain('Lars Dahl');

  // Search by name, then filter by the drill's standing.
  await page.getByLabel('Search by name').fill('kira');
  await expect(page.getByTestId('results-count')).toHaveText('1 of 5 learners');
  await expect(table.locator('tbody tr')).toHaveCount(1);
  await expect(table.locator('tbody tr').first()).toContainText('Kira Chen');
  await page.getByLabel('Search by name').fill('');
  await page.getByLabel('Show').selectOption({ label: `Passed: ${plug.title}` });
  // Ines and Jonas reached the pass mark on every stage; Kira's order is still at 75 %.
  await expect(page.getByTestId('results-count')).toHaveText('2 of 5 learners');
  await page.getByLabel('Show').selectOption({ label: 'Every learner' });
  await expect(page.getByTestId('results-count')).toHaveText('5 of 5 learners');

  // Step analysis: first tries of the four who tried every stage; the most missed step comes first.
  await page.getByRole('tab', { name: 'Step analysis' }).click();
  await expect(page.getByTestId('analysis-basis')).toContainText('4 learners have tried every stage (1 not yet, so not counted)');
  const steps = page.getByTestId('step-table');
  await expect(steps.locator('tbody tr')).toHaveCount(9);
  // Torque before threading, on the first try: Jonas and Kira of four → 50 %, first of the 50 % steps.
  await expect(steps.locator('tbody tr').first()).toContainText('Torque the spark plug to 20 N·m.');
  await expect(steps.locator('tbody tr').first()).toContainText('50 %');
  await expect(page.getByTestId('heat-map')).toContainText('Upper group');
  await shot(page, 'results-step-analysis');
  await page.getByLabel('Upper and lower groups').selectOption({ label: 'Top and bottom 27 %' });
  await expect(page.getByTestId('analysis-basis')).toContainText('Upper and lower groups: 1 learner each');

  // Attempt review: Jonas's latest order attempt, stepped through.
  await page.getByRole('tab', { name: 'Learners' }).click();
  await table.getByRole('link', { name: /^Jonas Berg, Order/ }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Jonas Berg: Order');
  await expect(page.getByTestId('frame-position')).toHaveText('1 of 4');
  await page.getByTestId('sibling-attempts').getByRole('link', { name: /Attempt 1/ }).click();
  await expect(page.getByTestId('attempt-score')).toContainText('3 of 4');
  const frame = page.getByTestId('review-frame');
  await frame.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByTestId('frame-position')).toHaveText('2 of 4');
  await expect(frame.getByRole('heading')).toHaveText('Step 2: Torque the spark plug to 20 N·m.');
  await expect(frame.getByRole('listitem')).toContainText('came before');
  await shot(page, 'attempt-review');
  await frame.getByRole('button', { name: 'Next' }).click();
  await frame.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByTestId('frame-position')).toHaveText('4 of 4');
  await expect(frame.getByRole('button', { name: 'Next' })).toBeDisabled();
  await frame.getByRole('button', { name: 'Previous' }).click();
  await expect(page.getByTestId('frame-position')).toHaveText('3 of 4');

  // Back to the results and download the grades.
  await page.getByRole('link', { name: `← Results of ${className}` }).click();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
  expect(download.suggestedFilename()).toMatch(/^results-small-engines-e2e-[a-z0-9]+-\d{4}-\d{2}-\d{2}\.csv$/);
  const text = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '');
  const [header, ...rows] = text.trimEnd().split('\r\n');
  expect(header!.startsWith('Learner,E-mail,Last activity,"Wren 160: install the spark plug v1, due ')).toBe(true);
  expect(header).toContain(': Order best %');
  expect(rows).toHaveLength(5);
  expect(rows[0]).toMatch(/^Ines Alvarez,/);
});
