import { expect, test } from '@playwright/test';
import type { GearListResponse } from '@/lib/browse/contract';
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

test('an imperial reader filters lights by "at most 10 oz" and gets only items of at most 283.5 g', async ({ browser, request }) => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto('/gear?category=light');
  await page.getByRole('group', { name: 'Units for figures' }).first().getByRole('button', { name: 'Imperial' }).click();
  const mass = page.getByRole('group', { name: 'Mass (oz)' });
  await expect(mass).toBeVisible();
  await mass.getByLabel('at most').fill('10');
  // 10 oz × 28.349 523 125 g/oz = 283.495 231 25 g (1 oz exact by the 1959 agreement; NIST SP 811 App. B.8 rounded).
  await expect(page).toHaveURL(/max\.mass=283\.49523125(&|$)/);

  const all = (await (await request.get('/api/v1/gear?category=light&limit=100')).json()) as GearListResponse;
  const light = (await (await request.get('/api/v1/gear?category=light&max.mass=283.49523125&limit=100')).json()) as GearListResponse;
  expect(light.items.length).toBeGreaterThan(0);
  expect(light.items.length).toBeLessThan(all.items.length); // the filter narrows the demo lights
  for (const item of light.items) expect(item.specs.mass!.value).toBeLessThanOrEqual(283.5);
  await expect.poll(() => page.getByTestId('gear-card-name').allTextContents()).toEqual(light.items.map((i) => i.name));
  // The cards show those masses in ounces, each at most 10 oz.
  const shown = await page.getByTestId('gear-card').getByText(/ oz$/).allTextContents();
  for (const text of shown) expect(Number(text.replace(/ oz$/, ''))).toBeLessThanOrEqual(10);

  // A reload keeps the filter and shows it back in ounces.
  await page.reload();
  await expect(page.getByRole('group', { name: 'Mass (oz)' }).getByLabel('at most')).toHaveValue('10');
  await page.getByRole('group', { name: 'Units for figures' }).first().getByRole('button', { name: 'Metric' }).click();
  await expect(page.getByRole('group', { name: 'Mass (g)' }).getByLabel('at most')).toHaveValue('283.49523125');
  await context.close();
});
