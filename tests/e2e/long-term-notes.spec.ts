import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { resetRateLimits, storageStateFor } from './support';

/*
 * Long-term notes in the browser: the demo reviewer adds a note to a panel they own from its item page
 * (a refused empty title first), submits it from the note page, sees it in the logbook; the editor approves
 * it on the review desk; a guest sees it in the item page's timeline with a real date. Screenshots of the
 * timeline and the desk go to SHOTS_DIR when set.
 */

const ITEM_SLUG = 'brackenfold-heathray-28'; // demo panel owned by the demo reviewer, no demo notes (db/seed)
const SHOTS = process.env.SHOTS_DIR;

test.beforeAll(async ({ request }) => {
  await resetRateLimits(request);
});

test('a reviewer adds a note to their own item and submits it; the editor approves it from the desk; a guest sees it in the timeline', async ({ browser }) => {
  test.setTimeout(240_000); // three browsers and a send-back round on a shared 2-core machine
  const title = `Hinge webbing frayed at the fold ${Date.now().toString(36)}`;
  const day = new Date(Date.now() - 2 * 24 * 3600 * 1000).toISOString().slice(0, 10);

  // The reviewer, from the item page.
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const page = await reviewer.newPage();
  await page.goto(`/gear/${ITEM_SLUG}`);
  await page.getByRole('link', { name: 'Add a long-term note' }).click();
  await expect(page.getByRole('heading', { name: 'Add a long-term note' })).toBeVisible();
  await page.getByLabel('Date of the note').fill(day);
  await page.getByLabel('Months in service').fill('3');
  await page.getByLabel('What the note is about').selectOption('wear');
  await page.getByLabel('The note (Markdown)').fill('The webbing at the **centre fold** has frayed where it rubs on the junction box.');
  await page.getByRole('button', { name: 'Save as draft' }).click();
  await expect(page.getByTestId('ltn-title-error')).toContainText('short title'); // nothing sent without a title
  await page.getByLabel('Short title').fill(title);
  await page.getByRole('button', { name: 'Save as draft' }).click();
  await page.waitForURL(/\/logbook\/notes\/[0-9a-f-]+$/);
  const id = page.url().split('/').pop()!;
  await expect(page.getByTestId('long-term-note-title')).toHaveText(title);
  await expect(page.getByTestId('gear-status')).toHaveText('Draft');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByTestId('gear-status')).toHaveText('In review');
  await page.goto('/logbook');
  await expect(page.locator(`[data-long-term-note="${id}"]`)).toContainText(title);
  await expect(page.locator(`[data-long-term-note="${id}"]`)).toContainText('In review');

  // A guest does not see it yet, and has no "Add" link.
  const guest = await browser.newContext({ storageState: { cookies: [], origins: [] } });
  const guestPage = await guest.newPage();
  await guestPage.goto(`/gear/${ITEM_SLUG}`);
  await expect(guestPage.getByText(title)).toHaveCount(0);
  await expect(guestPage.getByRole('link', { name: 'Add a long-term note' })).toHaveCount(0);

  // The editor, on the review desk.
  const editor = await browser.newContext({ storageState: storageStateFor('editor') });
  const desk = await editor.newPage();
  await desk.goto('/desk');
  const row = desk.getByTestId('desk-queue').getByRole('row').filter({ hasText: title });
  await expect(row).toContainText('Long-term note');
  await row.getByRole('link', { name: title }).click();
  const card = desk.locator(`#long-term-note-${id}`);
  await expect(card).toBeInViewport();
  await expect(card.getByTestId('long-term-note-body').locator('strong')).toHaveText('centre fold');
  const deskAxe = await new AxeBuilder({ page: desk }).include('[data-testid="desk-long-term-notes"]').analyze();
  expect(deskAxe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  if (SHOTS) await desk.getByTestId('desk-long-term-notes').screenshot({ path: `${SHOTS}/long-term-notes-desk.png` });

  // Sent back first: a comment is needed; the author sees it, answers and submits again.
  await card.getByRole('button', { name: 'Send back…' }).click();
  await card.getByRole('button', { name: 'Send back to the author' }).click();
  await expect(card.getByTestId('form-message')).toContainText('comment');
  await card.getByLabel('What should the author change?').fill('Say how long the panel has been in service on the junction-box side.');
  await card.getByRole('button', { name: 'Send back to the author' }).click();
  await expect(desk.locator(`#long-term-note-${id}`)).toHaveCount(0);
  await page.goto(`/logbook/notes/${id}`);
  await expect(page.getByTestId('send-back-comment')).toContainText('junction-box side');
  await page.getByLabel('The note (Markdown)').fill('The webbing at the **centre fold** has frayed where it rubs on the junction box, after about 40 days of daily use.');
  await page.getByRole('button', { name: 'Save the note' }).click();
  await expect(page.getByTestId('form-message')).toHaveText('Saved.');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByTestId('gear-status')).toHaveText('In review');

  await desk.reload();
  await desk.locator(`#long-term-note-${id}`).getByRole('button', { name: 'Approve and publish' }).click();
  await expect(desk.locator(`#long-term-note-${id}`)).toHaveCount(0);

  // The guest now sees it in the timeline: an ordered list, a real date, months and the kind in words.
  await guestPage.reload();
  const timeline = guestPage.getByTestId('long-term-timeline');
  const entry = timeline.getByRole('listitem').filter({ hasText: title });
  await expect(entry).toBeVisible();
  await expect(entry.locator('time')).toHaveAttribute('datetime', day);
  await expect(entry).toContainText('3 months in service');
  await expect(entry.getByTestId('long-term-note-kind')).toHaveText('Wear');
  await expect(timeline.locator('ol')).toHaveCount(1);
  const axe = await new AxeBuilder({ page: guestPage }).include('[data-testid="long-term-timeline"]').analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  const api = await guest.request.get(`/api/v1/gear/${ITEM_SLUG}/notes`);
  expect(((await api.json()) as { notes: { id: string }[] }).notes.map((n) => n.id)).toContain(id);

  // The demo lantern's timeline (several notes over months) for the screenshot, desktop and phone width.
  await guestPage.goto('/gear/glowmere-hearthglow-400');
  const demoTimeline = guestPage.getByTestId('long-term-timeline');
  await expect(demoTimeline.locator('ol > li')).toHaveCount(2); // notes, not the lists inside a note's Markdown
  if (SHOTS) {
    await demoTimeline.screenshot({ path: `${SHOTS}/long-term-timeline-desktop.png` });
    await guestPage.setViewportSize({ width: 390, height: 844 });
    await demoTimeline.screenshot({ path: `${SHOTS}/long-term-timeline-phone.png` });
  }
  await Promise.all([reviewer.close(), guest.close(), editor.close()]);
});

test('a reader sees no way to add a note, and the note page of a draft answers 404 to another reviewer', async ({ browser }) => {
  const reader = await browser.newContext({ storageState: storageStateFor('reader') });
  const page = await reader.newPage();
  await page.goto('/gear/glowmere-hearthglow-400');
  await expect(page.getByTestId('long-term-timeline')).toBeVisible();
  await expect(page.getByRole('link', { name: 'Add a long-term note' })).toHaveCount(0);
  const form = await page.goto('/logbook/notes/new?item=glowmere-hearthglow-400');
  expect(form?.status()).toBe(403);
  // The demo draft belongs to the second reviewer: the first one (and the reader) get the not-found page.
  const draft = await page.goto('/logbook/notes/demo-ltn-deepwell-bench');
  expect(draft?.status()).toBe(404);
  await reader.close();
  const reviewer = await browser.newContext({ storageState: storageStateFor('reviewer') });
  const other = await reviewer.newPage();
  expect((await other.goto('/logbook/notes/demo-ltn-deepwell-bench'))?.status()).toBe(404);
  await reviewer.close();
});
