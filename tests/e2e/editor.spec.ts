import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { SpeciesEditPage, expectNoPageOverflow } from './pages/species';

const SLUG = 'pinus-aristata';

test('a draft may wait for a citation; publishing from the preview needs it; history says what changed per trait', async ({ page }) => {
  await new SignInPage(page).withPassword('editor@candlewise.test');
  const edit = new SpeciesEditPage(page);
  await edit.open(SLUG);
  const vigour = page.getByTestId('field-vigour');
  await expect(vigour.getByLabel('Citation (needed to publish; a draft can wait)')).toBeVisible();
  // The save bar stays on screen at the top of a long form.
  await expect(page.getByTestId('form-actions')).toBeInViewport();
  await page.screenshot({ path: screenshotPath('species-edit-sticky-desktop') });

  // Vigour: low → high, a published value whose citation is still to be found.
  await vigour.getByLabel('Value').selectOption('high');
  await vigour.getByLabel('Source').selectOption('published');
  await vigour.getByLabel(/Citation/).fill('');
  await edit.appendToNotes('- pinch the strongest candles first\n- leave the weak ones');
  await edit.saveDraft('Raise vigour; citation to follow');
  const notice = page.getByTestId('focus-notice');
  await expect(notice).toContainText('Saved as draft revision');
  await expect(notice).toBeFocused();

  // Publishing straight from the preview is refused, naming the missing citation.
  await page.getByTestId('publish-draft').click();
  const refusal = page.getByRole('alert').filter({ hasText: 'missing citations' });
  await expect(refusal).toContainText('the citation of Vigour');
  await expect(refusal).toBeFocused();

  await edit.open(SLUG);
  await page
    .getByTestId('field-vigour')
    .getByLabel(/Citation/)
    .fill('Great Basin field guide (2004)');
  await edit.saveDraft('Add the vigour citation');
  await expect(page.getByTestId('revision-banner')).toContainText('a draft');
  await page.screenshot({ path: screenshotPath('species-draft-preview-desktop'), fullPage: true });
  await page.getByTestId('publish-draft').click();
  await expect(page.getByTestId('focus-notice')).toContainText('Published: revision');
  await expect(page.getByTestId('focus-notice')).toBeFocused();
  await expect(page.getByTestId('trait-vigour')).toContainText('High');
  await expect(page.getByTestId('revision-banner')).toHaveCount(0);

  // History: the published copy is identical to the draft before it, so the default comparison
  // skips it and shows the last real change, per trait, in words.
  await page.goto(`/species/${SLUG}/history`);
  await expect(page.getByTestId('revisions')).toContainText(/Same content as revision \d+/);
  const changes = page.getByTestId('trait-changes');
  await expect(changes).toContainText('Vigour: High; source: published, citation to come → Great Basin field guide (2004)');
  await page.screenshot({ path: screenshotPath('species-history-traits-desktop'), fullPage: true });

  // From the published revision before the edits: value and source change in one line, and the
  // appended list is added words with its bullets as text (nothing removed).
  const options = await page.getByLabel('From').locator('option').allTextContents();
  const newest = Number(options[0].match(/\d+/)![0]);
  await page.goto(`/species/${SLUG}/history?from=1&to=${newest}`);
  await expect(page.getByTestId('trait-changes')).toContainText(
    'Vigour: Low → High; source: Southern Utah University tree tour: very slow → Great Basin field guide (2004)',
  );
  const added = page.getByTestId('body-diff').getByTestId('diff-added');
  await expect(added).toContainText('- pinch the strongest candles first');
  await expect(page.getByTestId('body-diff').getByTestId('diff-removed')).toHaveCount(0);

  // Two identical revisions compare as "no differences".
  await page.goto(`/species/${SLUG}/history?from=${newest - 1}&to=${newest}`);
  await expect(page.getByTestId('no-differences')).toHaveText(`No differences: revisions ${newest - 1} and ${newest} hold the same content.`);

  await page.setViewportSize({ width: 360, height: 740 });
  await page.goto(`/species/${SLUG}/history?from=1&to=${newest}`);
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-history-traits-360'), fullPage: true });
  await edit.open(SLUG);
  await expect(page.getByTestId('form-actions')).toBeInViewport();
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-edit-sticky-360') });
});

test('at 360 px a source tooltip and long import errors stay on screen', async ({ page, request }) => {
  await new SignInPage(page).withPassword('editor@candlewise.test');
  await page.setViewportSize({ width: 360, height: 740 });
  await page.goto('/species/pinus-thunbergii');
  for (const marker of await page.getByTestId('source-marker').all()) {
    await marker.focus();
    const tip = page.getByRole('tooltip').filter({ visible: true });
    await expect(tip).toHaveCount(1);
    const box = (await tip.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(360);
    await expectNoPageOverflow(page);
  }
  await page.getByTestId('source-marker').last().focus();
  await page.screenshot({ path: screenshotPath('species-tooltip-360') });

  const good = await (await request.get('/api/species/pinus-cembra/export')).text();
  const longName = `${'pinus-with-a-very-long-file-name-that-never-breaks'.repeat(3)}.md`;
  const broken = good.replace(/flushHabit:\n(\s+)value: single/, `flushHabit:\n$1value: ${'x'.repeat(120)}`);
  await page.goto('/species/import');
  await page.getByTestId('import-files').setInputFiles([{ name: longName, mimeType: 'text/markdown', buffer: Buffer.from(broken) }]);
  await expect(page.getByTestId('import-preview')).toContainText('Flush habit (trade), value: “xxx');
  await expect(page.getByTestId('import-preview')).toContainText('Use single, double or polycyclic.');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('species-import-errors-360'), fullPage: true });
});

test('reverting asks first, then the history names the new revision and takes the focus', async ({ page }) => {
  await new SignInPage(page).withPassword('editor@candlewise.test');
  await page.goto(`/species/${SLUG}/history`);
  await page.getByRole('button', { name: 'Revert to revision 1', exact: true }).click();
  const confirm = page.getByRole('button', { name: 'Publish a copy of revision 1', exact: true });
  await expect(confirm).toBeFocused();
  await page.getByRole('button', { name: 'Keep as is' }).click();
  await expect(page.getByRole('button', { name: 'Revert to revision 1', exact: true })).toBeFocused();
  await page.getByRole('button', { name: 'Revert to revision 1', exact: true }).press('Enter');
  await page.getByRole('button', { name: 'Publish a copy of revision 1', exact: true }).press('Enter');
  const notice = page.getByTestId('focus-notice');
  await expect(notice).toContainText(/Reverted: revision \d+ is a published copy of revision 1\./);
  await expect(notice).toBeFocused();
});
