import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { storageStateFor, type DemoRole } from './support';

/*
 * Issue 6 reading side: full-text search (stemming, prefix, highlighted snippets, hostile queries),
 * the cached review pages following a publish and a retraction at once (tag revalidation), the
 * where-to-buy block and the readers' revision diff. Uses the demo data; publishes and then retracts
 * the approved demo review "Two 12 V batteries for base camp".
 */

const dialogs: string[] = [];

async function open(browser: Browser, role: DemoRole | null): Promise<Page> {
  const context = await browser.newContext(role ? { storageState: storageStateFor(role) } : {});
  const page = await context.newPage();
  page.on('dialog', (dialog) => {
    dialogs.push(`${role ?? 'anonymous'}: ${dialog.type()} ${dialog.message()}`);
    void dialog.dismiss();
  });
  return page;
}

test('a reader searches from the header: words, stems and prefixes with highlighted snippets; hostile input gets a friendly empty state', async ({ browser }) => {
  const reader = await open(browser, null);
  await reader.goto('/reviews');
  await reader.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Search' }).click();
  await reader.getByRole('searchbox', { name: 'Search words' }).fill('runtimes');
  await reader.getByRole('button', { name: 'Search' }).click();
  await expect(reader).toHaveURL(/\/search\?q=runtimes$/);
  const results = reader.getByTestId('search-results');
  // "runtimes" is stemmed to "runtim", so the demo lantern review that says "Runtime" is found.
  await expect(results.getByRole('link', { name: /Hearthglow 400: a mess-tent lantern/ })).toBeVisible();
  await expect(results.locator('mark').first()).toBeVisible();
  expect((await results.locator('mark').allTextContents()).some((t) => /^runtime/i.test(t))).toBe(true);

  // A prefix: the last word may be unfinished.
  await reader.goto('/search?q=hearthgl');
  await expect(reader.getByTestId('search-results').locator('mark', { hasText: /^Hearthglow$/ }).first()).toBeVisible();
  await expect(reader.getByTestId('search-results').getByText('Gear · Light').first()).toBeVisible();

  // FTS5 syntax never reaches MATCH raw: a lone quote, operators and NEAR answer 200.
  for (const q of ['"', 'AND OR (', 'NEAR(', '*', 'title:"x']) {
    const response = await reader.goto(`/search?q=${encodeURIComponent(q)}`);
    expect(response?.status(), q).toBe(200);
  }
  const response = await reader.goto(`/search?q=${encodeURIComponent('"')}`);
  expect(response?.status()).toBe(200);
  await expect(reader.getByTestId('search-empty')).toContainText('type a word or the start of one');
  await reader.goto('/search?q=zzqxv');
  await expect(reader.getByTestId('search-empty')).toContainText('No published review or public gear item matches');

  await reader.goto('/search?q=lantern');
  const axe = await new AxeBuilder({ page: reader }).analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  await reader.screenshot({ path: 'test-results/search-lantern.png', fullPage: true });
  expect(dialogs).toEqual([]);
});

