import { expect, test, type Page } from '@playwright/test';
import { demoProcedure } from '../support/demo-procedures';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { boltLabel } from '../../src/components/trainer/labels';
import { nextBolts } from '../../src/lib/patterns';
import { groupBoltPositions } from '../../src/lib/scoring/pattern';
import { shot, signIn, signOut } from './helpers';
import { checkStage, openStage, openTrainer, press, signUpLearner } from './trainer-steps';

// The 3D views render in software here (a few frames a second); give these tests room.
test.describe.configure({ timeout: 180_000 });

const sump = demoProcedure('wren-160-sump');
const group = sump.fastenerGroups[0]!;
const bolts = groupBoltPositions(group, Object.fromEntries(sump.anchors.map((a) => [a.key, a.position])));

/** Pattern by keyboard: the right torques, pass 1 tightened round the circle (the mistake), pass 2 right. */
async function patternWithMistake(page: Page) {
  const reference = correctAnswer(sump, 'pattern') as { passes: { torque: number; sequence: string[] }[] };
  const passes = reference.passes.map((p, i) => (i === 0 ? { ...p, sequence: group.bolts.map((b) => b.key) } : p));
  for (const [i, pass] of passes.entries()) {
    await press(page, page.getByRole('button', { name: new RegExp(`^Pass ${i + 1} of ${passes.length}`) }));
    await page.getByLabel(`Torque for pass ${i + 1}`, { exact: false }).fill(String(pass.torque));
    for (const bolt of pass.sequence) await press(page, page.getByRole('button', { name: new RegExp(`^${boltLabel(bolt)},`) }));
  }
}

/** The bolts the question says are already tightened, read from its words ("… in order: Bolt 6, Bolt 2."). */
async function tightenedSoFar(page: Page): Promise<string[]> {
  const text = await page.getByTestId('question-context').innerText();
  const list = /in order: ([^.]*)\./.exec(text)?.[1];
  return list ? list.split(', ').map((label) => `bolt-${label.replace('Bolt ', '')}`) : [];
}

