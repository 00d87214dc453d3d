import { readFile } from 'node:fs/promises';
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import Papa from 'papaparse';
import { baseURL } from '../../playwright.config';
import type { CompareResponse, GearListResponse } from '@/lib/browse/contract';
import { storageStateFor } from './support';

/*
 * Readers browse, compare side by side and read the best-value line against the demo catalog
 * (db/seed/demo-data.ts; invented figures) and against fixture lights this file creates itself.
 */

async function cardNames(page: Page): Promise<string[]> {
  return page.getByTestId('gear-card-name').allTextContents();
}

test('a reader filters lights by mass ≤ 300 g, sorts by lm/g, shares the URL and a new browser sees the same list', async ({ browser, request }) => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto('/gear');
  await page.getByRole('radio', { name: /^Lights/ }).check();
  await page.getByRole('group', { name: 'Mass (g)' }).getByLabel('at most').fill('300');
  await page.getByLabel('Sort by').selectOption('lm-per-g');
  await expect(page).toHaveURL(/max\.mass=300/);
  await expect(page).toHaveURL(/sort=lm-per-g/);
  await expect(page).toHaveURL(/category=light/);
  await expect(page.getByTestId('result-count')).toContainText('by light output per gram');

  // The same query straight from the API: the list on screen is its list, in its order.
  const api = (await (await request.get('/api/v1/gear?category=light&max.mass=300&sort=lm-per-g&limit=100')).json()) as GearListResponse;
  expect(api.items.length).toBeGreaterThanOrEqual(3);
  await expect.poll(() => cardNames(page)).toEqual(api.items.map((i) => i.name));
  let previous = Infinity;
  for (const item of api.items) {
    expect(item.category).toBe('light');
    expect(item.specs.mass!.value).toBeLessThanOrEqual(300);
    // lm/g = luminous flux ÷ mass (definition of the ratio, lib/measure README "Value ratios"), best first.
    const lmPerG = item.specs.luminousFlux!.value / item.specs.mass!.value;
    expect(item.sortValue).toBeCloseTo(lmPerG, 9);
    expect(lmPerG).toBeLessThanOrEqual(previous);
    previous = lmPerG;
  }
  // Cards show the sorted figure with its basis in words (not colour alone).
  const firstCard = page.getByTestId('gear-card').first();
  await expect(firstCard.getByTestId('sorted-value')).toContainText('lm/g');
  await expect(firstCard.getByTestId('sorted-figure').getByTestId('basis')).toHaveText(/claimed|measured/);

  // The shared link, opened in a fresh context, shows the same list (server-rendered first page).
  const shared = page.url();
  const other = await browser.newContext();
  const otherPage = await other.newPage();
  await otherPage.goto(shared);
  expect(await cardNames(otherPage)).toEqual(api.items.map((i) => i.name));
  await expect(otherPage.getByLabel('Sort by')).toHaveValue('lm-per-g');
  await expect(otherPage.getByRole('group', { name: 'Mass (g)' }).getByLabel('at most')).toHaveValue('300');
  await context.close();
  await other.close();
});

