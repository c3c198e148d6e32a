import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('anyone works out a compensated setting and a pass schedule, and copies it', async ({ page, context }) => {
  await context.grantPermissions(['clipboard-read', 'clipboard-write']);
  await page.goto('/');
  await page.getByRole('link', { name: 'Wrench calculator' }).click();
  await expect(page.getByRole('heading', { name: 'Wrench calculator' })).toBeVisible();
  await expect(page.getByTestId('cautions')).toContainText("engine maker's data");

  // US Army TM 1-1500-204-23-9, Figure 8-16: 300 in·lbf through a 4 in extension on a 10 in wrench → 214.29 (rounded to 214).
  await page.getByLabel('Torque spec').fill('300');
  await page.getByLabel('Spec unit').selectOption('in·lbf');
  await page.getByLabel('Extension or adapter').fill('4');
  await expect(page.getByText('An extension needs the wrench length (grip to drive)')).toBeVisible();
  await page.getByLabel('Length, grip to drive').fill('10');
  await page.getByLabel('Smallest mark (optional)').fill('1');
  await expect(page.getByTestId('wrench-setting')).toHaveText('214 in·lbf');
  await expect(page.getByTestId('wrench-steps')).toContainText('setting = T × L / (L + E) = 300 × 10 / (10 + 4) = 214.3 in·lbf');
  await expect(page.getByTestId('wrench-passes').locator('tbody tr')).toHaveCount(3);
  await expect(page.getByTestId('wrench-passes').locator('tbody tr').first()).toContainText('64 in·lbf');

  await page.getByRole('button', { name: '70 · 100 %' }).click();
  await expect(page.getByTestId('wrench-passes').locator('tbody tr')).toHaveCount(2);
  await page.getByLabel('Percent of the spec for each pass').fill('60, 30, 100');
  await expect(page.getByText('Each pass must be tighter than the one before')).toBeVisible();
  await page.getByLabel('Percent of the spec for each pass').fill('30, 60, 100');

  await page.getByRole('button', { name: 'Copy the result' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Copied' })).toBeVisible();
  const copied = await page.evaluate(() => navigator.clipboard.readText());
  expect(copied).toContain('Dial setting: 214 in·lbf');
  expect(copied).toContain('Pass 2, 60 %: set 129 in·lbf (reaches 180 in·lbf)');
  await shot(page, 'wrench-calculator');
});

test('a signed-in learner finds the calculator in the top bar; ft·lbf converts to in·lbf', async ({ page }) => {
  await signIn(page, 'learner2@larkspur.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Wrench' }).click();
  await page.getByLabel('Torque spec').fill('17');
  // Common practice, no source: 17 ft·lbf is set as 204 in·lbf.
  await expect(page.getByTestId('wrench-setting')).toHaveText('204 in·lbf');
  // NIST SP 811 (2008), App. B.9: 17 × 1.355818 = 23.05 N·m.
  await expect(page.getByTestId('wrench-conversions')).toContainText('23.05');
});
