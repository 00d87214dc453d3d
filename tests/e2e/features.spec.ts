import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import type { GearListResponse } from '@/lib/browse/contract';
import { storageStateFor } from './support';

/*
 * Feature checklists and multi-role gear against the demo catalog (db/seed/features.ts; invented
 * answers): a reader filters lights by red mode, reads an item's checklist and "also serves as", browses
 * banks and finds the lanterns that serve as one, and compares features side by side. Screenshots go to
 * test-results/ for a human look.
 */

const RED_LIGHTS = ['dunlow-bothy-aa-lantern', 'glowmere-scree-600', 'northcairn-fellbeam-350', 'northcairn-tarn-collapsible-lantern'];

async function cardSlugs(page: Page): Promise<string[]> {
  return (await page.getByTestId('gear-card').evaluateAll((cards) => cards.map((c) => c.getAttribute('data-slug') ?? ''))).sort();
}

test('a reader filters lights by red mode and sees only items stated to have one; the link carries the filter', async ({ page, request, browser }) => {
  await page.goto('/gear');
  await page.getByRole('radio', { name: /^Lights/ }).check();
  const features = page.getByRole('group', { name: 'Features' });
  await expect(features).toBeVisible();
  await features.getByRole('checkbox', { name: 'Red light mode' }).check();
  await expect(page).toHaveURL(/feature\.red-mode=true/);

  const api = (await (await request.get('/api/v1/gear?category=light&feature.red-mode=true&limit=100')).json()) as GearListResponse;
  expect(api.items.map((i) => i.slug).sort()).toEqual(RED_LIGHTS);
  for (const item of api.items) expect(item.features!.find((f) => f.name === 'red-mode')!.state).toBe('has');
  await expect.poll(() => cardSlugs(page)).toEqual(RED_LIGHTS);
  await expect(page.getByTestId('result-count')).toContainText(`${RED_LIGHTS.length} items`);
  await page.screenshot({ path: 'test-results/features-browse-filters.png', fullPage: true });
  const axe = await new AxeBuilder({ page }).include('#browse-filters').analyze();
  expect(axe.violations.map((v) => v.id)).toEqual([]);

  // Opened fresh, the shared link shows the same list with the box ticked.
  const other = await browser.newContext();
  const otherPage = await other.newPage();
  await otherPage.goto(page.url());
  await expect(otherPage.getByRole('group', { name: 'Features' }).getByRole('checkbox', { name: 'Red light mode' })).toBeChecked();
  expect(await cardSlugs(otherPage)).toEqual(RED_LIGHTS);
  await other.close();

  // The API refuses a feature name no checklist has, naming it (the page itself keeps only known parameters).
  const bad = await request.get('/api/v1/gear?category=light&feature.laser-sight=true');
  expect(bad.status()).toBe(400);
  expect(((await bad.json()) as { error: { message: string } }).error.message).toContain('feature.laser-sight');
});

