import { expect, test } from '@playwright/test';
import { REDIRECT_CORPUS } from '../../support/redirect-corpus';
import { DEMO_PASSWORD } from '../pages/auth';

// Sign in through the real form with each open-redirect form as the callbackUrl: Chromium must end
// on our own origin and never ask a foreign host for anything.
for (const bad of REDIRECT_CORPUS) {
  test(`sign-in with callbackUrl ${JSON.stringify(bad)} stays on the origin`, async ({ page, baseURL }) => {
    const own = new URL(baseURL!).origin;
    const foreign: string[] = [];
    await page.route('**/*', (route) => {
      const url = route.request().url();
      if (new URL(url).origin !== own) {
        foreign.push(url);
        return route.abort();
      }
      return route.continue();
    });
    await page.goto(`/sign-in?callbackUrl=${encodeURIComponent(bad)}`);
    const form = page.getByTestId('password-form');
    await form.getByLabel('E-mail').fill('member@candlewise.test');
    await form.getByLabel('Password').fill(DEMO_PASSWORD);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByTestId('current-user')).toBeVisible();
    await page.waitForLoadState('networkidle');
    expect(new URL(page.url()).origin).toBe(own);
    expect(foreign).toEqual([]);
  });
}
