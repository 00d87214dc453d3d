import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { resetRateLimits, storageStateFor } from './support';

/*
 * Radio-noise check in the browser (issue 9): a reviewer records a check of a power bank on two bands
 * (one read on the S-meter, one in dBm), sees the rise as they type and an error in words for a
 * reading off the scale, saves and submits; an editor approves; the item page shows the rise per band
 * with its verdict and a link to the test. Screenshots of the form and of the item page section.
 */

const ITEM_SLUG = 'northcairn-pocketcell-10'; // an approved demo bank with no radio-noise check yet (db/seed/demo-data.ts)

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

test('a reviewer records a radio-noise check of a bank on two bands; an editor approves; the item page shows the rise per band', async ({ browser }, testInfo) => {
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  await page.goto(`/logbook/field-tests/new?item=${ITEM_SLUG}`);
  await page.locator('#ft-kind').selectOption('radio-noise');
  await expect(page.locator('#ft-method-hint')).toContainText('reference supply');
  await page.locator('#ft-place').fill('Upper Meadow camp');
  await page.locator('#ft-sky').selectOption('clear');
  await page.locator('#ft-ambient').fill('8');
  await page.getByLabel('Instrument 1', { exact: true }).fill('Portable HF/VHF receiver, S-meter');
  await page.locator('#ft-method').fill('Reference supply: a 12 V lead-acid battery, no charger. Then the bank powering the receiver through a 12 V trigger lead.');
  await expect(page.getByRole('checkbox', { name: /Pocketcell 10 power bank/ })).toBeChecked();
  await page.getByRole('button', { name: 'Create the draft' }).click();
  await page.waitForURL(/\/logbook\/field-tests\/[0-9a-f-]+$/);
  const id = page.url().split('/').pop()!;

  // Band 1 on the S-meter, typed through the keyboard. S-units off the scale first: an error in words, nothing saved.
  const editor = page.getByTestId('rn-editor');
  await editor.getByLabel('Band', { exact: true }).fill('40 m');
  await page.keyboard.press('Tab');
  await page.keyboard.type('7.1');
  await editor.getByLabel('Receiver bandwidth (Hz)').fill('2400');
  await editor.getByLabel('Distance from the item (m)').fill('0.5');
  await editor.getByLabel('Antenna notes').fill('End-fed wire, 20 m');
  await page.locator('#rn-0-baseline-s').fill('3');
  await page.locator('#rn-0-withItem-s').fill('11');
  await editor.getByRole('button', { name: 'Save the band readings' }).click();
  await expect(page.locator('#rn-0-withItem-s-error')).toHaveText(/S-units run from 0 to 9/);
  await page.locator('#rn-0-withItem-s').fill('5');
  // HF S3 → S5: −109 → −97 dBm, a 12 dB rise (IARU Region 1 Rec. R.1, check-values.md §12).
  await expect(editor.getByTestId('rn-echo').first()).toContainText('−109 dBm → −97 dBm: rise 12 dB');

  // Band 2 in dBm on 2 m: −124 → −121 dBm is a 3 dB rise, "slight" (our own thresholds, lib/measure).
  await editor.getByRole('button', { name: 'Add a band' }).click();
  await page.locator('#rn-1-band').fill('2 m');
  await page.locator('#rn-1-freq').fill('145.5');
  await page.locator('#rn-1-mode').selectOption('fm');
  await page.locator('#rn-1-bw').fill('12500');
  await page.locator('#rn-1-dist').fill('0.5');
  await editor.getByRole('group', { name: 'Band 2' }).getByRole('group', { name: 'Baseline (reference supply)' }).getByLabel('dBm', { exact: true }).check();
  await page.locator('#rn-1-baseline-dbm').fill('-124');
  await editor.getByRole('group', { name: 'Band 2' }).getByRole('group', { name: 'With the item' }).getByLabel('dBm', { exact: true }).check();
  await page.locator('#rn-1-withItem-dbm').fill('-121');
  await expect(editor.getByTestId('rn-echo').nth(1)).toContainText('rise 3 dB — slight');
  await editor.screenshot({ path: testInfo.outputPath('radio-noise-form.png') });
  const formAxe = await new AxeBuilder({ page }).include('[data-testid="rn-editor"]').analyze();
  expect(formAxe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  await editor.getByRole('button', { name: 'Save the band readings' }).click();
  await expect(page.getByTestId('rn-message')).toHaveText('Saved 2 band readings.');
  await expect(page.getByTestId('rn-test-table')).toContainText('12 dB');

  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByTestId('field-test-status')).toHaveText('In review');

  const editorContext = await browser.newContext({ storageState: storageStateFor('editor') });
  const editorPage = await editorContext.newPage();
  await editorPage.goto(`/field-tests/${id}`);
  await expect(editorPage.getByTestId('rn-test-table')).toContainText('S3');
  await expect(editorPage.getByRole('note').filter({ hasText: 'needs a licence' })).toBeVisible();
  await editorPage.locator('section[aria-labelledby="rn-results"]').screenshot({ path: testInfo.outputPath('radio-noise-test-page.png') });
  await editorPage.getByRole('button', { name: 'Approve and publish figures' }).click();
  await expect(editorPage.getByTestId('ft-pending')).toHaveCount(0);

  // A signed-out reader sees the rise per band on the item page, with the verdict in words and a link to the test.
  const anonymous = await browser.newContext();
  const itemPage = await anonymous.newPage();
  await itemPage.goto(`/gear/${ITEM_SLUG}`);
  const section = itemPage.getByTestId('radio-noise-summary');
  await expect(section.getByRole('heading', { name: 'Radio noise' })).toBeVisible();
  const ranges = section.getByTestId('radio-noise-ranges');
  await expect(ranges).toContainText('Below 30 MHz (HF)');
  await expect(ranges).toContainText('Noisy');
  await expect(ranges).toContainText('Worst band: 40 m, 12 dB');
  await expect(ranges).toContainText('Slight rise');
  const bands = section.getByTestId('radio-noise-bands');
  await expect(bands.locator('tr[data-band="40 m"]')).toContainText('7.1 MHz');
  await expect(bands.locator('tr[data-band="40 m"]')).toContainText('12 dB');
  await expect(bands.locator('tr[data-band="2 m"]')).toContainText('3 dB');
  await expect(bands.locator('tr[data-band="2 m"]')).toContainText('FM');
  await expect(section.locator('a[href="/how-we-test#user-content-radio-noise"]')).toBeVisible();
  await section.screenshot({ path: testInfo.outputPath('radio-noise-item.png') });
  const sectionAxe = await new AxeBuilder({ page: itemPage }).include('[data-testid="radio-noise-summary"]').analyze();
  expect(sectionAxe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  await bands.locator(`a[href="/field-tests/${id}"]`).first().click();
  await expect(itemPage).toHaveURL(new RegExp(`/field-tests/${id}$`));

  await Promise.all([reviewer.close(), anonymous.close(), editorContext.close()]);
});

test('the demo bank’s radio-noise section reads per range and per band (demo data: db/seed/radio-noise.ts)', async ({ browser }, testInfo) => {
  const anonymous = await browser.newContext();
  const page = await anonymous.newPage();
  await page.goto('/gear/voltmoth-cellhive-20');
  const section = page.getByTestId('radio-noise-summary');
  // 80 m: S4 → S6 is two S-units, 12 dB (IARU Region 1 Rec. R.1: 6 dB per S-unit); above 30 MHz the worst is 2 m, 0.5 dB.
  await expect(section.getByTestId('radio-noise-ranges')).toContainText('Worst band: 80 m, 12 dB (4 bands checked)');
  await expect(section.getByTestId('radio-noise-ranges')).toContainText('Worst band: 2 m, 0.5 dB (2 bands checked)');
  await expect(section.getByTestId('radio-noise-bands').locator('tbody tr')).toHaveCount(6);
  await expect(section.locator('tr[data-band="80 m"]')).toContainText('Noisy');
  await expect(section.locator('tr[data-band="70 cm"]')).toContainText('Quiet');
  await section.screenshot({ path: testInfo.outputPath('radio-noise-demo-bank.png') });
  await anonymous.close();
});
