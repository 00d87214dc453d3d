import { expect, test } from '@playwright/test';
import { storageStateFor } from './support';

// Screenshots for a person to look at (test-results/screens); the assertions check the pages are whole.
test('home and sign-in pages', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/home.png', fullPage: true });
  await page.goto('/signin');
  await expect(page.getByRole('heading', { name: 'Sign in', level: 1 })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/signin.png', fullPage: true });
});

test.describe('admin', () => {
  test.use({ storageState: storageStateFor('admin') });
  test('user list', async ({ page }) => {
    await page.goto('/admin/users');
    await expect(page.getByTestId('user-table')).toBeVisible();
    await page.screenshot({ path: 'test-results/screens/admin-users.png', fullPage: true });
  });
});

test.describe('on a phone', () => {
  test.use({ viewport: { width: 390, height: 844 } });
  test('home and safety cautions', async ({ page }) => {
    await page.goto('/');
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
    await page.screenshot({ path: 'test-results/screens/home-phone.png', fullPage: true });
    await page.goto('/safety');
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    await page.screenshot({ path: 'test-results/screens/safety-phone.png', fullPage: true });
  });
});
