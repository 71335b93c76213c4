import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { SpeciesListPage, expectNoPageOverflow } from './pages/species';

test('search as you type on a phone forgives word order, says which name matched and keeps the server’s order', async ({ page }) => {
  await page.setViewportSize({ width: 360, height: 740 });
  const list = new SpeciesListPage(page);
  await list.open();

  await list.search('black pine japanese');
  await expect(list.firstRowName()).toHaveText('Pinus thunbergii');
  await list.search('pine white japanese');
  await expect(list.firstRowName()).toHaveText('Pinus parviflora');
  await list.search('japanese black');
  await expect(list.firstRowName()).toHaveText('Pinus thunbergii');

  await list.search('scotch');
  await expect(list.firstRowName()).toHaveText('Pinus sylvestris');
  await expect(list.rows().first().getByTestId('species-match-note')).toHaveText('matched Scotch pine (common name)');
  await list.search('sylvestrus');
  await expect(list.rows().first().getByTestId('species-match-note')).toContainText('spelt differently');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-search-note-360'), fullPage: true });

  // The table's order is the API's order, name for name.
  for (const q of ['white pine', 'abies', 'red pine']) {
    await list.search(q);
    const api = (await (await page.request.get(`/api/species?q=${encodeURIComponent(q)}&limit=100`)).json()) as { items: { botanicalName: string }[] };
    await expect(list.rows()).toHaveCount(api.items.length);
    await expect(list.rows().getByRole('link')).toHaveText(api.items.map((i) => i.botanicalName));
  }
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-search-red-pine-360'), fullPage: true });
});

test('an import with good and bad files writes the good one and lists the bad one with its field in words', async ({ page }) => {
  await new SignInPage(page).withPassword('editor@candlewise.test');
  await page.setViewportSize({ width: 360, height: 740 });
  const source = await (await page.request.get('/api/species/pinus-cembra/export')).text();
  // Names of its own, so no later search for the names of P. cembra finds the copy.
  const good = source
    .replace('slug: pinus-cembra', 'slug: pinus-telefonica')
    .replace('botanicalName: Pinus cembra', 'botanicalName: Pinus telefonica')
    .replace(/commonNames:\n(  - .*\n)+/, 'commonNames:\n  - Handheld pine\n')
    .replace(/synonyms:\n(  - .*\n)+/, 'synonyms: []\n');
  expect(good).not.toContain('Arolla');
  const bad = good.replace('slug: pinus-telefonica', 'slug: pinus-mendosa').replace('group: pine', 'group: palm');
  await page.goto('/species/import');
  await page.getByTestId('import-files').setInputFiles([
    { name: 'good.md', mimeType: 'text/markdown', buffer: Buffer.from(good) },
    { name: 'bad.md', mimeType: 'text/markdown', buffer: Buffer.from(bad) },
  ]);
  const preview = page.getByTestId('import-preview');
  await expect(preview).toContainText('New species');
  await expect(preview).toContainText('Group: “palm” is not one of the choices. Use pine, larch, spruce, fir');
  await expect(preview).not.toContainText('Invalid option');
  await expect(page.getByTestId('import-partial')).toContainText('1 file(s) have errors and will be left out');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-import-mixed-360'), fullPage: true });

  const button = page.getByRole('button', { name: 'Import the 1 valid file(s)' });
  const box = (await button.boundingBox())!;
  expect(box.height).toBeGreaterThanOrEqual(44);
  await button.click();
  await expect(page.getByTestId('import-message')).toContainText('Imported 1 file(s) as drafts. 1 file(s) with errors were left out');
  await expect(preview).toContainText('bad.md');
  await expect(preview).not.toContainText('good.md');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-import-mixed-done-360'), fullPage: true });

  expect((await page.request.get('/api/species/pinus-telefonica')).status()).toBe(200); // the editor sees the draft
  expect((await page.request.get('/api/species/pinus-mendosa')).status()).toBe(404);
});
