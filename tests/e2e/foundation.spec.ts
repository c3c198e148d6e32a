import { expect, test } from '@playwright/test';
import { shot, signIn, signOut } from './helpers';

test('landing page says what the product does and shows the cautions', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Rehearse the repair');
  await expect(page.getByText('Disconnect and ground the spark plug lead.')).toBeVisible();
  await shot(page, 'landing');
});

test('instructor creates a class, a learner joins it with the code, both sign out', async ({ page }) => {
  await signIn(page, 'instructor@larkspur.example');
  await expect(page).toHaveURL(/\/teach$/);
  await expect(page.getByTestId('signed-in-as')).toContainText('Dana Whitcombe');
  await expect(page.getByTestId('class-list')).toContainText('Small Engines I');

  const className = `Small Engines ${Date.now() % 100000}`;
  await page.getByLabel('Class name').fill(className);
  await page.getByRole('button', { name: 'Create class' }).click();
  const code = (await page.getByTestId('new-join-code').textContent())?.trim() ?? '';
  expect(code).toMatch(/^[A-Z2-9]{8}$/);
  await expect(page.getByTestId('class-list')).toContainText(className);
  await shot(page, 'instructor-home');
  await signOut(page);

  await signIn(page, 'learner1@larkspur.example');
  await expect(page).toHaveURL(/\/learn$/);
  await page.getByLabel('Join code').fill(code);
  await page.getByRole('button', { name: 'Join class' }).click();
  await expect(page.getByRole('status')).toContainText(`You joined ${className}`);
  await expect(page.getByTestId('my-classes')).toContainText(className);
  await shot(page, 'learner-home');
  await signOut(page);

  // The instructor sees the learner on the class roster.
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: className }).click();
  await expect(page.getByTestId('roster')).toContainText('Ava Lindqvist');
  await shot(page, 'class-roster');
});

test('a wrong password shows a form message, and a bad join code a field error', async ({ page }) => {
  await signIn(page, 'learner2@larkspur.example', 'not-the-password');
  await expect(page.getByRole('alert')).toContainText('E-mail or password is wrong');
  await signIn(page, 'learner2@larkspur.example');
  await page.getByLabel('Join code').fill('ZZZZZZZZ');
  await page.getByRole('button', { name: 'Join class' }).click();
  await expect(page.getByRole('alert')).toContainText('No class has this join code');
});

test('admin sees people and changes a role', async ({ page }) => {
  await signIn(page, 'admin@larkspur.example');
  await expect(page).toHaveURL(/\/admin\/users$/);
  const row = page.getByRole('row', { name: /learner8@larkspur\.example/ });
  await row.getByLabel('Role of Hugo Marchetti').selectOption('instructor');
  await row.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByRole('status')).toContainText('Hugo Marchetti is now instructor');
  await shot(page, 'admin-people');
  // Put it back so the demo data stays as the README describes.
  await page.getByRole('row', { name: /learner8@larkspur\.example/ }).getByLabel('Role of Hugo Marchetti').selectOption('learner');
  await page.getByRole('row', { name: /learner8@larkspur\.example/ }).getByRole('button', { name: 'Save' }).click();
  await expect(page.getByRole('status')).toContainText('Hugo Marchetti is now learner');
});

test('a learner is sent to sign in first and comes back to the page asked for', async ({ page }) => {
  await page.goto('/learn');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Flearn$/);
  await page.getByLabel('E-mail').fill('learner3@larkspur.example');
  await page.getByLabel('Password').fill('wren-bench-160');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/learn$/);
});

test('works on a tablet-sized screen', async ({ page }) => {
  await page.setViewportSize({ width: 820, height: 1180 });
  await signIn(page, 'learner4@larkspur.example');
  const button = page.getByRole('button', { name: 'Join class' });
  const box = await button.boundingBox();
  // Large touch targets for a workbench tablet: at least 44 px tall.
  expect(box!.height).toBeGreaterThanOrEqual(44);
  await shot(page, 'learner-home-tablet');
});
