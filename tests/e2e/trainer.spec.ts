import { expect, test, type Page } from '@playwright/test';
import { demoProcedure } from '../support/demo-procedures';
import { boltLabel } from '../../src/components/trainer/labels';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { shot } from './helpers';
import { answerStage, checkStage, openStage, openTrainer, placeStep, press, saveStatus, signUpLearner } from './trainer-steps';

// The 3D view renders in software here (a few frames a second); give each trainer test room.
test.describe.configure({ timeout: 180_000 });

const SLUGS = ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug'];

for (const slug of SLUGS) {
  test(`${slug}: every stage done by keyboard with the right answer gets full marks`, async ({ page }) => {
    const procedure = demoProcedure(slug);
    await signUpLearner(page);
    await openTrainer(page, slug);
    await expect(page.getByTestId('cautions')).toContainText('spark plug lead');
    for (const stage of procedure.stages) {
      await openStage(page, stage);
      await answerStage(page, procedure, stage);
      const verdict = await checkStage(page);
      await expect(verdict).toHaveText(/^(✓ )?Passed/);
      await expect(verdict).toContainText(/(\d+) of \1$/);
      if (slug === 'wren-160-sump') await shot(page, `trainer-sump-${stage}`);
    }
    await expect(page.getByRole('tab', { name: /Passed/ })).toHaveCount(procedure.stages.length);
  });
}

test('a deliberate mistake in Order is named in the feedback and shown on the model', async ({ page }) => {
  const procedure = demoProcedure('wren-160-sump');
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-sump');
  // The gasket goes on before the dowel pins: the one mistake.
  const order = (correctAnswer(procedure, 'order') as { sequence: string[] }).sequence;
  const wrong = ['fit-gasket', ...order.filter((k) => k !== 'fit-gasket')];
  for (const key of wrong) await placeStep(page, procedure.steps.find((s) => s.key === key)!.text);
  const verdict = await checkStage(page);
  await expect(verdict).toHaveText(/^(✗ )?Not yet/);
  const results = page.getByRole('list', { name: 'Order results' });
  await expect(results).toContainText('came before');
  await expect(results).toContainText(/dowel pin/i);
  // On the model: the gasket carries a ✗ label.
  await expect(page.getByTestId('scene')).toContainText('✗');
  await shot(page, 'trainer-order-mistake');

  // Try again clears the stage.
  await press(page, page.getByRole('button', { name: 'Try again' }));
  await expect(page.getByRole('heading', { name: /Your order/ })).toContainText('0 placed');
});

test('work in progress is saved to the server and restored after a reload', async ({ page }) => {
  const procedure = demoProcedure('wren-160-sump');
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-sump');
  const first = (correctAnswer(procedure, 'order') as { sequence: string[] }).sequence.slice(0, 3);
  for (const key of first) await placeStep(page, procedure.steps.find((s) => s.key === key)!.text);
  await expect(saveStatus(page, 'saved')).toBeVisible({ timeout: 15_000 });

  // Clear this device's copy, so what comes back can only come from the server.
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await expect(page.getByRole('heading', { name: /Your order/ })).toContainText('3 placed', { timeout: 30_000 });
  for (const key of first) {
    await expect(page.locator('ol').getByText(procedure.steps.find((s) => s.key === key)!.text)).toBeVisible();
  }
});

test('a network failure keeps the work on the device with a visible status, then saves it', async ({ page, context }) => {
  const procedure = demoProcedure('wren-160-spark-plug');
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-spark-plug');
  await context.setOffline(true);
  await placeStep(page, procedure.steps.find((s) => s.key === 'check-gap')!.text);
  await expect(saveStatus(page, 'offline')).toContainText('Offline: kept on this device, retrying', { timeout: 15_000 });
  await context.setOffline(false);
  await expect(saveStatus(page, 'saved')).toBeVisible({ timeout: 45_000 });
});

async function sceneReady(page: Page) {
  // project() answers in viewport pixels: the whole canvas must be on screen before clicking into it.
  await page.setViewportSize({ width: 1280, height: 1100 });
  await page.getByTestId('scene').scrollIntoViewIfNeeded();
  await expect(page.getByTestId('scene')).toBeVisible();
  await page.waitForFunction(() => Boolean((window as unknown as { __bwScene?: unknown }).__bwScene), null, { timeout: 60_000 });
}

async function projected(page: Page, key: string): Promise<{ x: number; y: number }> {
  const point = await page.evaluate((k) => (window as unknown as { __bwScene: { project(k: string): { x: number; y: number } | null } }).__bwScene.project(k), key);
  if (!point) throw new Error(`no screen position for ${key}`);
  return point;
}

