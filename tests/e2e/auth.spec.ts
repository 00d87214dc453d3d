import { expect, test } from '@playwright/test';
import { demoAccount, resetRateLimits, signInWithPassword, signUpNewReader, storageStateFor, uniqueEmail } from './support';

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

test('sign up makes a reader, and sign out ends the session even for a replayed cookie', async ({ browser }) => {
  const { context, page } = await signUpNewReader(browser, 'signup');
  await expect(page.getByTestId('signed-in-as')).toContainText('Reader');
  const savedState = await context.storageState();

  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();

  // Replaying the old session cookie (security-tests SE-03) must not sign anyone in.
  const replay = await browser.newContext({ storageState: savedState });
  const replayPage = await replay.newPage();
  await replayPage.goto('/');
  await expect(replayPage.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await expect(replayPage.getByTestId('signed-in-as')).toHaveCount(0);
  await replay.close();
  await context.close();
});

test('bad sign-up input gets clear messages and creates nothing', async ({ browser }) => {
  const admin = await browser.newContext({ storageState: storageStateFor('admin') });
  const adminPage = await admin.newPage();
  await adminPage.goto('/admin/users');
  const rowsBefore = await adminPage.getByTestId('user-table').locator('tbody tr').count();

  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto('/signup');
  await page.getByLabel('Name shown on your reviews').fill('Bad Input');
  await page.getByLabel('E-mail').fill('not-an-address');
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByTestId('signup-email-error')).toContainText('e-mail address');
  await expect(page.getByTestId('signup-password-error')).toContainText('at least 8 characters');

  // A duplicate account (the demo reader's address) is refused by the server.
  await page.getByLabel('E-mail').fill(demoAccount('reader').email.toUpperCase());
  await page.getByLabel('Password').fill('another long passphrase');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByTestId('signup-email-error')).toContainText('already uses this e-mail');
  await expect(page.getByTestId('signed-in-as')).toHaveCount(0);

  await adminPage.reload();
  await expect(adminPage.getByTestId('user-table').locator('tbody tr')).toHaveCount(rowsBefore);
  await admin.close();
  await context.close();
});

test('sign in with a password; a wrong password gets a message that does not reveal the account', async ({ page }) => {
  const reviewer = demoAccount('reviewer');
  await signInWithPassword(page, reviewer.email, 'wrong password here');
  const wrong = await page.getByTestId('form-message').textContent();
  await signInWithPassword(page, uniqueEmail('nobody'), 'wrong password here');
  await expect(page.getByTestId('form-message')).toHaveText(wrong ?? '');

  await signInWithPassword(page, reviewer.email, reviewer.password);
  await expect(page.getByTestId('signed-in-as')).toContainText(reviewer.name);
  await expect(page.getByRole('link', { name: 'Logbook' })).toBeVisible();
});

test('repeated failures on one account are rate limited', async ({ browser, request }) => {
  const { context, email } = await signUpNewReader(browser, 'limited');
  await context.close();
  const page = await browser.newPage();
  for (let i = 0; i < 5; i++) {
    await signInWithPassword(page, email, `wrong guess ${i}`);
    await expect(page.getByTestId('form-message')).toBeVisible();
  }
  await signInWithPassword(page, email, 'a long test passphrase');
  await expect(page.getByTestId('form-message')).toContainText('Too many failed attempts');
  await resetRateLimits(request);
  await page.close();
});

test('sign in with a magic link read from the captured mail; the link is spent only by the button', async ({ browser, request }) => {
  const { context, page, email } = await signUpNewReader(browser, 'magic');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.goto('/signin');
  await page.getByRole('form', { name: 'Sign in with an e-mail link' }).getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
  await expect(page.getByTestId('magic-link-message')).toContainText('sign-in link is on its way');

  const admin = await browser.newContext({ storageState: storageStateFor('admin') });
  const outbox = await admin.newPage();
  await outbox.goto('/admin/outbox');
  const body = await outbox.locator(`[data-to="${email}"]`).first().getByTestId('outbox-body').textContent();
  const link = body?.match(/https?:\/\/\S+\/signin\/confirm\?token=[\w%-]+/)?.[0];
  expect(link).toBeTruthy();
  await admin.close();

  // A mail scanner fetching the link (GET and HEAD) must neither sign in nor use the link up.
  const scanned = await request.get(link!);
  expect(scanned.status()).toBe(200);
  await request.head(link!);

  await page.goto(link!);
  await expect(page.getByRole('heading', { name: 'Confirm sign-in' })).toBeVisible();
  await page.getByRole('button', { name: 'Sign in to Trailbench' }).click();
  await expect(page.getByTestId('signed-in-as')).toContainText('Test magic');

  await page.goto(link!);
  await expect(page.getByRole('heading', { name: 'This link no longer works' })).toBeVisible();
  await context.close();
});

