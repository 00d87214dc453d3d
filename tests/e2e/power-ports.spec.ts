import { expect, test } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { baseURL } from '../../playwright.config';
import { storageStateFor } from './support';

/*
 * Issue 9, seen from outside:
 *   - the shared demo base-camp kit's JSON carries its charging paths (steps and efficiency) and, for the
 *     radio, every reason it has none (the panel's 18 V is above the radio's 11.7–15.2 V window, and no
 *     lead joins the battery's posts or 12 V socket to its genderless DC connector); the page shows them;
 *   - the Voltmoth Cellhive 20's page shows the measured USB-C watts of the demo port-output test beside the
 *     claim, linked to the test: (19.84 × 2.21 + 19.8 × 2.24) / 2 = 44.0992 W against 45 W claimed (P = V × I).
 * Invented demo data (db/seed/ports.ts, db/seed/port-output.ts).
 */

const SHOTS = process.env.SHOTS_DIR;

test('a shared kit’s JSON has the charging paths and every reason; the page reads them plainly', async ({ playwright, browser }) => {
  const reviewer = await playwright.request.newContext({ baseURL, storageState: storageStateFor('reviewer'), extraHTTPHeaders: { origin: baseURL } });
  const share = await reviewer.post('/api/v1/kits/demo-kit-base-camp/share');
  expect(share.status()).toBe(201);
  const { token, path } = (await share.json()) as { token: string; path: string };
  await reviewer.dispose();

  const guest = await playwright.request.newContext({ baseURL, storageState: { cookies: [], origins: [] } });
  const res = await guest.get(`/api/v1/kits/shared/${token}`);
  expect(res.status()).toBe(200);
  type Device = { name: string; paths: { nodes: { itemName: string; detail: string; efficiency: number }[]; efficiency: number }[]; reasons: string[] };
  const charging = ((await res.json()) as { budget: { charging: { devices: Device[] } } }).budget.charging;
  await guest.dispose();
  const lantern = charging.devices.find((d) => d.name.includes('Hearthglow'))!;
  // Panel → battery's solar input (95 %) → 12 V socket → socket-to-USB-C adapter (90 %) → lantern: 0.95 × 0.9 = 85.5 %.
  expect(lantern.paths[0]!.efficiency).toBeCloseTo(0.855, 9);
  expect(lantern.paths[0]!.nodes.map((n) => n.detail)).toEqual(['genderless DC connector output', 'solar input, 12 V socket output', '12 V socket → USB-C', 'USB-C input']);
  const radio = charging.devices.find((d) => d.name.includes('Valecaster'))!;
  expect(radio.paths).toEqual([]);
  expect(radio.reasons[0]).toContain('needs 11.7–15.2 V at its genderless DC connector; Brackenfold Heathray 60 folding panel gives 18 V');
  expect(radio.reasons[1]).toContain('no cable or adapter in the kit joins Dunlow Outfitters Campcore 20 LiFePO4 battery');
  // The lanterns also serve as power banks; their 5 V USB-A is no supply for a 13.8 V radio.
  expect(radio.reasons.slice(2).join(' ')).toMatch(/Hearthglow.*USB-A gives 5 V.*converts the voltage/);

  const context = await browser.newContext({ storageState: { cookies: [], origins: [] } });
  const page = await context.newPage();
  await page.goto(path);
  const panel = page.getByTestId('charging-paths');
  const radioCard = panel.locator('[data-device*="Valecaster"]');
  await expect(radioCard.getByTestId('device-path-reasons').getByRole('listitem')).toHaveCount(radio.reasons.length);
  await expect(radioCard.getByTestId('device-path-reasons')).toContainText('gives 18 V');
  await expect(radioCard.getByTestId('device-path-reasons')).toContainText('genderless DC connector');
  const lanternCard = panel.locator('[data-device*="Hearthglow"]');
  await expect(lanternCard.getByTestId('charging-path').first()).toContainText('85.5 % of the energy arrives');
  // The wiring cautions stay on the page.
  await expect(panel.getByText('Fit a fuse close to the battery')).toBeVisible();
  const results = await new AxeBuilder({ page }).include('[data-testid="charging-paths"]').analyze();
  expect(results.violations.map((v) => v.id)).toEqual([]);
  if (SHOTS) {
    await panel.screenshot({ path: `${SHOTS}/shared-kit-charging-paths-desktop.png` });
    await page.setViewportSize({ width: 390, height: 844 });
    await panel.screenshot({ path: `${SHOTS}/shared-kit-charging-paths-phone.png` });
  }
  await context.close();
});

test('an item page shows a measured port figure beside the claim, linked to its test', async ({ page }) => {
  await page.goto('/gear/voltmoth-cellhive-20');
  const table = page.getByTestId('ports-table');
  const usbC = table.getByTestId('port-row-0');
  await expect(usbC).toContainText('45 W');
  await expect(usbC).toContainText('44.1 W measured');
  const measured = usbC.getByTestId('port-row-0-measured');
  await expect(measured).toContainText('Measured 44.1 W');
  await expect(table.getByTestId('port-row-2-measured')).toContainText('Measured 11.73 W');
  if (SHOTS) await page.getByRole('region', { name: 'Ports' }).screenshot({ path: `${SHOTS}/ports-measured.png` });
  await measured.getByRole('link', { name: /field test of 2026-10-02/ }).click();
  await expect(page).toHaveURL(/\/field-tests\/demo-ft-cellhive-port-output$/);
  await expect(page.getByText('Port 1 output power').first()).toBeVisible();

  const api = await page.request.get('/api/v1/gear/voltmoth-cellhive-20');
  const ports = ((await api.json()) as { ports: { number: number; basis: string; provenance: string | null; watts?: number }[] }).ports;
  const measuredPort = ports.find((p) => p.number === 1 && p.basis === 'measured')!;
  expect(measuredPort.provenance).toBe('/field-tests/demo-ft-cellhive-port-output');
  expect(measuredPort.watts).toBeCloseTo(44.0992, 9);
});
