import { expect, test } from '@playwright/test';
import { SignInPage } from '../pages/auth';

// Under the nonce policy the app still hydrates and no script of ours is refused.
test('pages run under the nonce policy with no Content-Security-Policy violation', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (execute|load)/i.test(m.text())) violations.push(m.text());
  });
  await new SignInPage(page).withPassword('member@candlewise.test');
  for (const path of ['/', '/species', '/ask', '/trees', '/notes', '/answers']) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
    // Client navigation works only once React has hydrated.
    await expect(page.getByTestId('current-user')).toBeVisible();
  }
  expect(violations).toEqual([]);
});