test('a Pattern mistake comes back in Rework as a bolt question; answered right it moves to a later date', async ({ page }) => {
  await signUpLearner(page);
  const learnerId = ((await (await page.request.get('/api/me')).json()) as { id: string }).id;
  await openTrainer(page, 'wren-160-sump');
  await openStage(page, 'pattern');
  await patternWithMistake(page);
  await expect(await checkStage(page)).toHaveText(/^(✗ )?Not yet/);

  // My bench says a missed step is due and leads to Rework, where the missed pass is due today.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My bench' }).click();
  await expect(page.getByTestId('rework-card')).toContainText('1 missed step is due now.');
  await shot(page, 'learn-rework-card');
  await page.getByTestId('rework-card').getByRole('link', { name: 'Rework (1 due)' }).click();
  await expect(page.getByRole('heading', { name: 'Rework', level: 1 })).toBeVisible();
  const row = page.getByTestId('due-today').getByTestId('rework-item').filter({ hasText: 'Bolt order in pass 1' });
  await expect(row).toContainText('Due now');
  await expect(row).toContainText('Tightening pattern');
  const dueBefore = new Date((await row.getAttribute('data-due'))!);
  await shot(page, 'rework-due');

  await page.getByRole('button', { name: 'Start rework' }).click();
  const question = page.getByTestId('rework-question');
  await expect(question.getByRole('heading', { name: 'Which bolt comes next in pass 1?' })).toBeFocused();

  // Worked out as the Pattern scorer would: any bolt the cross rule allows next is right.
  const done = await tightenedSoFar(page);
  const right = nextBolts(bolts, group.axis, group.rule, done)[0]!;

  // On the model: click the bolt where it is drawn; the list follows the pick.
  await page.setViewportSize({ width: 1280, height: 1100 });
  await page.getByTestId('question-scene').scrollIntoViewIfNeeded();
  await page.waitForFunction(() => Boolean((window as unknown as { __bwScene?: unknown }).__bwScene), null, { timeout: 60_000 });
  await expect(async () => {
    const point = await page.evaluate((k) => (window as unknown as { __bwScene: { project(k: string): { x: number; y: number } | null } }).__bwScene.project(k), right);
    expect(point).not.toBeNull();
    await page.mouse.click(point!.x, point!.y);
    await expect(question.getByRole('radio', { name: boltLabel(right), exact: true })).toBeChecked({ timeout: 2_000 });
  }).toPass({ timeout: 30_000 });
  await shot(page, 'rework-question');

  await question.getByRole('button', { name: 'Check answer' }).click();
  const verdict = page.getByTestId('verdict');
  await expect(verdict.getByRole('heading')).toHaveText(/✓ Right/);
  const nextDue = verdict.getByTestId('next-due');
  await expect(nextDue).toContainText(/Comes back (today|tomorrow|\w{3} \d+ \w{3}) at \d\d:\d\d \(in /);
  const dueAfter = new Date((await nextDue.getAttribute('data-due'))!);
  expect(dueAfter.getTime()).toBeGreaterThan(dueBefore.getTime());
  expect(dueAfter.getTime()).toBeGreaterThan(Date.now());
  await shot(page, 'rework-answered');

  // The list shows the item at its new, later date, no longer due now.
  const moved = page.getByTestId('rework-item').filter({ hasText: 'Bolt order in pass 1' });
  await expect(moved).toHaveAttribute('data-due', dueAfter.toISOString());
  await expect(moved).toContainText(/Due (today|tomorrow|\w{3} \d+ \w{3}) at \d\d:\d\d/);
  await expect(moved).not.toContainText('Due now');
  await page.getByRole('button', { name: 'Done' }).click();
  await expect(page.getByRole('heading', { name: 'Nothing to answer right now' })).toBeVisible();
  await shot(page, 'rework-after');

  // Progress: the pattern attempt on the chart, the missed step not mastered yet, practised today.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Progress' }).click();
  const progress = page.getByTestId('progress');
  await expect(progress.getByTestId('streak')).toContainText('1 day');
  await expect(progress.getByTestId('streak')).toContainText('Practised today');
  await expect(progress.getByTestId('rework-standing')).toContainText('0 mastered');
  await expect(progress.getByTestId('rework-standing')).toContainText('1 still learning');
  const card = progress.getByTestId('procedure-progress').filter({ hasText: 'Wren 160: install the sump' });
  await expect(card.locator('canvas')).toBeVisible();
  await expect(card.getByRole('row', { name: /Pattern/ })).toContainText('1');
  await shot(page, 'progress-learner');

  // The instructor of the learner's class sees the same from the class roster.
  expect((await page.request.post('/api/classes/join', { data: { joinCode: 'WREN4SMA' } })).status()).toBe(200);
  await signOut(page);
  await signIn(page, 'instructor@larkspur.example');
  await page.goto('/teach');
  await page.getByRole('link', { name: 'Small Engines I' }).first().click();
  await page.getByTestId('roster').locator(`a[href="/teach/learners/${learnerId}/progress"]`).click();
  await expect(page.getByRole('heading', { name: 'New Trainee: progress' })).toBeVisible();
  await expect(page.getByTestId('rework-standing')).toContainText('1 still learning');
  await expect(page.getByTestId('procedure-progress').locator('canvas')).toBeVisible();
  await shot(page, 'progress-instructor');
});

test('a wrong pin comes back as a hole question; answered wrong it returns within minutes, with the right answer shown', async ({ page }) => {
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-sump');
  await openStage(page, 'pins');
  // Only the 10 mm decoy, into dowel hole A.
  await press(page, page.getByRole('button', { name: /^10 mm dowel pin/ }));
  await press(page, page.locator('li', { hasText: 'Dowel hole A' }).getByRole('button', { name: 'Put pin here' }));
  await expect(await checkStage(page)).toHaveText(/^(✗ )?Not yet/);

  await page.goto('/rework');
  await expect(page.getByTestId('due-today').getByTestId('rework-item').filter({ hasText: 'Dowel hole A' })).toContainText('Wrong pin or hole');
  await page.getByRole('button', { name: 'Start rework' }).click();
  // Three items from one attempt (hole A, hole B left empty, the decoy used): hole A comes first.
  const question = page.getByTestId('rework-question');
  await expect(question).toContainText('Question 1 of 3');
  await expect(question.getByTestId('question-context')).toHaveText('Dowel hole A · locating · 8\u00a0mm');
  await expect(question.getByRole('heading', { name: 'Which pin goes in this hole?' })).toBeVisible();
  await expect(page.getByTestId('question-scene')).toBeVisible({ timeout: 60_000 });
  // On the model the hole asked about is named and picked out.
  await expect(page.locator('[data-scene-label="focus"]')).toHaveText('? Dowel hole A', { timeout: 60_000 });
  await question.getByRole('radio', { name: /10 mm dowel pin/ }).check();
  await question.getByRole('button', { name: 'Show a hint' }).click();
  await expect(question.getByTestId('hint')).toContainText('8 mm across');
  await shot(page, 'rework-hole-question');
  await question.getByRole('button', { name: 'Check answer' }).click();

  const verdict = page.getByTestId('verdict');
  await expect(verdict.getByRole('heading')).toHaveText(/✗ Not this time/);
  await expect(verdict).toContainText('The right answer: 8 mm dowel pin');
  await expect(verdict).toContainText('10 mm across; this hole takes 8 mm');
  await expect(question.locator('label', { hasText: '8 mm dowel pin' })).toContainText('✓ Right');
  await expect(question.locator('label', { hasText: '10 mm dowel pin' })).toContainText('✗ Your pick');
  await expect(verdict.getByTestId('next-due')).toContainText(/\(in 1 minute\)/);
  await shot(page, 'rework-hole-wrong');
});
