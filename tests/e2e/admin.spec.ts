import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { expectNoPageOverflow } from './pages/species';

test('a role change waits for Save and a confirmation naming the person; an arrow key alone changes nothing', async ({ page }) => {
  await new SignInPage(page).withPassword('admin@candlewise.test');
  await page.goto('/admin');
  const row = page.getByTestId('user-row').filter({ hasText: 'member2@candlewise.test' });
  const role = row.getByLabel('Role of Tamsin Reed (member2@candlewise.test)');
  await expect(role).toHaveValue('member');

  // Keyboard: ArrowDown on the focused select moves the choice locally, nothing is sent.
  let patches = 0;
  page.on('request', (r) => {
    if (r.method() === 'PATCH' && r.url().includes('/api/users/')) patches++;
  });
  await role.focus();
  await role.press('ArrowDown');
  await expect(role).toHaveValue('editor');
  await expect(role).toBeFocused();
  await expect(row.getByRole('alertdialog')).toHaveCount(0);
  await expect(row.getByRole('button', { name: /Save changes/ })).toBeEnabled();
  await page.reload();
  await expect(
    page
      .getByTestId('user-row')
      .filter({ hasText: 'member2@candlewise.test' })
      .getByLabel(/Role of Tamsin Reed/),
  ).toHaveValue('member');
  expect(patches).toBe(0);

  // Save asks first, naming the person and the new role; Cancel sends nothing.
  await role.selectOption('admin');
  await row.getByRole('button', { name: 'Save changes to Tamsin Reed (member2@candlewise.test)' }).click();
  const confirm = row.getByRole('alertdialog');
  await expect(confirm).toContainText('Make Tamsin Reed (member2@candlewise.test) an Administrator (now Member)?');
  await expect(confirm.getByRole('button', { name: 'Yes, save' })).toBeFocused();
  await page.screenshot({ path: screenshotPath('admin-confirm-desktop'), fullPage: true });
  await confirm.getByRole('button', { name: 'Cancel' }).click();
  await expect(row.getByRole('button', { name: /Save changes/ })).toBeFocused();
  expect(patches).toBe(0);

  await role.selectOption('librarian');
  await row.getByRole('button', { name: /Save changes/ }).click();
  await row.getByRole('alertdialog').getByRole('button', { name: 'Yes, save' }).click();
  const result = row.getByTestId('user-result');
  await expect(result).toHaveText('Saved: Tamsin Reed is now Librarian. It applies from their next request.');
  await expect(result).toBeFocused();
  expect(patches).toBe(1);
  await page.reload();
  await expect(
    page
      .getByTestId('user-row')
      .filter({ hasText: 'member2@candlewise.test' })
      .getByLabel(/Role of Tamsin Reed/),
  ).toHaveValue('librarian');

  // Put it back, so that the other tests see the seeded roles.
  await role.selectOption('member');
  await row.getByRole('button', { name: /Save changes/ }).click();
  await row.getByRole('alertdialog').getByRole('button', { name: 'Yes, save' }).click();
  await expect(result).toContainText('now Member');
});

test('disabling needs a confirmation too; on a phone the members are cards with every control on screen', async ({ page }) => {
  await new SignInPage(page).withPassword('admin@candlewise.test');
  await page.setViewportSize({ width: 360, height: 740 });
  await page.goto('/admin');
  await expect(page.getByTestId('users-table')).toBeHidden();
  const card = page.getByTestId('user-card').filter({ hasText: 'member2@candlewise.test' });
  // The role control is inside the screen's width (in the old table it sat off-screen).
  const box = await card.getByLabel(/Role of Tamsin Reed/).boundingBox();
  expect(box!.x).toBeGreaterThanOrEqual(0);
  expect(box!.x + box!.width).toBeLessThanOrEqual(360);
  await expectNoPageOverflow(page);
  await card.getByLabel(/Account of Tamsin Reed/).selectOption('disabled');
  await card.getByRole('button', { name: /Save changes/ }).click();
  await expect(card.getByRole('alertdialog')).toContainText('Disable Tamsin Reed (member2@candlewise.test)’s account: they are signed out and cannot sign in?');
  await page.screenshot({ path: screenshotPath('admin-360'), fullPage: true });
  await card.getByRole('button', { name: 'Yes, save' }).click();
  await expect(card.getByTestId('user-result')).toHaveText('Saved: Tamsin Reed is disabled. It applies from their next request.');
  await card.getByLabel(/Account of Tamsin Reed/).selectOption('active');
  await card.getByRole('button', { name: /Save changes/ }).click();
  await card.getByRole('button', { name: 'Yes, save' }).click();
  await expect(card.getByTestId('user-result')).toContainText('enabled');
  await expectNoPageOverflow(page);
});
