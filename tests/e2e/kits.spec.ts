import { expect, test, type Page } from '@playwright/test';
import { demoAccount, resetRateLimits, storageStateFor } from './support';

/*
 * A guest builds a three-day camp kit from approved demo items (db/seed/demo-data.ts; invented figures):
 *   - Glowmere Hearthglow 400 lantern, mode high, claimed 3.8 W, 4 h a day        → 3.8 × 4        = 15.2 Wh
 *   - Dunlow Ridgecall H5 radio, 8 h a day transmitting 10 % of the time          → 11.84 × 8 × 0.1 = 9.472 Wh
 *     (claimed 11.84 W transmit, 0.518 W receive) and listening the other 90 %    → 0.518 × 8 × 0.9 = 3.7296 Wh
 *   - a laptop charged daily, typed as 60 W for 1.5 h                             → 60 × 1.5        = 90 Wh
 *   daily load 118.4016 Wh; drawn from storage ÷ 0.9 (default, common practice)   = 131.557 Wh
 *   - Dunlow Campcore 20 LiFePO4, 256 Wh, and the lantern, which also serves as a power bank (19.24 Wh Li-ion):
 *     depth 0.8 (common practice, no source) → capacity 275.24 Wh, usable 220.192 Wh, floor 55.048 Wh
 *   - Brackenfold Heathray 60 panel, 60 W, 4 clear-day peak sun hours, overcast: the sky share comes from the
 *     demo's paired clear/overcast field tests, about 0.17 ÷ 0.76 ≈ 0.22; losses 0.14 (PVWatts v5 default).
 *     For any sky share s in 0.2–0.25: solar 60 × 4 × s × 0.86 = 41.3–51.6 Wh; net −90.3 to −80.0 Wh a day.
 *   Day 2: 275.24 − 2 × 90.3 = 94.64 Wh or more, above the 55.048 Wh floor; day 3: 275.24 − 3 × 80.0 = 35.24 Wh or less → fails on day 3.
 *   A second panel doubles solar (82.6–103.2 Wh): net −49.0 to −28.4 Wh; day 3 ≥ 275.24 − 3 × 49.0 = 128.24 Wh → closes.
 */

async function addItem(page: Page, label: string) {
  await page.getByLabel('Add from the catalog').selectOption({ label });
  await page.getByRole('button', { name: 'Add item' }).click();
  return page.getByRole('group', { name: label });
}

test('a guest builds a camp kit, sees it fail on day 3, fixes it, saves it on sign-in and shares it read-only', async ({ browser, request }) => {
  test.setTimeout(120_000); // one long journey: build, sign in, share, view as another user
  const guest = await browser.newContext();
  const page = await guest.newPage();
  await page.goto('/kits');
  await expect(page.getByRole('heading', { level: 1, name: 'Kits and power budget' })).toBeVisible();

  await page.getByLabel('Name', { exact: true }).fill('Three-day camp');
  await page.getByLabel('Trip length (days)').fill('3');

  const lantern = await addItem(page, 'Glowmere Hearthglow 400 rechargeable lantern');
  await lantern.getByLabel('Mode').selectOption('high');
  await lantern.getByLabel('Hours a day').fill('4');

  const radio = await addItem(page, 'Dunlow Outfitters Ridgecall H5 handheld transceiver');
  await radio.getByLabel('Mode').selectOption('transmit');
  await radio.getByLabel('Hours a day').fill('8');
  await radio.getByLabel('Duty cycle (0–1)').fill('0.1');

  await page.getByRole('button', { name: 'Add your own entry' }).click();
  const laptop = page.getByTestId('kit-entry').last();
  await laptop.getByLabel('Name').fill('Laptop (charged daily)');
  await laptop.getByLabel('Draw when on (W)').fill('60');
  await laptop.getByLabel('Hours a day').fill('1.5');

  const battery = await addItem(page, 'Dunlow Outfitters Campcore 20 LiFePO4 battery');
  await battery.getByLabel('Chemistry').selectOption('lifepo4');

  const panel = await addItem(page, 'Brackenfold Heathray 60 folding panel');
  await page.getByLabel('Peak sun hours (clear day)').fill('4');
  await page.getByLabel('Expected sky').selectOption('overcast');
  const share = Number(await page.getByLabel('Sky share (0–1)').inputValue());
  expect(share).toBeGreaterThanOrEqual(0.2);
  expect(share).toBeLessThanOrEqual(0.25);
  await expect(page.getByText(/From paired field tests/)).toBeVisible();

  const verdict = page.getByTestId('budget-verdict');
  await expect(verdict).toContainText('does not close');
  await expect(verdict).toContainText('on day 3');
  await expect(page.locator('[data-code="does-not-close"]')).toContainText('On day 3');
  await expect(page.locator('[data-code="airline-cargo-only"]')).toBeVisible();
  await expect(page.getByTestId('fig-load')).toHaveText('118.4 Wh');
  await expect(page.getByTestId('soc-table').locator('tbody tr').nth(2)).toContainText('below the floor');
  await expect(page.getByRole('note').filter({ hasText: 'Carbon monoxide' })).toBeVisible();

  await panel.getByLabel('Quantity').fill('2');
  await expect(verdict).toContainText('The plan closes');
  await expect(page.locator('[data-code="does-not-close"]')).toHaveCount(0);

  // Sign in from the kit: nothing is lost, the browser kit is saved to the account.
  await resetRateLimits(request);
  await page.getByRole('link', { name: 'Sign in to save' }).click();
  await expect(page).toHaveURL(/\/signin\?next=%2Fkits/);
  const reader = demoAccount('reader');
  const form = page.getByRole('form', { name: 'Sign in with password' });
  await form.getByLabel('E-mail').fill(reader.email);
  await form.getByLabel('Password').fill(reader.password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page).toHaveURL(/\/kits\/[\w-]+\?from=browser$/);
  await expect(page.getByTestId('kit-saved-from-browser')).toBeVisible();
  await expect(page.getByTestId('kit-title')).toHaveText('Three-day camp');
  await expect(page.getByTestId('budget-verdict')).toContainText('The plan closes');
  await expect(page.getByRole('group', { name: 'Brackenfold Heathray 60 folding panel' }).getByLabel('Quantity')).toHaveValue('2');

  await page.getByRole('button', { name: 'Create a share link' }).click();
  const href = await page.getByTestId('share-link').getAttribute('href');
  expect(href).toMatch(/^\/kits\/shared\/[A-Za-z0-9_-]{32}$/);
  await guest.close();

  // Another user opens the link: read-only, never cached.
  const other = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const view = await other.newPage();
  const response = await view.goto(href!);
  expect(response?.status()).toBe(200);
  const cache = response?.headers()['cache-control'] ?? '';
  expect(cache).toContain('private');
  expect(cache).toContain('no-store');
  await expect(view.getByText('Shared kit · read-only')).toBeVisible();
  await expect(view.getByTestId('kit-title')).toHaveText('Three-day camp');
  await expect(view.getByTestId('shared-entries')).toContainText('2 × Brackenfold Heathray 60 folding panel');
  await expect(view.getByTestId('budget-verdict')).toContainText('The plan closes');
  await expect(view.getByRole('textbox')).toHaveCount(0);
  await expect(view.getByRole('button', { name: /save/i })).toHaveCount(0);
  await other.close();
});

