import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { TreesPage } from './pages/trees';
import { htmlRenamedPng, jpegPhoto } from '../support/images';

test('a member adds a tree, uploads a photo and sees it on the tree; a refused file costs nothing else', async ({ page }) => {
  await new SignInPage(page).withPassword('member2@candlewise.test');
  const trees = new TreesPage(page);

  // The form refuses a rectangle without a width, beside the field.
  await page.goto('/trees/new');
  const form = page.getByTestId('tree-form');
  await form.getByLabel('Name').fill('Weir-side mugo');
  await form.getByLabel('Species').selectOption({ label: 'Pinus mugo — Mugo pine' });
  await form.getByLabel('Shape').selectOption({ label: 'Rectangular' });
  await form.getByLabel('Length (cm)').fill('40');
  await form.getByRole('button', { name: 'Add tree' }).click();
  await expect(form.getByText('Give the width.')).toBeVisible();
  await form.getByLabel('Width (cm)').fill('30');
  await form.getByLabel('Yes').check();
  await expect(form.getByTestId('collecting-caution')).toContainText('permit');
  const collectedOn = new Date(Date.now() - 60 * 86_400_000).toISOString().slice(0, 10);
  await form.getByLabel('Date collected').fill(collectedOn);
  await page.screenshot({ path: screenshotPath('tree-form-desktop'), fullPage: true });
  await form.getByRole('button', { name: 'Add tree' }).click();
  await expect(page.getByTestId('tree-name')).toHaveText('Weir-side mugo');
  await expect(page.getByTestId('ask-about-tree')).toHaveAttribute(
    'href',
    new RegExp(`/ask\\?tree=[^&]+&species=pinus-mugo&shape=rectangle&lengthCm=40&widthCm=30&collected=1&collectedOn=${collectedOn}$`),
  );
  await expect(page.getByTestId('season-timeline')).toContainText('Recovery stage');

  // Two files at once: the disguised HTML is refused by the server, the photo arrives.
  await page.getByTestId('photo-input').setInputFiles([
    { name: 'not-a-photo.png', mimeType: 'image/png', buffer: htmlRenamedPng },
    { name: 'spring candles.jpg', mimeType: 'image/jpeg', buffer: await jpegPhoto(1600, 1200, { gps: true }) },
  ]);
  const jobs = page.getByTestId('upload-job');
  await expect(jobs.filter({ hasText: 'not-a-photo.png' })).toHaveAttribute('data-status', 'failed');
  await expect(jobs.filter({ hasText: 'not-a-photo.png' })).toContainText('Only JPEG, PNG and WebP');
  await expect(jobs.filter({ hasText: 'spring candles.jpg' })).toHaveAttribute('data-status', 'done');
  const photo = page.getByTestId('photo-list').getByTestId('photo');
  await expect(photo).toHaveCount(1);
  const img = photo.locator('img');
  await expect(img).toHaveJSProperty('complete', true);
  expect(await img.evaluate((el: HTMLImageElement) => el.naturalWidth)).toBe(400);
  await expect(page.getByText('removes the location and camera details')).toBeVisible();
  await page.screenshot({ path: screenshotPath('tree-page-desktop'), fullPage: true });

  // After a reload the photo is still there (stored, not just shown).
  await page.reload();
  await expect(page.getByTestId('photo-list').getByTestId('photo')).toHaveCount(1);

  await page.setViewportSize({ width: 360, height: 740 });
  await page.reload();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('tree-page-360'), fullPage: true });

  await trees.open();
  await page.screenshot({ path: screenshotPath('trees-360'), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 900 });
  await trees.add({ name: 'Alder corner Scots', species: 'Pinus sylvestris — Scots pine', shape: 'Round', length: '32' });
  await trees.open();
  const rows = page.getByTestId('tree-row');
  await expect(rows).toHaveCount(2);
  await expect(rows.first()).toContainText('Alder corner Scots');
  await page.getByRole('button', { name: 'Name' }).click();
  await expect(rows.first()).toContainText('Weir-side mugo');
  await page.screenshot({ path: screenshotPath('trees-desktop'), fullPage: true });
});
