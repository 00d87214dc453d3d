import { expect, test, type Page } from '@playwright/test';
import path from 'node:path';
import { resetRateLimits, storageStateFor } from './support';

/*
 * Field tests in the browser: a reviewer logs a light runtime test of one of their own demo lights from a
 * CSV fixture, sees the chart and the runtime, saves and submits; an editor approves; the item page shows
 * the measured runtime linked to the test. And a large generated log: progress advances and the page
 * keeps answering input (no timing assertions).
 */

const ITEM_SLUG = 'dunlow-trailwarden-torch'; // demo light owned by the demo reviewer (db/seed/demo-data.ts)
const FIXTURE = path.join(process.cwd(), 'tests/fixtures/readings/lantern-fade.csv');

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

async function createDraft(page: Page, place: string): Promise<string> {
  await page.goto(`/logbook/field-tests/new?item=${ITEM_SLUG}`);
  await page.locator('#ft-kind').selectOption('light-runtime');
  await page.locator('#ft-place').fill(place);
  await page.locator('#ft-sky').selectOption('indoor');
  await page.locator('#ft-ambient').fill('19.5');
  await page.getByLabel('Instrument 1', { exact: true }).fill('Logging lux meter, sensor 30 cm from the lens');
  await page.getByLabel('Instrument 1 accuracy').fill('±4 % of reading');
  await page.locator('#ft-method').fill('Torch on high in a closed box; lux logged until it faded.');
  await expect(page.getByRole('checkbox', { name: /Trailwarden AA torch/ })).toBeChecked();
  await page.getByRole('button', { name: 'Create the draft' }).click();
  await page.waitForURL(/\/logbook\/field-tests\/[0-9a-f-]+$/);
  return page.url().split('/').pop()!;
}

test('a reviewer logs a light runtime test from a CSV; an editor approves; the item page shows the measured runtime', async ({ browser }, testInfo) => {
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  const id = await createDraft(page, 'Lakeshore test bench');
  await expect(page.getByTestId('field-test-status')).toHaveText('Draft');

  // Pick the logger file: the worker parses it, the chart and the runtime show before anything is saved.
  await page.getByLabel('Trial label').fill('Trial 1');
  await page.locator('input[type="file"]').setInputFiles(FIXTURE);
  await expect(page.getByRole('button', { name: 'Use these readings' })).toBeVisible();
  // Runtime to 10 % of the 30 s output: 34 800 s = 9 h 40 min (exact by hand, tests/unit/field-test-analysis.test.ts).
  await expect(page.getByText('Runtime to 10 % of it (ANSI/PLATO FL 1): 9:40 (h:mm), 34800 s.').first()).toBeVisible();
  await page.getByRole('button', { name: 'Use these readings' }).click();
  await expect(page.getByTestId('trial-preview-figures').or(page.getByTestId('csv-ready'))).toBeVisible();
  await page.getByRole('button', { name: 'Save this trial' }).click();
  await expect(page.getByTestId('trial-saved')).toContainText('38 readings stored');

  // The saved trial: chart and figures from the stored series; the results table.
  const trial = page.getByTestId('ft-trial');
  await expect(trial).toHaveCount(1);
  await expect(trial.getByTestId('ft-trial-figures')).toContainText('Runtime (highest mode): 9 h 40 min');
  await expect(page.getByTestId('ft-results').locator('[data-figure="runtime"]')).toContainText('9 h 40 min (n = 1)');
  await trial.screenshot({ path: testInfo.outputPath('runtime-chart.png') });

  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByTestId('field-test-status')).toHaveText('In review');

  // Not public yet: a signed-out reader gets 404.
  const anonymous = await browser.newContext();
  const res = await anonymous.request.get(`/field-tests/${id}`);
  expect(res.status()).toBe(404);

  const editorContext = await browser.newContext({ storageState: storageStateFor('editor') });
  const editor = await editorContext.newPage();
  await editor.goto(`/field-tests/${id}`);
  await expect(editor.getByTestId('ft-pending')).toBeVisible();
  await editor.getByRole('button', { name: 'Approve and publish figures' }).click();
  await expect(editor.getByTestId('ft-pending')).toHaveCount(0);

  // Public now; the item page shows the measured runtime with a link to this test.
  expect((await anonymous.request.get(`/field-tests/${id}`)).status()).toBe(200);
  const itemPage = await anonymous.newPage();
  await itemPage.goto(`/gear/${ITEM_SLUG}`);
  const link = itemPage.locator(`a[href="/field-tests/${id}"]`).first();
  await expect(link).toBeVisible();
  const row = itemPage.locator('tr', { has: link });
  await expect(row).toContainText('9 h 40 min');
  await link.click();
  await expect(itemPage).toHaveURL(new RegExp(`/field-tests/${id}$`));
  await expect(itemPage.getByTestId('ft-results').first()).toContainText('9 h 40 min');
  // The formula and standard used link to their section of the method page.
  const method = itemPage.locator('main a[href^="/how-we-test#"]').first();
  const href = (await method.getAttribute('href'))!;
  await itemPage.goto(href);
  await expect(itemPage.locator(`[id="${href.split('#')[1]}"]`)).toBeVisible();

  await Promise.all([reviewer.close(), anonymous.close(), editorContext.close()]);
});

test('a large generated log: parsing and upload progress advance and the page keeps answering input', async ({ browser }) => {
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  await createDraft(page, 'Upper Meadow camp');

  // 150 000 rows (about 2.5 MB), generated here rather than committed: flat, then a straight fade.
  const lines = ['elapsed_s,lux'];
  for (let t = 0; t < 150_000; t += 1) lines.push(`${t},${t <= 30 ? 400 : ((400 * (150_000 - t)) / 149_970).toFixed(3)}`);
  const csv = Buffer.from(lines.join('\n'));

  // Record every value the progress bars take, without timing anything.
  await page.evaluate(() => {
    const w = window as unknown as { seen: number[] };
    w.seen = [];
    new MutationObserver(() => {
      document.querySelectorAll('progress').forEach((p) => w.seen.push(Number((p as HTMLProgressElement).value)));
    }).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['value'] });
  });

  await page.locator('input[type="file"]').setInputFiles({ name: 'big-log.csv', mimeType: 'text/csv', buffer: csv });
  // The page answers input while the worker reads the rows.
  const label = page.getByLabel('Trial label');
  await label.fill('Long run');
  await expect(label).toHaveValue('Long run');
  await page.getByLabel('Trial label').press('End');
  await page.keyboard.type(' (150k rows)');
  await expect(label).toHaveValue('Long run (150k rows)');

  await expect(page.getByRole('button', { name: 'Use these readings' })).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText('150000 readings over').first()).toBeVisible();
  await page.getByRole('button', { name: 'Use these readings' }).click();
  await page.getByRole('button', { name: 'Save this trial' }).click();
  await expect(page.getByTestId('trial-saved')).toContainText('150,000 readings stored', { timeout: 60_000 });

  const seen = await page.evaluate(() => (window as unknown as { seen: number[] }).seen);
  expect(seen.some((v) => v > 0 && v < 1)).toBe(true); // progress advanced through intermediate values
  await expect(page.getByTestId('ft-trial')).toHaveCount(1);
  await expect(page.getByTestId('ft-trial')).toContainText('150,000 readings');
  await reviewer.close();
});
