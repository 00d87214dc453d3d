import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, request as playwrightRequest, test } from '@playwright/test';
import { baseURL } from '../../playwright.config';
import { storageStateFor } from './support';

/*
 * Issue 7, personal tokens: a reviewer creates a write token on /account and sees it once, a script
 * (Playwright's request context, no cookies) creates a field test and posts a logger CSV as text/csv,
 * the account page shows the token as used, the reviewer revokes it and the next call gets 401.
 */
const FIXTURE = readFileSync(path.join(process.cwd(), 'tests/fixtures/readings/lantern-fade.csv'));

test.use({ storageState: storageStateFor('reviewer') });

test('reviewer creates a token, a script uploads readings with it, revoking it stops it at once', async ({ page }) => {
  const name = `Bench logger ${Date.now().toString(36)}`;
  await page.goto('/');
  await page.getByTestId('account-link').click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(page.getByRole('heading', { name: 'Personal API tokens' })).toBeVisible();

  await page.getByLabel('Name').fill(name);
  await page.getByRole('radio', { name: /^Write/ }).check();
  await page.getByRole('button', { name: 'Create token' }).click();
  const shown = page.getByTestId('new-token-value');
  await expect(shown).toHaveValue(/^tb_[A-Za-z0-9_-]{8}_[A-Za-z0-9_-]{43}$/);
  const token = await shown.inputValue();
  await page.screenshot({ path: 'test-results/account-token-created.png', fullPage: true });

  const row = page.locator(`[data-testid="token-row"][data-token-name="${name}"]`);
  await expect(row).toContainText('Write');
  await expect(row).toContainText(token.slice(0, 11)); // the non-secret prefix
  await expect(row.getByTestId('token-last-used')).toHaveText('never');

  // Shown once: after a reload the secret is nowhere on the page.
  await page.reload();
  expect(await page.content()).not.toContain(token.slice(12));
  await expect(page.getByTestId('new-token-value')).toHaveCount(0);

  // A script: no cookies, only the token.
  const script = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${token}` } });
  const me = await script.get('/api/v1/me');
  expect(me.status()).toBe(200);
  expect((await me.json()).caller).toMatchObject({ role: 'reviewer', via: 'token', scope: 'write' });
  const created = await script.post('/api/v1/field-tests', {
    data: { kind: 'light-runtime', testedAt: '2026-11-20T18:00', placeLabel: 'Bench by the boathouse', sky: 'indoor', ambientC: 18, instruments: [], methodNotes: 'Token upload check.', items: ['glowmere-hearthglow-400'] },
  });
  expect(created.status()).toBe(201);
  const id = (await created.json()).fieldTest.id as string;
  const upload = await script.post(`/api/v1/field-tests/${id}/readings?item=glowmere-hearthglow-400&label=${encodeURIComponent('Trial 1')}`, {
    headers: { 'content-type': 'text/csv' },
    data: FIXTURE,
  });
  expect(upload.status()).toBe(201);
  expect((await upload.json()).trial.rows).toBe(38); // the fixture's 40 lines less its comment and header

  await page.reload();
  await expect(row.getByTestId('token-last-used')).toHaveText(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC$/);

  await row.getByRole('button', { name: `Revoke token ${name}` }).click();
  await expect(row).toHaveCount(0);
  await expect(page.getByTestId('revoked-tokens')).toContainText(name);

  const refused = await script.post(`/api/v1/field-tests/${id}/readings?item=glowmere-hearthglow-400&label=Trial%202`, { headers: { 'content-type': 'text/csv' }, data: FIXTURE });
  expect(refused.status()).toBe(401);
  expect(refused.headers()['www-authenticate']).toMatch(/^Bearer /);
  expect((await script.get('/api/v1/me')).status()).toBe(401);
  await script.dispose();
});
