import { expect, test } from '@playwright/test';
import { baseURL } from '../../playwright.config';
import { resetRateLimits, storageStateFor } from './support';

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

test('a reviewer adds a USB-C port with Power Delivery profiles to a draft item and sees it on the item page', async ({ browser }) => {
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  const name = `Port Test Bank ${Date.now().toString(36)}`;

  // A fresh draft through the API (same schema as the form).
  const created = await page.request.post('/api/v1/gear', {
    headers: { origin: baseURL },
    data: { category: 'power-bank', name, maker: 'Voltmoth', chemistry: 'li-ion', specs: { mass: { value: '350 g' }, ratedEnergy: { value: '72 Wh' } } },
  });
  expect(created.status()).toBe(201);
  const slug = ((await created.json()) as { item: { slug: string } }).item.slug;

  await page.goto(`/logbook/gear/${slug}/edit`);
  const ports = page.getByRole('group', { name: 'Ports' });
  await ports.getByRole('button', { name: 'Add a port' }).click();
  const row = page.getByRole('group', { name: 'Port 1' });
  await row.getByLabel('Connector').selectOption('usb-c');
  await row.getByLabel('Direction').selectOption('output');
  await row.getByLabel('Watts (W)').fill('65');
  // A typo first: the echo says which piece it could not read, and saving is refused with the field named.
  await row.getByLabel('USB Power Delivery profiles').fill('5 V 3 A, 9 volts');
  await expect(page.getByTestId('port-0-pd-echo')).toContainText('Could not read "9 volts"');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByTestId('port-0-pd-error')).toContainText('Could not read "9 volts"');

  // USB PD Standard Power Range fixed voltages 5, 9, 15, 20 V (check-values §7); 20 V at 3.25 A = 65 W.
  await row.getByLabel('USB Power Delivery profiles').fill('5V 3A, 9 V 3 A; 15 V @ 3 A · 20 V 3.25 A');
  await expect(page.getByTestId('port-0-pd-echo')).toHaveText('= 5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A');
  await page.getByRole('button', { name: 'Save' }).click();

  await page.waitForURL(new RegExp(`/gear/${slug}$`));
  const table = page.getByTestId('ports-table');
  await expect(table).toBeVisible();
  await expect(page.getByTestId('port-row-0')).toContainText('USB-C');
  await expect(page.getByTestId('port-row-0')).toContainText('Output');
  await expect(page.getByTestId('port-row-0')).toContainText('65 W');
  await expect(page.getByTestId('port-row-0-pd')).toContainText('5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A');
  // 3.25 A is above the 3 A a standard USB-C cable carries (check-values §7): the page says so.
  await expect(page.getByTestId('ports-notes')).toContainText('rated for 5 A');
  await page.getByTestId('spec-history').locator('summary').click();
  await expect(page.getByTestId('spec-history')).toContainText('Port 1');
  await expect(page.getByTestId('spec-history')).toContainText('USB-C output: 65 W; PD 5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A');

  // The edit form shows the stored profiles back as text.
  await page.goto(`/logbook/gear/${slug}/edit`);
  await expect(page.getByRole('group', { name: 'Port 1' }).getByLabel('USB Power Delivery profiles')).toHaveValue('5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A');
  await reviewer.close();
});
