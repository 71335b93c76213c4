import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath, signOut } from './pages/auth';
import { SpeciesEditPage, SpeciesListPage, expectNoPageOverflow } from './pages/species';

test('search as you type, filter, and share the search in the URL', async ({ page }) => {
  const list = new SpeciesListPage(page);
  await list.open();
  expect(await list.rows().count()).toBeGreaterThanOrEqual(24);
  await page.screenshot({ path: screenshotPath('species-list-desktop'), fullPage: true });

  await list.search('mugho');
  await expect(list.firstRowName()).toHaveText('Pinus mugo');
  await expect(page).toHaveURL(/[?&]q=mugho/);
  await list.search('sylvestrus');
  await expect(list.firstRowName()).toHaveText('Pinus sylvestris');

  await list.search('');
  await list.filterFlush('Double flush');
  await expect(list.rows()).toHaveCount(2);
  await expect(page).toHaveURL(/flush=double/);

  // The shared URL opens with the same search.
  await list.open('?q=scotch');
  await expect(page.getByTestId('species-search')).toHaveValue('scotch');
  await expect(list.firstRowName()).toHaveText('Pinus sylvestris');

  // Sorting by needle length puts the shortest-needled species first.
  await list.open();
  await page.getByRole('button', { name: /Needles \(mm\)/ }).click();
  await expect(page.getByRole('columnheader', { name: /Needles/ })).toHaveAttribute('aria-sort', /ascending|descending/);

  await page.setViewportSize({ width: 360, height: 740 });
  await list.open('?q=pine');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-list-360'), fullPage: true });
});

test('a species page shows traits with their sources', async ({ page }) => {
  const list = new SpeciesListPage(page);
  await list.open('?q=japanese black');
  await list.firstRowName().click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Pinus thunbergii');
  await expect(page.getByTestId('trait-flushHabit')).toContainText('Double flush');
  await expect(page.getByTestId('trait-shootHabit')).toContainText('Uninodal');

  // The citation appears on keyboard focus, not only on hover.
  const marker = page.getByTestId('trait-shootHabit').getByTestId('source-marker');
  await marker.focus();
  await expect(page.getByTestId('trait-shootHabit').getByRole('tooltip')).toBeVisible();
  await expect(page.getByTestId('trait-shootHabit').getByRole('tooltip')).toContainText('Shaw 1914');
  await expect(page.getByTestId('sources')).toContainText('Flora of China vol. 4');
  await expect(page.getByTestId('wizard-summary')).toContainText('Double flush');
  await page.screenshot({ path: screenshotPath('species-detail-desktop'), fullPage: true });

  await page.setViewportSize({ width: 360, height: 740 });
  await page.goto('/species/pinus-contorta');
  await expect(page.getByRole('heading', { name: 'Cautions' })).toBeVisible();
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-detail-360'), fullPage: true });
});

test('an editor saves a draft and sees the change in the diff', async ({ page }) => {
  await new SignInPage(page).withPassword('editor@candlewise.test');
  const edit = new SpeciesEditPage(page);
  await edit.open('pinus-banksiana');
  await edit.appendToNotes('Repot every third spring.');
  await expect(page.getByTestId('body-preview')).toContainText('Repot every third spring.');
  await page.screenshot({ path: screenshotPath('species-edit-desktop'), fullPage: true });

  // A published value without a citation is refused beside its field, before anything is sent.
  const citation = page.getByTestId('field-needleLengthMm').getByLabel(/Citation/);
  const kept = await citation.inputValue();
  await citation.fill('');
  await page.getByTestId('publish').click();
  await expect(page.getByTestId('field-needleLengthMm').getByRole('alert')).toContainText('citation');
  await citation.fill(kept);

  await edit.saveDraft('Add a repotting note');
  await expect(page.getByTestId('revision-banner')).toContainText('draft');

  await page.goto('/species/pinus-banksiana/history');
  await expect(page.getByTestId('revisions')).toContainText('Add a repotting note');
  await expect(page.getByTestId('diff-added').filter({ hasText: 'Repot every third spring.' })).toBeVisible();
  await page.screenshot({ path: screenshotPath('species-history-desktop'), fullPage: true });

  await page.setViewportSize({ width: 360, height: 740 });
  await page.reload();
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-history-360'), fullPage: true });
  await edit.open('pinus-banksiana');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-edit-360'), fullPage: true });

  // Members never see the draft.
  await signOut(page);
  await new SignInPage(page).withPassword('member@candlewise.test');
  await page.goto('/species/pinus-banksiana');
  await expect(page.getByText('Repot every third spring.')).toHaveCount(0);
});

test('an editor previews an import with errors per field before anything is written', async ({ page, request }) => {
  const good = await (await request.get('/api/species/pinus-cembra/export')).text();
  // Names of its own, so later searches for the names of P. cembra still find P. cembra first.
  const fresh = good
    .replace('slug: pinus-cembra', 'slug: pinus-nova')
    .replace('botanicalName: Pinus cembra', 'botanicalName: Pinus nova')
    .replace(/commonNames:\n(  - .*\n)+/, 'commonNames:\n  - Preview pine\n')
    .replace(/synonyms:\n(  - .*\n)+/, 'synonyms: []\n');
  expect(fresh).toContain('Preview pine');
  const broken = good.replace('slug: pinus-cembra', 'slug: pinus-fracta').replace(/flushHabit:\n(\s+)value: single/, 'flushHabit:\n$1value: sometimes');

  await new SignInPage(page).withPassword('editor@candlewise.test');
  await page.goto('/species/import');
  await page.getByTestId('import-files').setInputFiles([
    { name: 'pinus-nova.md', mimeType: 'text/markdown', buffer: Buffer.from(fresh) },
    { name: 'pinus-fracta.md', mimeType: 'text/markdown', buffer: Buffer.from(broken) },
  ]);
  const preview = page.getByTestId('import-preview');
  await expect(preview).toContainText('New species');
  // The field in words, what was found and the choices; no raw paths or enum dumps.
  await expect(preview).toContainText('Flush habit (trade), value: “sometimes” is not one of the choices. Use single, double or polycyclic.');
  await expect(preview).not.toContainText('traits.flushHabit.value');
  // The good file may go in on its own, but nothing is written until the editor says so.
  await expect(page.getByRole('button', { name: 'Import the 1 valid file(s)' })).toBeVisible();
  await page.screenshot({ path: screenshotPath('species-import-desktop'), fullPage: true });
  expect((await page.request.get('/api/species/pinus-nova')).status()).toBe(404);

  await page.getByTestId('import-files').setInputFiles([{ name: 'pinus-nova.md', mimeType: 'text/markdown', buffer: Buffer.from(fresh) }]);
  await page.getByLabel(/Publish at once/).check();
  await page.setViewportSize({ width: 360, height: 740 });
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-import-360'), fullPage: true });
  await page.getByRole('button', { name: 'Import 1 file(s)' }).click();
  await expect(page.getByTestId('import-message')).toContainText('Imported 1 file(s)');
  expect((await page.request.get('/api/species/pinus-nova')).status()).toBe(200);
});