test('a reader builds a side-by-side of three lights, reorders it and exports a CSV whose numbers match the table', async ({ browser, request }) => {
  const context = await browser.newContext({ acceptDownloads: true });
  const page = await context.newPage();
  await page.goto('/gear?category=light&sort=lm-per-g');
  const cards = page.getByTestId('gear-card');
  await expect(cards.nth(2)).toBeVisible();
  const slugs: string[] = [];
  for (let i = 0; i < 3; i++) {
    slugs.push((await cards.nth(i).getAttribute('data-slug'))!);
    await cards.nth(i).getByRole('button', { name: /Add to side-by-side/ }).click();
  }
  await expect(page.getByTestId('side-by-side-count')).toContainText('3');
  await page.getByTestId('side-by-side-tray').click();
  await expect(page).toHaveURL(new RegExp(`items=${slugs.join(',')}`));
  const table = page.getByTestId('side-by-side-table');
  const itemHeaders = table.locator('thead').getByRole('columnheader');
  await expect(itemHeaders).toHaveCount(4); // the figure column and one per item

  // Reorder with the keyboard-usable buttons: the first item moves right; the URL keeps the order.
  const first = (await request.get(`/api/v1/gear/${slugs[0]}`).then((r) => r.json())) as { name?: string; item?: { name: string } };
  const firstName = first.item?.name ?? first.name!;
  await page.getByRole('button', { name: `Move ${firstName} right` }).focus();
  await page.keyboard.press('Enter');
  const order = [slugs[1], slugs[0], slugs[2]];
  await expect(page).toHaveURL(new RegExp(`items=${order.join(',')}`));
  await expect(itemHeaders.nth(2)).toContainText(firstName);
  await expect(table.getByTestId('best-mark').first()).toBeVisible();

  // What the table shows, row by row.
  const shown = async () =>
    table.locator('tbody tr[data-testid^="row-"]').evaluateAll((rows) =>
      rows.map((row) => [
        row.querySelector('th .font-semibold')!.textContent!,
        ...Array.from(row.querySelectorAll('td')).map((td) => td.querySelector('[data-testid="cell-text"]')?.textContent ?? ''),
      ]),
    );
  await expect.poll(async () => (await shown()).length).toBeGreaterThan(3);
  const rows = await shown();

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
  const csv = await readFile((await download.path())!, 'utf8');
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
  expect(parsed[0]!.slice(0, 3)).toEqual(['Group', 'Figure', 'Unit']);
  // The file holds the table's figures as plain machine numbers: "10,400" on screen is 10400 in the CSV.
  const groupedNumber = /^-?\d{1,3}(,\d{3})*(\.\d+)?$/;
  // A row of per-money ratios in several currencies shows "8.7 lm/EUR" per cell; the file keeps the number
  // there and lists the cells' units, in column order, in the Unit column ("lm/USD; lm/EUR; lm/USD").
  const asInFile = rows.map((row, r) => {
    const perCellUnits = parsed[r + 1]![2]!.includes(';');
    return row.map((text, c) => {
      const own = perCellUnits && c > 0 ? /^(\S+) (\S+)$/.exec(text) : null;
      if (own) expect(parsed[r + 1]![2]!.split('; ')[c - 1]).toBe(own[2]);
      const figure = own ? own[1]! : text;
      return groupedNumber.test(figure) ? figure.replace(/,/g, '') : figure;
    });
  });
  expect(parsed.slice(1).map((r) => [r[1], ...r.slice(3, 6)])).toEqual(asInFile);
  for (const line of parsed.slice(1)) for (const cell of line.slice(3, 6)) expect(cell).not.toMatch(/^-?\d{1,3}(,\d{3})+/);

  // The CSV's numbers against the API's canonical values (display rounds to ≤ 2 decimals, lib/gear/format).
  const compare = (await (await request.get(`/api/v1/compare?items=${order.join(',')}`)).json()) as CompareResponse;
  const massRow = compare.groups.flatMap((g) => g.rows).find((r) => r.key === 'mass')!;
  const massCsv = parsed.find((r) => r[0] === 'Specs' && r[2] === 'g' && r[1] === massRow.label)!;
  massRow.cells.forEach((cell, i) => {
    expect(massCsv[3 + i]).toMatch(/^\d+(\.\d+)?$/);
    expect(Math.abs(Number(massCsv[3 + i]) - (cell.value as number))).toBeLessThanOrEqual(0.05);
  });
  const lmRow = compare.groups.flatMap((g) => g.rows).find((r) => r.key === 'lm-per-g')!;
  const lmCsv = parsed.find((r) => r[1] === lmRow.label)!;
  lmRow.cells.forEach((cell, i) => {
    expect(Math.abs(Number(lmCsv[3 + i]) - (cell.value as number))).toBeLessThanOrEqual(0.005);
  });

  // Hiding equal rows changes what is shown, and the export follows.
  await page.getByLabel('Hide rows where all items are equal').check();
  await expect(page).toHaveURL(/equal=hide/);

  // Remove one: two columns left, the tray's selection follows.
  await page.getByRole('button', { name: `Remove ${firstName}` }).click();
  await expect(page).toHaveURL(new RegExp(`items=${[slugs[1], slugs[2]].join(',')}`));
  await expect(itemHeaders).toHaveCount(3);
  await context.close();
});

