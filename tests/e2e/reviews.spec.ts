import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoAccount, storageStateFor, type DemoRole } from './support';

/*
 * The review workflow end to end (issue 6, "Tests: e2e"): a reviewer writes a draft with script and
 * javascript: link attempts (security-tests MD-02: no dialog, window.__xss stays undefined), submits it,
 * the editors' mail lands in the admin outbox, the editor requests changes, the reviewer edits and
 * resubmits, the editor approves and publishes, and readers see it — while drafts stay 404 to them.
 * Uses the saved demo sessions and never signs them out.
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

const xssUndefined = (page: Page) => page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss);

const PAYLOAD = [
  '## Field notes',
  '',
  'The lantern ran for **five hours** on high.',
  '',
  '<script>window.__xss = 1; alert("script")</script>',
  '',
  '[click for the manual](javascript:window.__xss=2;alert("link"))',
  '',
  '<img src="x" onerror="window.__xss=3;alert(\'img\')">',
  '',
  '[data link](data:text/html,<script>alert(1)</script>)',
  '',
  '::spec-table[glowmere-hearthglow-400]',
].join('\n');

test('a review goes from draft to published through the desk, and stays inert', async ({ browser }) => {
  test.setTimeout(120_000);
  const title = `Lantern notes for the autumn course ${Date.now().toString(36)}`;
  const reviewer = await open(browser, 'reviewer');

  // Start the draft.
  await reviewer.goto('/write');
  await reviewer.getByLabel('Title').fill(title);
  await reviewer.getByTestId('pick-glowmere-hearthglow-400').check();
  await reviewer.getByRole('button', { name: 'Start the draft' }).click();
  await expect(reviewer).toHaveURL(/\/write\/[0-9a-f-]{36}$/);
  const writeUrl = reviewer.url();
  const reviewId = writeUrl.split('/').at(-1)!;

  // Write it, with attacks in the body: the preview renders them inert.
  await reviewer.getByLabel('Summary').fill('A warm, even light for the mess tent.');
  await reviewer.getByLabel('Verdict').fill('Recommended for group tents.');
  await reviewer.getByLabel('Review (Markdown)').fill(PAYLOAD);
  await reviewer.getByLabel('How did you get the gear?').selectOption('bought-retail');
  await reviewer.getByLabel('Disclosure note').fill('Bought by the school at full price.');
  const preview = reviewer.getByTestId('preview');
  await expect(preview.getByRole('heading', { name: 'Field notes' })).toBeVisible();
  await expect(preview.locator('script, img, iframe, [onerror]')).toHaveCount(0);
  const link = preview.getByText('click for the manual');
  await expect(link).toBeVisible();
  expect(await link.getAttribute('href')).toBeNull();
  await link.click();
  await expect(preview.getByTestId('preview-spec-table')).toContainText('Hearthglow');
  await expect(reviewer.getByTestId('word-count')).toContainText('words');
  await expect(reviewer.getByTestId('save-status')).toHaveAttribute('data-state', 'saved', { timeout: 10_000 });
  expect(await xssUndefined(reviewer)).toBeUndefined();

  // Submit: locked, and the editors' mail is captured for the admin outbox.
  await reviewer.getByTestId('submit-review').click();
  await expect(reviewer.getByTestId('lock-reason')).toContainText('Submitted');
  const admin = await open(browser, 'admin');
  await admin.goto('/admin/outbox');
  const mail = admin.getByTestId('outbox').locator('li').filter({ hasText: `Review submitted: ${title}` });
  await expect(mail.filter({ hasText: demoAccount('editor').email })).toHaveCount(1);

  // The editor reads it on the desk and requests changes.
  const editor = await open(browser, 'editor');
  await editor.goto('/desk');
  await editor.getByRole('link', { name: title }).click();
  await expect(editor.getByTestId('desk-title')).toHaveText(title);
  await expect(editor.getByTestId('review-body').locator('script, img, [onerror]')).toHaveCount(0);
  await expect(editor.getByTestId('spec-table')).toContainText('Hearthglow');
  await editor.getByTestId('open-request-changes').click();
  await editor.getByLabel('What should the author change?').fill('Say which mode you timed, and drop the odd links.');
  await editor.getByTestId('send-request-changes').click();
  await expect(editor.getByTestId('review-state').first()).toHaveText('changes requested');

  // The reviewer sees the comment, edits and resubmits.
  await reviewer.goto(writeUrl);
  await expect(reviewer.getByTestId('editor-comment')).toContainText('Say which mode you timed');
  await reviewer.getByLabel('Review (Markdown)').fill('## Field notes\n\nOn high mode the lantern ran for **five hours** to 10 % of its 30-second output.\n\n::spec-table[glowmere-hearthglow-400]');
  await expect(reviewer.getByTestId('save-status')).toHaveAttribute('data-state', 'saved', { timeout: 10_000 });
  await reviewer.getByTestId('submit-review').click();
  await expect(reviewer.getByTestId('lock-reason')).toBeVisible();

  // The editor approves and publishes.
  await editor.goto(`/desk/reviews/${reviewId}`);
  await editor.getByTestId('approve').click();
  await expect(editor.getByTestId('publish')).toBeVisible();
  await editor.getByTestId('publish').click();
  await expect(editor.getByTestId('review-state').first()).toHaveText('published');

  // Readers (signed in or not) find it on /reviews and in the feed, with the disclosure on top.
  const anonymous = await open(browser, null);
  await anonymous.goto('/reviews');
  await anonymous.getByRole('link', { name: title }).click();
  await expect(anonymous.getByTestId('disclosure')).toContainText('Bought at retail');
  await expect(anonymous.getByTestId('review-body')).toContainText('On high mode');
  await expect(anonymous.getByTestId('spec-table')).toContainText('Hearthglow');
  const feed = await anonymous.request.get('/reviews/feed.xml');
  expect(feed.headers()['content-type']).toContain('application/atom+xml');
  expect(await feed.text()).toContain(title);

  for (const page of [reviewer, admin, editor, anonymous]) expect(await xssUndefined(page)).toBeUndefined();
  expect(dialogs).toEqual([]);
});

test('drafts are 404 by URL to readers and to signed-out visitors', async ({ browser }) => {
  test.setTimeout(90_000);
  // The demo seed's Fellbeam review is a draft of the second reviewer.
  const draft = '/reviews/northcairn-fellbeam-350-headlamp-review';
  for (const role of ['reader', null] as const) {
    const page = await open(browser, role);
    const response = await page.goto(draft);
    expect(response?.status()).toBe(404);
    await expect(page.getByText('Fellbeam')).toHaveCount(0);
  }
  const editor = await open(browser, 'editor');
  expect((await editor.goto(draft))?.status()).toBe(200);
  await expect(editor.getByTestId('draft-banner')).toBeVisible();
  expect(dialogs).toEqual([]);
});
