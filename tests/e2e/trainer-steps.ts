import { expect, type Page } from '@playwright/test';
import { randomUUID } from 'node:crypto';
import type { Procedure, Stage } from '../../src/lib/procedure/schema';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { boltLabel, holeLabel } from '../../src/components/trainer/labels';

// Drives the trainer's list paths the way a keyboard user would: focus a control, press a key.

const STAGE_TAB: Record<Stage, string> = { order: 'Order', pins: 'Pins', pattern: 'Pattern', wrench: 'Wrench', 'final-check': 'Final check' };

/** A brand-new learner, signed in for this page's browser context. */
export async function signUpLearner(page: Page): Promise<string> {
  const email = `trainee-${randomUUID().slice(0, 8)}@test.example`;
  const res = await page.request.post('/api/auth/sign-up', { data: { name: 'New Trainee', email, password: 'bench-practice-1' } });
  expect(res.status()).toBe(201);
  return email;
}

export async function openTrainer(page: Page, slug: string) {
  await page.goto(`/train/${slug}`);
  await expect(page.getByRole('tablist', { name: 'Stages' })).toBeVisible();
}

export async function press(page: Page, locator: ReturnType<Page['locator']>, key = 'Enter') {
  await locator.focus();
  await page.keyboard.press(key);
}

export async function openStage(page: Page, stage: Stage) {
  // Tabs read "1. Order", "2. Pins" …
  const tab = page.getByRole('tab', { name: new RegExp(`^\\d+\\. ${STAGE_TAB[stage]}`) });
  await press(page, tab);
  await expect(tab).toHaveAttribute('aria-selected', 'true');
}

/** The save status line, by state: idle, saving, saved or offline. */
export const saveStatus = (page: Page, status: 'saved' | 'offline') => page.locator(`[data-save-status="${status}"]`);

export async function placeStep(page: Page, text: string) {
  await press(page, page.locator('li', { hasText: text }).getByRole('button', { name: 'Place next' }));
}

/** Enters the reference answer for a stage through the panel, by keyboard only. */
export async function answerStage(page: Page, procedure: Procedure, stage: Stage) {
  const answer = correctAnswer(procedure, stage) as Record<string, unknown>;
  switch (stage) {
    case 'order':
      for (const key of answer.sequence as string[]) await placeStep(page, procedure.steps.find((s) => s.key === key)!.text);
      break;
    case 'pins':
      for (const seat of answer.placements as { part: string; anchor: string }[]) {
        const name = procedure.parts.find((p) => p.key === seat.part)!.name;
        await press(page, page.getByRole('button', { name: new RegExp(`^${escape(name)}`) }));
        const anchor = procedure.anchors.find((a) => a.key === seat.anchor)!;
        await press(page, page.locator('li', { hasText: holeLabel(anchor) }).getByRole('button', { name: 'Put pin here' }));
      }
      break;
    case 'pattern': {
      const passes = answer.passes as { torque: number; sequence: string[] }[];
      for (const [i, pass] of passes.entries()) {
        await press(page, page.getByRole('button', { name: new RegExp(`^Pass ${i + 1} of ${passes.length}`) }));
        await page.getByLabel(`Torque for pass ${i + 1}`, { exact: false }).fill(String(round(pass.torque, 2)));
        for (const bolt of pass.sequence) await press(page, page.getByRole('button', { name: new RegExp(`^${boltLabel(bolt)},`) }));
      }
      break;
    }
    case 'wrench':
      await page.getByLabel('Setting', { exact: true }).fill(String(round(answer.setting as number, 1)));
      await page.getByLabel('Unit', { exact: true }).selectOption(answer.unit as string);
      break;
    case 'final-check': {
      await page.getByLabel('Fasteners installed').fill(String(answer.fastenersCounted));
      await page.getByLabel('Left over in the tray').fill('0');
      const quarter = page.getByRole('button', { name: /Turn crankshaft ¼ turn/ });
      for (let i = 0; i < (answer.crankTurns as number) * 4; i++) await press(page, quarter);
      break;
    }
  }
}

/** Sends the stage to the server and waits for its verdict heading. */
export async function checkStage(page: Page) {
  await press(page, page.getByRole('button', { name: /^Check this stage/ }));
  return page.getByRole('heading', { name: /^(✓ )?(Passed|Not yet)/ });
}

const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
