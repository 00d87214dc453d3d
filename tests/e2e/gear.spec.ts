import { expect, test } from '@playwright/test';
import { chargeToWh, convert, valueRatios } from '@/lib/measure';
import { formatQuantity, formatRatio } from '@/lib/gear/format';
import { resetRateLimits, signInWithPassword, storageStateFor } from './support';
import { demoAccount } from '@/db/seed/demo-data';
import { baseURL } from '../../playwright.config';

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

test('a reviewer records a lantern in ounces and mAh at a voltage; drafts stay private; approval makes it public but not editable by others', async ({ browser }) => {
  test.setTimeout(120_000);
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  const name = `Test Lantern ${Date.now().toString(36)}`;

  await page.goto('/logbook/gear/new');
  await page.locator('#gear-category').selectOption('light');
  await page.locator('#gear-kind').selectOption('lantern');
  await page.locator('#gear-name').fill(name);
  await page.locator('#gear-maker').fill('Glowmere');
  await page.locator('#gear-price').fill('40.00');
  await page.locator('#gear-currency').selectOption('USD');
  await page.locator('#spec-mass').fill('12.3 oz');
  // 1 oz = 28.349 523 125 g (international yard and pound agreement, 1959): 12.3 oz = 348.699 g.
  const grams = convert(12.3, 'oz', 'g');
  await expect(page.getByTestId('spec-mass-echo')).toHaveText(`= ${formatQuantity(grams, 'g')}`);
  await expect(page.getByTestId('spec-mass-echo')).toHaveText('= 348.7 g');
  await page.locator('#spec-luminousFlux').fill('300 lm');
  await page.locator('#spec-runtime').fill('5 h');
  await page.locator('#spec-ratedEnergy').fill('10 400 mAh at 3.6 V');
  // Wh = Ah × V (49 CFR 171.8): 10.4 Ah × 3.6 V = 37.44 Wh.
  const wh = chargeToWh(10_400, 'mAh', 3.6);
  await expect(page.getByTestId('spec-ratedEnergy-echo')).toHaveText('= 37.44 Wh');
  await page.getByRole('button', { name: 'Add a mode' }).click();
  await page.locator('#mode-0-name').fill('low');
  await page.locator('#mode-0-output').fill('40 lm');
  await page.locator('#mode-0-runtime').fill('30 h');
  await page.getByRole('button', { name: 'Save draft' }).click();

  await page.waitForURL(/\/gear\/glowmere-test-lantern-/);
  const itemUrl = new URL(page.url()).pathname;
  const slug = itemUrl.split('/').pop()!;
  await expect(page.getByTestId('gear-name')).toHaveText(name);
  await expect(page.getByTestId('draft-notice')).toBeVisible();
  await expect(page.getByTestId('spec-mass-claimed')).toContainText('348.7 g');
  await expect(page.getByTestId('spec-ratedEnergy-claimed')).toContainText('37.44 Wh');
  await expect(page.getByTestId('spec-runtime-low-claimed')).toContainText('30 h');

  // The ratios shown are lib/measure's for the same figures.
  const ratios = valueRatios('light', { mass: { claimed: grams }, luminousFlux: { claimed: 300 }, runtime: { claimed: 5 * 3600 }, ratedEnergy: { claimed: wh } }, { amountMinor: 4000, currency: 'USD' });
  for (const id of ['lm-per-g', 'lm-per-money', 'runtime-h-per-100g', 'wh-per-kg']) {
    const r = ratios.find((x) => x.id === id)!;
    await expect(page.getByTestId(`ratio-${id}-value`)).toHaveText(formatRatio(r.value, r.unit));
  }
  await expect(page.getByTestId('ratio-lm-per-g-value')).toHaveText('0.86 lm/g'); // 300 lm ÷ 348.699 g = 0.8603 lm/g

  // A second reviewer cannot see the draft, by page, edit form or API (AC-02).
  await resetRateLimits(page.request);
  const second = await browser.newContext();
  const other = await second.newPage();
  const reviewer2 = demoAccount('reviewer2');
  await signInWithPassword(other, reviewer2.email, reviewer2.password);
  await expect(other.getByTestId('signed-in-as')).toContainText(reviewer2.name);
  expect((await other.goto(itemUrl))!.status()).toBe(404);
  expect((await other.goto(`/logbook/gear/${slug}/edit`))!.status()).toBe(404);
  const hiddenPatch = await other.request.patch(`/api/v1/gear/${slug}`, { data: { name: 'Taken over' }, headers: { origin: baseURL } });
  expect(hiddenPatch.status()).toBe(404);

  // The author submits; an editor approves.
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByTestId('gear-status')).toHaveText('In review');
  const editor = await browser.newContext({ storageState: storageStateFor('editor') });
  const editorPage = await editor.newPage();
  await editorPage.goto(itemUrl);
  await editorPage.getByRole('button', { name: 'Approve' }).click();
  await expect(editorPage.getByTestId('gear-status')).toHaveText('Approved', { timeout: 15_000 });

  // Now public: the second reviewer sees it but may not edit it (403).
  expect((await other.goto(itemUrl))!.status()).toBe(200);
  await expect(other.getByTestId('spec-mass-claimed')).toContainText('348.7 g');
  expect((await other.goto(`/logbook/gear/${slug}/edit`))!.status()).toBe(403);
  const deniedPatch = await other.request.patch(`/api/v1/gear/${slug}`, { data: { name: 'Taken over' }, headers: { origin: baseURL } });
  expect(deniedPatch.status()).toBe(403);
  await other.goto(itemUrl);
  await expect(other.getByTestId('gear-name')).toHaveText(name);

  // Listed on /gear for everyone.
  const guest = await browser.newContext();
  const guestPage = await guest.newPage();
  await guestPage.goto('/gear');
  await expect(guestPage.getByTestId('gear-list-light').getByRole('link', { name })).toBeVisible();

  await Promise.all([reviewer.close(), second.close(), editor.close(), guest.close()]);
});