test('the canvas itself: clicking bolts where they are drawn numbers them in order', async ({ page }) => {
  const procedure = demoProcedure('wren-160-sump');
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-sump');
  await openStage(page, 'pattern');
  await sceneReady(page);
  const sequence = (correctAnswer(procedure, 'pattern') as { passes: { sequence: string[] }[] }).passes[0]!.sequence.slice(0, 4);
  for (const bolt of sequence) {
    const { x, y } = await projected(page, bolt);
    await page.mouse.click(x, y);
    await expect(page.getByRole('button', { name: new RegExp(`^${boltLabel(bolt)},.*number \\d+ in pass 1`) })).toBeVisible();
  }
  for (const [i, bolt] of sequence.entries()) {
    await expect(page.getByRole('button', { name: new RegExp(`^${boltLabel(bolt)},.*number ${i + 1} in pass 1$`) })).toBeVisible();
  }
  const drawCalls = await page.evaluate(() => (window as unknown as { __bwScene: { drawCalls(): number } }).__bwScene.drawCalls());
  expect(drawCalls).toBeLessThanOrEqual(60);
  await shot(page, 'trainer-canvas-bolts');
});

test('the canvas itself: a pin picked from the tray goes into the hole clicked', async ({ page }) => {
  await signUpLearner(page);
  await openTrainer(page, 'wren-160-sump');
  await openStage(page, 'pins');
  await sceneReady(page);
  await press(page, page.getByRole('button', { name: /^8 mm dowel pin/ }));
  const { x, y } = await projected(page, 'dowel-hole-a');
  await page.mouse.click(x, y);
  await expect(page.locator('li', { hasText: 'Dowel hole A' }).filter({ hasText: 'Holds: 8 mm dowel pin' })).toBeVisible();
  await shot(page, 'trainer-canvas-pin');
});

test('the canvas itself: clicking parts places their steps', async ({ page }) => {
  const slug = 'wren-160-spark-plug';
  const procedure = demoProcedure(slug);
  await signUpLearner(page);
  await openTrainer(page, slug);
  await sceneReady(page);
  const hoverLabel = page.locator('[data-scene-label="hover"]');
  const heading = page.getByRole('heading', { name: /Your order/ });

  // The step's first part a person can point at: a placed part sits home, which can be inside a part
  // still out (the plug inside the raised head), so a hidden part gives way to the step's next one.
  const pointAtStep = async (parts: string[]) => {
    for (const part of parts) {
      const name = procedure.parts.find((p) => p.key === part)!.name;
      try {
        await expect(async () => {
          // Off the canvas first, so the label shows what is under the pointer now, not before.
          await page.mouse.move(5, 5);
          await expect(hoverLabel).toHaveCount(0);
          const { x, y } = await projected(page, part);
          await page.mouse.move(x, y);
          await expect(hoverLabel).toHaveText(name, { timeout: 1_500 });
        }).toPass({ timeout: 10_000 });
        return { part, name };
      } catch {
        // Not in view: try the step's next part.
      }
    }
    throw new Error(`no part of [${parts.join(', ')}] can be pointed at`);
  };

  const order = (correctAnswer(procedure, 'order') as { sequence: string[] }).sequence;
  let chosen = 0;
  for (const [i, key] of order.entries()) {
    const step = procedure.steps.find((s) => s.key === key)!;
    const { part, name } = await pointAtStep(step.parts);
    const { x, y } = await projected(page, part);
    await page.mouse.click(x, y);
    // Several steps left on the part: a chooser beside it; only one: placed at once.
    const choice = page.getByRole('button', { name: `Place: ${step.text}` });
    const placed = heading.filter({ hasText: `(${i + 1} placed)` });
    await expect(choice.or(placed)).toBeVisible();
    if (await choice.isVisible()) {
      const chooser = page.getByRole('dialog', { name: `Steps for ${name}` });
      // Ready for the keyboard: the chooser's first button has focus.
      await expect(chooser.getByRole('button').first()).toBeFocused();
      if (chosen === 0) {
        // Viewport only: a full-page capture resizes the page, and the two-column layout can keep the width it had meanwhile.
        await page.screenshot({ path: 'test-results/screens/trainer-canvas-order-chooser.png' });
        // Escape puts the chooser away without placing anything; a second click brings it back.
        await page.keyboard.press('Escape');
        await expect(chooser).toHaveCount(0);
        await expect(heading).toContainText(`(${i} placed)`);
        await page.mouse.click(x, y);
        await expect(chooser.getByRole('button').first()).toBeFocused();
        await choice.click();
      } else {
        await press(page, choice);
      }
      chosen += 1;
    }
    await expect(placed).toBeVisible();
    await expect(page.getByRole('dialog')).toHaveCount(0);
  }
  // Both paths ran: at least one step picked from a chooser, at least one placed straight away.
  expect(chosen).toBeGreaterThan(0);
  expect(chosen).toBeLessThan(order.length);
  const verdict = await checkStage(page);
  await expect(verdict).toHaveText(/^(✓ )?Passed/);
  await shot(page, 'trainer-canvas-order');
});