test('publishing shows a review at once on the cached pages and in search; retracting takes it away', async ({ browser }) => {
  const title = 'Two 12 V batteries for base camp';
  const slug = 'two-12-v-batteries-for-base-camp';
  const reader = await open(browser, null);
  // Prime the cached list and the search: the approved review is not public yet.
  await reader.goto('/reviews');
  await expect(reader.getByTestId('review-list')).not.toContainText(title);
  expect((await reader.goto(`/reviews/${slug}`))?.status()).toBe(404);

  const editor = await open(browser, 'editor');
  await editor.goto('/desk/reviews/demo-review-12v-batteries');
  await editor.getByTestId('publish').click();
  await expect(editor.getByTestId('review-state').first()).toHaveText('published');

  await reader.goto('/reviews');
  await expect(reader.getByTestId('review-list').getByRole('link', { name: title })).toBeVisible();
  expect((await reader.goto(`/reviews/${slug}`))?.status()).toBe(200);
  await expect(reader.getByTestId('review-body')).toContainText('Which battery, and how big?');
  // Where to buy: rel sponsored on every link, "affiliate link" in words, and the disclosure page linked.
  const buy = reader.getByTestId('where-to-buy');
  await expect(buy.getByRole('link', { name: /Dunlow Outfitters web shop/ })).toHaveAttribute('rel', 'sponsored noopener');
  await expect(buy.getByRole('link', { name: /Basecamp Power Depot/ })).toHaveAttribute('rel', 'sponsored nofollow noopener');
  await expect(buy.getByTestId('affiliate-mark')).toHaveText(['affiliate link']);
  await buy.screenshot({ path: 'test-results/where-to-buy.png' });
  await buy.getByRole('link', { name: 'How we handle links and money' }).click();
  await expect(reader.getByRole('heading', { level: 1 })).toContainText('Disclosure');
  await reader.goto('/search?q=cool+box');
  await expect(reader.getByTestId('search-results').getByRole('link', { name: title })).toBeVisible();

  await editor.goto('/desk/reviews/demo-review-12v-batteries');
  await editor.getByTestId('open-retract').click();
  await editor.getByLabel('Public note (readers see it at the top of the review)').fill('The prices were from the wrong season. A corrected review will follow.');
  await editor.getByTestId('send-retract').click();
  await expect(editor.getByTestId('review-state').first()).toHaveText('retracted');

  await reader.goto('/reviews');
  await expect(reader.getByTestId('review-list')).not.toContainText(title);
  await reader.goto(`/reviews/${slug}`);
  await expect(reader.getByTestId('retraction')).toContainText('The prices were from the wrong season');
  await reader.goto('/search?q=cool+box');
  await expect(reader.getByTestId('search-results').or(reader.getByTestId('search-empty'))).toBeVisible();
  await expect(reader.getByRole('link', { name: title })).toHaveCount(0);
  expect(dialogs).toEqual([]);
});

test('readers compare an earlier revision with the current one, word by word', async ({ browser }) => {
  const reader = await open(browser, null);
  await reader.goto('/reviews/glowmere-hearthglow-400-lantern-review');
  await reader.getByTestId('revision-history').getByRole('link', { name: 'what changed since' }).click();
  await expect(reader.getByRole('heading', { level: 1 })).toHaveText('Changes from revision 1 to revision 2');
  await expect(reader.getByTestId('diff-legend')).toContainText('= removed');
  const body = reader.getByTestId('diff-body');
  await expect(body.locator('del').first()).toBeVisible();
  await expect(body.locator('ins').first()).toBeVisible();
  // Screen readers get the change in words, not only a style.
  await expect(body.locator('ins').first()).toContainText('[added:');
  const axe = await new AxeBuilder({ page: reader }).analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  await reader.screenshot({ path: 'test-results/review-changes.png', fullPage: true });
  expect((await reader.goto('/reviews/glowmere-hearthglow-400-lantern-review/changes?from=7'))?.status()).toBe(404);
  expect((await reader.goto('/reviews/northcairn-fellbeam-350-headlamp-review/changes?from=1'))?.status()).toBe(404);
});

test('an author adds where-to-buy links to a returned draft: http is refused with a message, https is saved', async ({ browser }) => {
  const author = await open(browser, 'reviewer');
  await author.goto('/write/demo-review-folding-panels');
  const editor = author.getByTestId('buy-links-editor');
  await editor.getByRole('button', { name: 'Add a link' }).click();
  await editor.getByLabel('Shop or page').fill('Meadow Gear Exchange');
  await editor.getByLabel('Address (https://…)').fill('http://meadow-gear.example/panels');
  await editor.getByLabel(/Affiliate link/).check();
  await editor.getByRole('button', { name: 'Save links' }).click();
  await expect(author.getByTestId('buy-links-message')).toHaveText('Please correct the marked links. Nothing was saved.');
  await expect(author.getByTestId('buy-0-url-error')).toContainText('https://');
  await editor.getByLabel('Address (https://…)').fill('https://meadow-gear.example/panels');
  await editor.getByRole('button', { name: 'Save links' }).click();
  await expect(author.getByTestId('buy-links-message')).toHaveText('Saved 1 link.');
  await author.reload();
  await expect(author.getByTestId('buy-links-editor').getByLabel('Address (https://…)')).toHaveValue('https://meadow-gear.example/panels');
  await author.getByTestId('buy-links-editor').screenshot({ path: 'test-results/buy-links-editor.png' });
  expect(dialogs).toEqual([]);
});