test.describe('a reader is refused the review desk and admin pages', () => {
  test.use({ storageState: storageStateFor('reader') });

  for (const path of ['/desk', '/admin/users', '/admin/outbox']) {
    test(`403 on ${path}`, async ({ page }) => {
      const response = await page.goto(path);
      expect(response?.status()).toBe(403);
      await expect(page.getByRole('heading', { name: 'Not open to your role' })).toBeVisible();
      await expect(page.getByTestId('user-table')).toHaveCount(0);
      await expect(page.getByTestId('outbox')).toHaveCount(0);
    });
  }

  test('no links to areas the role may not use', async ({ page }) => {
    await page.goto('/');
    await expect(page.getByTestId('signed-in-as')).toContainText('Reader');
    await expect(page.getByRole('link', { name: 'Review desk' })).toHaveCount(0);
    await expect(page.getByRole('link', { name: 'Admin' })).toHaveCount(0);
  });
});

test('anonymous visitors are sent to sign in from guarded areas', async ({ page }) => {
  for (const path of ['/logbook', '/desk', '/admin/users']) {
    await page.goto(path);
    await expect(page).toHaveURL(new RegExp(`/signin\\?next=${encodeURIComponent(path).replace(/\//g, '%2F')}`));
  }
});

test('an admin promotes a new user to reviewer; the old session ends and the new role applies', async ({ browser }) => {
  const newcomer = await signUpNewReader(browser, 'promoted');
  const admin = await browser.newContext({ storageState: storageStateFor('admin') });
  const adminPage = await admin.newPage();
  await adminPage.goto('/admin/users');
  const row = adminPage.locator(`tr[data-email="${newcomer.email}"]`);
  await row.getByLabel(`Role of ${newcomer.email}`).selectOption('reviewer');
  await row.getByRole('button', { name: 'Save role' }).click();
  await expect(row.getByRole('status')).toHaveText('Saved.');
  await adminPage.reload();
  await expect(adminPage.locator(`tr[data-email="${newcomer.email}"]`).getByTestId('role-cell')).toHaveText('Reviewer');
  await admin.close();

  await newcomer.page.goto('/');
  await expect(newcomer.page.getByTestId('signed-in-as')).toHaveCount(0);
  await signInWithPassword(newcomer.page, newcomer.email, newcomer.password);
  await expect(newcomer.page.getByTestId('signed-in-as')).toContainText('Reviewer');
  const logbook = await newcomer.page.goto('/logbook');
  expect(logbook?.status()).toBe(200);
  await newcomer.context.close();
});

test('disabling an account ends its session and refuses sign-in', async ({ browser }) => {
  const member = await signUpNewReader(browser, 'disabled');
  const admin = await browser.newContext({ storageState: storageStateFor('admin') });
  const adminPage = await admin.newPage();
  await adminPage.goto('/admin/users');
  const row = adminPage.locator(`tr[data-email="${member.email}"]`);
  await row.getByRole('button', { name: 'Disable' }).click();
  await expect(row.getByRole('status')).toHaveText('Saved.');
  await admin.close();

  await member.page.goto('/');
  await expect(member.page.getByTestId('signed-in-as')).toHaveCount(0);
  await signInWithPassword(member.page, member.email, member.password);
  await expect(member.page.getByTestId('form-message')).toContainText('do not match an account that can sign in');
  await member.context.close();
});

test('pages carry the security headers', async ({ request }) => {
  const response = await request.get('/');
  const headers = response.headers();
  expect(headers['content-security-policy']).toContain("object-src 'none'");
  expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
  expect(headers['x-content-type-options']).toBe('nosniff');
  expect(headers['referrer-policy']).toBeTruthy();
  expect(headers['x-powered-by']).toBeUndefined();
});
