import { expect, test, type Locator, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';

/*
 * Issue 9: a guest builds a kit of invented free-form gear and sees its charging paths.
 *   - Laptop: USB-C input that needs USB PD 20 V at 2.25 A (45 W, check-values §7).
 *   - Radio: 12 V socket input, 12 V at 2 A.
 *   - Bank: USB-C output offering PD 5 V 3 A and 9 V 2 A (15 W and 18 W), 90 % at the port.
 *   - Battery: 12 V socket output, 12.8 V at 10 A.
 * Radio: battery → radio, 12.8 V within 12 V ± 10 % (Trailbench's own tolerance, no source), 10 A ≥ 2 A: a path.
 * Laptop: the bank's highest profile is 9 V at 2 A, so no path, with that reason. A 12 V socket → USB-C
 * car charger (PD up to 20 V 3 A = 60 W, 87 % efficient) gives battery → car charger → laptop, 87 %.
 */

const SHOTS = process.env.SHOTS_DIR;

async function ownEntry(page: Page, name: string, role: string): Promise<Locator> {
  await page.getByRole('button', { name: 'Add your own entry' }).click();
  const entry = page.getByTestId('kit-entry').last();
  await entry.getByLabel('Name', { exact: true }).fill(name);
  await entry.getByLabel('What is it, for charging paths?').selectOption({ label: role });
  return entry;
}

async function addPort(entry: Locator, port: { connector: string; direction?: string; volts?: string; amps?: string; pd?: string }) {
  await entry.getByRole('button', { name: 'Add a port' }).click();
  const row = entry.getByTestId('port-row').last();
  await row.getByLabel('Connector').selectOption({ label: port.connector });
  if (port.direction) await row.getByLabel('Direction').selectOption({ label: port.direction });
  if (port.volts) await row.getByLabel('Volts (V)').fill(port.volts);
  if (port.amps) await row.getByLabel('Amps (A)').fill(port.amps);
  if (port.pd) await row.getByLabel('USB Power Delivery profiles (optional)').fill(port.pd);
}

test('a guest sees a laptop with no charging path and why, adds a car charger and sees the path', async ({ page }) => {
  await page.goto('/kits');
  await page.getByLabel('Name', { exact: true }).first().fill('Radio camp');

  const laptop = await ownEntry(page, 'Laptop', 'Device (uses power: radio, laptop, lamp)');
  await laptop.getByLabel('Draw when on (W)').fill('30');
  await laptop.getByLabel('Hours a day').fill('2');
  await addPort(laptop, { connector: 'USB-C', direction: 'Input (takes power)', pd: '20 V 2.25 A' });

  const radio = await ownEntry(page, 'Radio', 'Device (uses power: radio, laptop, lamp)');
  await radio.getByLabel('Draw when on (W)').fill('10');
  await radio.getByLabel('Hours a day').fill('6');
  await addPort(radio, { connector: '12 V socket', direction: 'Input (takes power)', volts: '12', amps: '2' });

  const bank = await ownEntry(page, 'Bank', 'Battery or power bank (stores power)');
  await addPort(bank, { connector: 'USB-C', direction: 'Output (gives power)', pd: '5 V 3 A, 9 V 2 A' });

  const battery = await ownEntry(page, 'Battery', 'Battery or power bank (stores power)');
  await addPort(battery, { connector: '12 V socket', direction: 'Output (gives power)', volts: '12.8', amps: '10' });

  const paths = page.getByTestId('charging-paths');
  const laptopPaths = paths.locator('[data-device="Laptop"]');
  const radioPaths = paths.locator('[data-device="Radio"]');
  await expect(laptopPaths.getByTestId('device-path-status')).toContainText('No way to run or charge it');
  await expect(laptopPaths.getByTestId('device-path-reasons')).toContainText('Laptop needs 20 V at 2.25 A over USB-C; Bank offers at most 9 V at 2 A');
  await expect(laptopPaths.getByTestId('device-path-compare')).toContainText('USB-C, USB PD 20 V 2.25 A');
  await expect(laptopPaths.getByTestId('device-path-compare')).toContainText('Bank: USB-C, USB PD 5 V 3 A / 9 V 2 A');
  await expect(radioPaths.getByTestId('device-path-status')).toContainText('Can run or charge');
  await expect(radioPaths.getByTestId('charging-path').first()).toContainText('100 % of the energy arrives');

  if (SHOTS) {
    await paths.screenshot({ path: `${SHOTS}/charging-paths-missing-desktop.png` });
  }

  const charger = await ownEntry(page, 'Car charger', 'Adapter or charger (changes the voltage)');
  const ends = charger.getByTestId('port-row');
  await ends.nth(0).getByLabel('Connector').selectOption({ label: '12 V socket' });
  await ends.nth(1).getByLabel('Connector').selectOption({ label: 'USB-C' });
  await ends.nth(1).getByLabel('USB Power Delivery profiles (optional)').fill('5 V 3 A, 9 V 3 A, 15 V 3 A, 20 V 3 A');
  await charger.getByLabel('Efficiency (0–1)').fill('0.87');

  await expect(laptopPaths.getByTestId('device-path-status')).toContainText('Can run or charge');
  const best = laptopPaths.getByTestId('charging-path').first();
  // 1 (battery socket) × 0.87 (charger) × 1 (laptop input) = 87 %; the charger's 20 V × 3 A = 60 W is the weakest step.
  await expect(best).toContainText('87 % of the energy arrives; it delivers up to 60 W');
  await expect(best.getByRole('list', { name: 'Way 1, step by step' }).getByRole('listitem')).toHaveText([/Battery/, /Car charger/, /Laptop/]);

  const results = await new AxeBuilder({ page }).include('[data-testid="charging-paths"]').analyze();
  expect(results.violations.map((v) => v.id)).toEqual([]);

  if (SHOTS) {
    await paths.screenshot({ path: `${SHOTS}/charging-paths-desktop.png` });
    await page.setViewportSize({ width: 390, height: 844 });
    await paths.screenshot({ path: `${SHOTS}/charging-paths-phone.png` });
  }
});
