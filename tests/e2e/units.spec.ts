import { expect, test } from '@playwright/test';
import { signInWithPassword, signUpNewReader } from './support';

/*
 * Issue 4, metric/imperial display: a guest's choice lives in a cookie and follows them from page to page;
 * a signed-in user's choice is saved on the profile and is back in a fresh browser after signing in again.
 * 410 g = 14.46 oz and 185 g = 6.53 oz (1 oz = 28.349 523 125 g exactly, 1959 international pound).
 */
const LANTERN = '/gear/glowmere-hearthglow-400'; // claimed mass 410 g (demo data)
const OTHER = '/gear/northcairn-tarn-collapsible-lantern'; // claimed mass 185 g

test('a guest switches to imperial once and every page follows', async ({ browser }) => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(LANTERN);
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('410 g');
  const toggle = page.getByRole('group', { name: 'Units for figures' });
  await expect(toggle.getByRole('button', { name: 'Metric' })).toHaveAttribute('aria-pressed', 'true');
  await toggle.getByRole('button', { name: 'Imperial' }).click();
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('14.46 oz');
  await expect(toggle.getByRole('button', { name: 'Imperial' })).toHaveAttribute('aria-pressed', 'true');
  await page.screenshot({ path: 'test-results/units-imperial-item.png', fullPage: true });

  await page.goto(OTHER);
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('6.53 oz');
  await page.goto('/kits');
  await expect(page.getByTestId('total-mass')).toContainText('oz');
  expect((await context.cookies()).find((c) => c.name === 'tb-units')?.value).toBe('imperial');

  const metric = page.getByRole('group', { name: 'Units for figures' }).getByRole('button', { name: 'Metric' });
  await metric.click();
  await expect(metric).toHaveAttribute('aria-pressed', 'true');
  await page.goto(LANTERN);
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('410 g');
  await context.close();
});

test('a signed-in choice is saved on the profile and comes back in a new browser', async ({ browser }) => {
  const { context, page, email, password } = await signUpNewReader(browser, 'units');
  await page.goto('/account');
  await page.getByRole('main').getByRole('button', { name: /^Imperial/ }).click();
  await expect(page.getByRole('main').getByRole('button', { name: /^Imperial/ })).toHaveAttribute('aria-pressed', 'true');
  await page.goto(LANTERN);
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('14.46 oz');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await context.close();

  const fresh = await browser.newContext(); // no cookie: only the profile can say imperial
  const again = await fresh.newPage();
  await again.goto(LANTERN);
  await expect(again.getByTestId('spec-mass-claimed')).toContainText('410 g');
  await signInWithPassword(again, email, password);
  await expect(again.getByTestId('signed-in-as')).toBeVisible();
  await again.goto(LANTERN);
  await expect(again.getByTestId('spec-mass-claimed')).toContainText('14.46 oz');
  await fresh.close();
});
