import { expect, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { DEMO_ACCOUNTS } from '@/db/seed/demo-data';

export type DemoRole = 'admin' | 'editor' | 'reviewer' | 'reader';

export function demoAccount(role: DemoRole) {
  const account = DEMO_ACCOUNTS.find((a) => a.role === role);
  if (!account) throw new Error(`no demo ${role}`);
  return account;
}

export const storageStateFor = (role: DemoRole) => `tests/e2e/.auth/${role}.json`;

export async function signInWithPassword(page: Page, email: string, password: string) {
  await page.goto('/signin');
  const form = page.getByRole('form', { name: 'Sign in with password' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

let counter = 0;
export function uniqueEmail(prefix: string) {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}@students.example`;
}

/** Signs up a fresh reader in a new browser context (tests that sign out, promote or disable use these). */
export async function signUpNewReader(browser: Browser, prefix = 'reader') {
  const context = await browser.newContext();
  const page = await context.newPage();
  const email = uniqueEmail(prefix);
  const password = 'a long test passphrase';
  await page.goto('/signup');
  await page.getByLabel('Name shown on your reviews').fill(`Test ${prefix}`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByTestId('signed-in-as')).toContainText(`Test ${prefix}`);
  return { context, page, email, password };
}

export async function resetRateLimits(request: APIRequestContext) {
  const response = await request.post('/api/test/reset-rate-limits');
  expect(response.status()).toBe(204);
}
