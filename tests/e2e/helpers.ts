import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'wren-bench-160';

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sign in' })).toBeVisible();
}

/** Screenshots kept with the test output, named for what they show. */
export function shot(page: Page, name: string) {
  return page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: true });
}

/**
 * Waits until every React island on the page has hydrated: Astro drops the island's `ssr` attribute then.
 * A control changed before that is shown but not yet in React's state.
 */
export async function islandsReady(page: Page) {
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0);
}
