import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath, signOut } from './pages/auth';

test('home page offers the two doors, on a desktop and at 360 px', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByTestId('door-ask')).toBeVisible();
  await expect(page.getByTestId('door-species')).toBeVisible();
  await page.screenshot({ path: screenshotPath('home-desktop'), fullPage: true });
  await page.setViewportSize({ width: 360, height: 740 });
  await page.reload();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('home-360'), fullPage: true });
});

test('a new grower signs up, opens the mailed link, and signs in as a member', async ({ page, browser }) => {
  const email = `juniper-${Date.now()}@candlewise.test`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Juniper Lake');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('password123');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('That password is on every list of common passwords')).toBeVisible();
  await page.getByLabel('Password').fill('willow-by-the-weir');
  await page.getByRole('button', { name: 'Create account' }).click();
  const sent = page.getByTestId('sign-up-sent');
  await expect(sent).toContainText('Check your e-mail');
  await expect(sent).toContainText(email);
  await expect(sent).toBeFocused();
  await page.setViewportSize({ width: 360, height: 740 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('sign-up-sent-360') });
  await page.setViewportSize({ width: 1280, height: 900 });

  // The link, read from the club's outbox as the administrator.
  const adminCtx = await browser.newContext();
  const admin = await adminCtx.newPage();
  await new SignInPage(admin).withPassword('admin@candlewise.test');
  await admin.goto('/admin/outbox');
  const message = admin.getByTestId('outbox-message').filter({ hasText: email }).filter({ hasText: 'Confirm your Candlewise account' });
  await expect(async () => {
    await admin.reload();
    await expect(message).toHaveCount(1, { timeout: 1000 });
  }).toPass({ timeout: 15_000 });
  const text = (await message.getByTestId('outbox-text').textContent()) ?? '';
  const link = /https?:\/\/\S+\/sign-up\/confirm\?token=[A-Za-z0-9_-]+/.exec(text)?.[0];
  expect(link).toBeTruthy();
  await adminCtx.close();

  await page.goto(new URL(link!).pathname + new URL(link!).search);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Confirm your account');
  await page.getByRole('button', { name: 'Create my account' }).click();
  await expect(page.getByTestId('account-ready')).toBeVisible();
  await expect(page.getByTestId('password-form').getByLabel('E-mail')).toHaveValue(email);
  await page.getByTestId('password-form').getByLabel('Password').fill('willow-by-the-weir');
  await page.getByTestId('password-form').getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('current-role')).toHaveText('Member');
  await expect(page.getByTestId('main-nav').getByRole('link', { name: 'Admin' })).toHaveCount(0);
});

test('each demo role sees its navigation; only the admin reaches the admin page', async ({ page }) => {
  const signIn = new SignInPage(page);
  for (const [email, label] of [
    ['member@candlewise.test', 'Member'],
    ['editor@candlewise.test', 'Species editor'],
    ['librarian@candlewise.test', 'Librarian'],
  ] as const) {
    await signIn.withPassword(email);
    await expect(page.getByTestId('current-role')).toHaveText(label);
    await expect(page.getByTestId('main-nav').getByRole('link', { name: 'Admin' })).toHaveCount(0);
    const res = await page.goto('/admin');
    expect(res?.status()).toBe(403);
    await expect(page.getByTestId('forbidden')).toBeVisible();
    await signOut(page);
  }
  await signIn.withPassword('admin@candlewise.test');
  for (const name of ['Species', 'Ask', 'Answers', 'Trees', 'Notes', 'Admin']) {
    await expect(page.getByTestId('main-nav').getByRole('link', { name })).toBeVisible();
  }
  await page.getByTestId('main-nav').getByRole('link', { name: 'Admin' }).click();
  await expect(page.getByTestId('users-table')).toBeVisible();
  await page.getByLabel('Search by name or e-mail').fill('librarian');
  await expect(page.getByTestId('users-table').locator('tbody tr')).toHaveCount(1);
  await page.screenshot({ path: screenshotPath('admin'), fullPage: true });
});

test('signing in with the e-mail link read from the outbox', async ({ page, browser }) => {
  const signIn = new SignInPage(page);
  await signIn.askForLink('editor@candlewise.test');
  // The admin reads the outbox in another browser context.
  const adminCtx = await browser.newContext();
  const admin = await adminCtx.newPage();
  await new SignInPage(admin).withPassword('admin@candlewise.test');
  await admin.goto('/admin/outbox');
  const message = admin.getByTestId('outbox-message').filter({ hasText: 'editor@candlewise.test' }).first();
  await expect(message).toBeVisible();
  await admin.screenshot({ path: screenshotPath('outbox'), fullPage: true });
  const text = await message.getByTestId('outbox-text').innerText();
  const link = text.match(/https?:\/\/\S+/)![0];
  await adminCtx.close();

  await page.goto(link);
  await expect(page.getByTestId('current-role')).toHaveText('Species editor');
  // The same link does not work twice.
  await signOut(page);
  await page.goto(link);
  await expect(page.getByText('That sign-in link has been used already or has expired')).toBeVisible();
});
