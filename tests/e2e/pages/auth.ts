import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'candlewise-demo';

export class SignInPage {
  constructor(readonly page: Page) {}

  async open() {
    await this.page.goto('/sign-in');
  }

  async withPassword(email: string, password = DEMO_PASSWORD) {
    await this.open();
    const form = this.page.getByTestId('password-form');
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Password').fill(password);
    await form.getByRole('button', { name: 'Sign in' }).click();
    // On a phone the account sits in the header's menu: present, but folded away.
    await expect(this.page.getByTestId('current-user')).toBeAttached();
  }

  async askForLink(email: string) {
    await this.open();
    const form = this.page.getByTestId('link-form');
    await form.getByLabel('E-mail').fill(email);
    await form.getByRole('button', { name: 'E-mail me a link' }).click();
    await expect(form.getByText('the link is on its way')).toBeVisible();
  }
}

export async function signOut(page: Page) {
  const menu = page.getByTestId('menu-button');
  if (await menu.isVisible()) await menu.click();
  await page.getByRole('button', { name: 'Sign out' }).click();
  // On a phone the signed-out header keeps Sign in in its menu too.
  await expect(page.getByTestId('current-user')).toHaveCount(0);
  if (await menu.isVisible()) await menu.click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
}

export function screenshotPath(name: string) {
  return `test-results/screens/${name}.png`;
}