test('the best-value line of fixture lights lists exactly the items no other beats on mass and output', async ({ browser }) => {
  test.setTimeout(180_000);
  const tag = `fx${Date.now().toString(36)}`;
  // Mass (less is better) against light output (more is better); a point is on the line when no other
  // point is at least as good on both and better on one (Pareto dominance, by definition):
  //   E  80 g, 100 lm  — lightest: on the line
  //   A 100 g, 300 lm  — only E is lighter, and E gives less light: on the line
  //   B 150 g, 500 lm  — lighter ones (E, A) give less light: on the line
  //   C 150 g, 400 lm  — B has the same mass and 500 > 400 lm: beaten
  //   D 200 g, 450 lm  — B is lighter (150 < 200 g) and brighter (500 > 450 lm): beaten
  // So the line, by mass: E, A, B.
  const fixtures = [
    { letter: 'A', mass: '100 g', lm: '300 lm' },
    { letter: 'B', mass: '150 g', lm: '500 lm' },
    { letter: 'C', mass: '150 g', lm: '400 lm' },
    { letter: 'D', mass: '200 g', lm: '450 lm' },
    { letter: 'E', mass: '80 g', lm: '100 lm' },
  ];
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const editor = await browser.newContext({ storageState: storageStateFor('editor') });
  const reviewerPage = await reviewer.newPage();
  const editorPage = await editor.newPage();
  for (const f of fixtures) {
    const response = await reviewerPage.request.post('/api/v1/gear', {
      headers: { origin: baseURL },
      data: { category: 'light', kind: 'lantern', name: `Frontier ${tag} ${f.letter}`, maker: 'Northcairn', specs: { mass: { value: f.mass }, luminousFlux: { value: f.lm } } },
    });
    expect(response.status()).toBe(201);
    const { item } = (await response.json()) as { item: { path: string } };
    await reviewerPage.goto(item.path);
    await reviewerPage.getByRole('button', { name: 'Submit for review' }).click();
    await expect(reviewerPage.getByTestId('gear-status')).toHaveText('In review');
    await editorPage.goto(item.path);
    await editorPage.getByRole('button', { name: 'Approve' }).click();
    await expect(editorPage.getByTestId('gear-status')).toHaveText('Approved');
  }
  await reviewer.close();
  await editor.close();

  const guest = await browser.newContext();
  const page = await guest.newPage();
  await page.goto(`/best-value?category=light&q=${tag}`);
  await expect(page.getByLabel('Across (x)')).toHaveValue('mass');
  await expect(page.getByLabel('Up (y)')).toHaveValue('luminousFlux');
  await expect(page.getByTestId('frontier-item')).toHaveText([`Northcairn Frontier ${tag} E`, `Northcairn Frontier ${tag} A`, `Northcairn Frontier ${tag} B`]);

  // Keyboard: focus shows the point, Enter adds it to the side-by-side.
  const pointD = page.getByTestId(`point-northcairn-frontier-${tag}-d`);
  await pointD.focus();
  await expect(page.getByTestId('active-point')).toContainText(`Frontier ${tag} D`);
  await expect(page.getByTestId('active-point')).toContainText('Beaten on both axes');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('active-point')).toContainText('added to the side-by-side (1 of 6)');
  await expect(page.getByTestId('side-by-side-count')).toContainText('1');
  await guest.close();
});

test.describe('accessibility and looks', () => {
  const pages = [
    { name: 'browse', path: '/gear?category=light&sort=lm-per-g&max.mass=300' },
    { name: 'side-by-side', path: '/side-by-side?items=northcairn-cairnlight-900,glowmere-scree-600,northcairn-fellbeam-350' },
    { name: 'best-value', path: '/best-value?category=light' },
  ];
  for (const target of pages) {
    test(`${target.name}: no serious or critical axe violations; screenshots at desktop and phone widths`, async ({ page }) => {
      for (const viewport of [
        { width: 1280, height: 900, label: 'desktop' },
        { width: 390, height: 844, label: 'phone' },
      ]) {
        await page.setViewportSize(viewport);
        await page.goto(target.path);
        await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
        if (target.name === 'side-by-side') await expect(page.getByTestId('side-by-side-table')).toBeVisible();
        if (target.name === 'best-value') await expect(page.getByTestId('frontier-item').first()).toBeVisible();
        if (target.name === 'browse') await expect(page.getByTestId('gear-card').first()).toBeVisible();
        const results = await new AxeBuilder({ page }).analyze();
        const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
        expect(bad.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
        await page.screenshot({ path: `test-results/screens/${target.name}-${viewport.label}.png`, fullPage: true });
      }
    });
  }
});
