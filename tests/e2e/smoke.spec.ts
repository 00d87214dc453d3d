import { expect, test } from '@playwright/test';

test('home page shows the product and health answers', async ({ page, request }) => {
  const health = await request.get('/api/health');
  expect(health.status()).toBe(200);
  expect(await health.json()).toMatchObject({ ok: true });

  const response = await page.goto('/');
  expect(response?.status()).toBe(200);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('compared by value');
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
});