test('the item page shows the checklist in words and marks, and what a multi-role lantern also serves as', async ({ page }) => {
  await page.goto('/gear/glowmere-hearthglow-400');
  await expect(page.getByTestId('also-serves-as')).toHaveText('Also serves as a power bank');
  const role = page.getByTestId('role-power-bank');
  await expect(role.getByRole('heading', { name: 'Also serves as a power bank' })).toBeVisible();
  await expect(role).toContainText('rated energy counts as stored energy in kits');
  // 19.24 Wh claimed (db/seed/demo-data.ts), shown as the bank's capacity.
  await expect(role.getByTestId('role-spec-ratedEnergy')).toContainText('19.2');

  const checklist = page.getByTestId('feature-checklist');
  await expect(checklist.getByTestId('feature-hanging-hook')).toContainText('Hanging hook (hook material: moulded plastic)');
  await expect(checklist.getByTestId('feature-hanging-hook')).toContainText('Has');
  await expect(checklist.getByTestId('feature-red-mode')).toContainText('Has not');
  await expect(checklist.getByTestId('feature-ip-rating')).toContainText('IPX4');
  // The bank's checklist joins the light's; unanswered ones say so.
  await expect(checklist.getByTestId('feature-wireless-charging')).toContainText('Not stated');
  await expect(checklist.getByTestId('feature-wireless-charging')).toHaveAttribute('data-state', 'not-stated');
  await page.getByRole('heading', { name: 'Features' }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/features-item-page.png', fullPage: true });
  const axe = await new AxeBuilder({ page }).include('[data-testid="feature-checklist"]').analyze();
  expect(axe.violations.map((v) => v.id)).toEqual([]);
});

test('browsing power banks lists the lanterns that serve as one, said so on the card', async ({ page }) => {
  await page.goto('/gear?category=power-bank');
  const card = page.locator('[data-testid="gear-card"][data-slug="northcairn-tarn-collapsible-lantern"]');
  await expect(card).toBeVisible();
  await expect(card.getByTestId('role-note')).toHaveText('A lantern serving as a power bank');
  await expect(page.locator('[data-testid="gear-card"][data-slug="glowmere-hearthglow-400"]')).toBeVisible();
  // The facet count includes them: four banks plus two lanterns that serve as banks.
  await expect(page.getByRole('radio', { name: /^Power banks/ }).locator('..')).toContainText('6');
});

test.describe('side-by-side', () => {
  test.use({ storageState: storageStateFor('reader') });

  test('has feature rows in words', async ({ page }) => {
    await page.goto('/side-by-side?items=glowmere-hearthglow-400,northcairn-tarn-collapsible-lantern,dunlow-bothy-aa-lantern');
    const table = page.getByTestId('side-by-side-table');
    await expect(table).toBeVisible();
    const red = table.getByTestId('row-feature:red-mode');
    await expect(red).toContainText('Red light mode');
    await expect(red.getByTestId('cell-text')).toHaveText(['Has not', 'Has', 'Has']);
    await expect(table.getByTestId('row-also-serves-as').getByTestId('cell-text')).toHaveText(['Power bank', 'Power bank', 'Only its own category']);
    await red.scrollIntoViewIfNeeded();
    await page.screenshot({ path: 'test-results/features-side-by-side.png' });
  });
});

test('a reviewer records a lantern that also serves as a power bank: the form asks for the bank’s figures and the checklist of both', async ({ browser }) => {
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  const name = `Role Lantern ${Date.now().toString(36)}`;
  await page.goto('/logbook/gear/new');
  await page.locator('#gear-category').selectOption('light');
  await page.locator('#gear-kind').selectOption('lantern');
  await page.locator('#gear-name').fill(name);
  await page.locator('#gear-maker').fill('Glowmere');
  await page.locator('#spec-mass').fill('380 g');
  await page.locator('#spec-luminousFlux').fill('350 lm');
  // A light alone has no bank figures or bank features.
  await expect(page.locator('#spec-rechargePower')).toHaveCount(0);
  await expect(page.locator('#feature-output-12v')).toHaveCount(0);

  await page.getByRole('group', { name: 'Also serves as' }).getByRole('checkbox', { name: 'Power bank' }).check();
  await expect(page.getByLabel('Recharge input power (as power bank)')).toBeVisible();
  await expect(page.getByLabel('Battery energy (required)')).toBeVisible();
  await page.locator('#feature-red-mode').selectOption('yes');
  await page.locator('#feature-hanging-hook').selectOption('yes');
  await page.locator('#feature-hanging-hook-detail').fill('steel wire');
  await page.locator('#feature-output-12v').selectOption('no');
  await page.screenshot({ path: 'test-results/features-form.png', fullPage: true });
  const axe = await new AxeBuilder({ page }).include('[data-testid="also-serves-fieldset"]').include('[data-testid="features-fieldset"]').analyze();
  expect(axe.violations.map((v) => v.id)).toEqual([]);

  // Without the rated energy a bank role is refused, the field named; nothing is saved.
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByTestId('spec-ratedEnergy-error')).toContainText('required for a light serving as power bank');
  await page.locator('#spec-ratedEnergy').fill('5000 mAh at 3.7 V');
  await page.locator('#gear-chemistry').selectOption('li-ion');
  await page.getByRole('button', { name: 'Save draft' }).click();

  await page.waitForURL(/\/gear\/glowmere-role-lantern-/);
  await expect(page.getByTestId('also-serves-as')).toHaveText('Also serves as a power bank');
  // 5 Ah × 3.7 V = 18.5 Wh (Wh = Ah × V, 49 CFR 171.8).
  await expect(page.getByTestId('role-power-bank').getByTestId('role-spec-ratedEnergy')).toContainText('18.5 Wh');
  await expect(page.getByTestId('feature-hanging-hook')).toContainText('hook material: steel wire');
  await expect(page.getByTestId('feature-output-12v')).toContainText('Has not');
  await expect(page.getByTestId('feature-magnet')).toContainText('Not stated');
  await reviewer.close();
});
