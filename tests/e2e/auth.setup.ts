import { expect, test as setup } from '@playwright/test';
import { demoAccount, resetRateLimits, signInWithPassword, storageStateFor, type DemoRole } from './support';

// Each demo role signs in once; the other tests reuse the saved session and never sign these accounts out.
for (const role of ['admin', 'editor', 'reviewer', 'reader'] as DemoRole[]) {
  setup(`sign in as the demo ${role}`, async ({ page, request }) => {
    await resetRateLimits(request);
    const account = demoAccount(role);
    await signInWithPassword(page, account.email, account.password);
    await expect(page.getByTestId('signed-in-as')).toContainText(account.name);
    await page.context().storageState({ path: storageStateFor(role) });
  });
}