/*
 * A guest's own battery and panels count in the budget (figures typed, not from the catalog):
 *   light 5 W × 4 h = 20 Wh a day; battery 256 Wh LiFePO4 × 0.8 (common practice, no source) = 204.8 Wh usable;
 *   panels 2 × 40 W × 5 peak sun hours × sky share 1 × (1 − 0.14) (PVWatts v5 default losses) = 344 Wh a day.
 *   256 Wh is over 160 Wh: no passenger baggage (IATA passenger lithium battery rules).
 */
test('a guest’s own battery and panels count through their typed stored energy and rated power', async ({ browser }) => {
  const guest = await browser.newContext();
  const page = await guest.newPage();
  await page.goto('/kits');
  await page.getByLabel('Name', { exact: true }).fill('Own gear only');
  await page.getByLabel('Trip length (days)').fill('3');
  await page.getByLabel('Peak sun hours (clear day)').fill('5');

  // Each entry by its position (a `.last()` locator would move on to the next entry added).
  const addOwn = async () => {
    const position = await page.getByTestId('kit-entry').count();
    await page.getByRole('button', { name: 'Add your own entry' }).click();
    return page.getByTestId('kit-entry').nth(position);
  };
  const light = await addOwn();
  await light.getByLabel('Name').fill('Camp light');
  await light.getByLabel('Draw when on (W)').fill('5');
  await light.getByLabel('Hours a day').fill('4');

  const battery = await addOwn();
  await battery.getByLabel('Name').fill('Battery box');
  await battery.getByLabel('What is it, for charging paths?').selectOption('storage');
  await battery.getByLabel('Stored energy each (Wh)').fill('256');
  await battery.getByLabel('Chemistry').selectOption('lifepo4');

  const panels = await addOwn();
  await panels.getByLabel('Name').fill('Folding panel');
  await panels.getByLabel('Quantity').fill('2');
  await panels.getByLabel('What is it, for charging paths?').selectOption('source');
  await panels.getByLabel('Rated power each (W)').fill('40');

  await expect(page.getByTestId('fig-load')).toHaveText('20 Wh');
  await expect(page.getByTestId('fig-usable')).toHaveText('204.8 Wh');
  await expect(page.getByTestId('fig-solar')).toHaveText('344 Wh');
  await expect(page.getByTestId('budget-verdict')).toContainText('The plan closes');
  await expect(page.locator('[data-code="airline-cargo-only"]')).toBeVisible();

  await page.screenshot({ path: 'test-results/screens/kit-own-battery-panels.png', fullPage: true });
  await guest.close();
});
