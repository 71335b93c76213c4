import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { expectNoPageOverflow } from './pages/species';

// On a phone: import a temperature record, open a tree's season timeline, say the candles are
// extending today (which re-anchors the plan), then mark the candle work done on the home page's
// "This week" and see it leave the list.
test.use({ viewport: { width: 360, height: 780 } });

test('a member imports a record, reads a tree’s timeline and marks this week’s task done', async ({ page }) => {
  await new SignInPage(page).withPassword('member2@candlewise.test');

  const year = new Date().getUTCFullYear() - 1;
  const csv = [
    'date,tmin,tmax',
    ...Array.from({ length: 30 }, (_, i) => `${year}-04-${String(i + 1).padStart(2, '0')},${(2 + i / 5).toFixed(1)},${(11 + i / 4).toFixed(1)}`),
  ].join('\n');
  await page.goto('/season');
  await page.getByLabel('My own').check();
  await page.getByTestId('record-file').setInputFiles({ name: 'garden.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await page.getByTestId('record-preview').click();
  await expect(page.getByTestId('record-preview-result')).toContainText('Plain CSV: 30 days');
  await page.getByTestId('record-import-button').click();
  await expect(page.getByTestId('record-message')).toContainText('Imported 30 days');
  await expect(page.getByTestId('record-member')).toContainText('30 days');
  await expect(page.getByTestId('heat-sum-chart').locator('.recharts-line').first()).toBeVisible();
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('season-record-phone'), fullPage: true });

  const name = `Timeline Scots ${Date.now()}`;
  const created = await page.request.post('/api/trees', {
    data: {
      name,
      speciesSlug: 'pinus-sylvestris',
      stageNotes: '',
      containerShape: null,
      containerLengthCm: null,
      containerWidthCm: null,
      acquiredOn: null,
      collectedFromWild: false,
      collectedOn: null,
      notes: '',
    },
  });
  expect(created.status()).toBe(201);
  const id = (await created.json()).tree.id as string;

  await page.goto(`/trees/${id}`);
  const timeline = page.getByTestId('season-timeline');
  await expect(timeline).toContainText('temperature record');
  await expect(timeline.getByTestId('season-window').first()).toBeVisible();
  await timeline.getByTestId('seen-candle-extending').click();
  await expect(timeline).toContainText('what you saw on this tree');
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('season-timeline-phone'), fullPage: true });

  await page.goto('/');
  const mine = page.getByTestId('week-item').filter({ hasText: name }).filter({ hasText: 'Pinch or shorten candles' });
  await expect(mine).toHaveCount(1);
  await expectNoPageOverflow(page);
  await page.screenshot({ path: screenshotPath('this-week-phone'), fullPage: true });
  await mine.getByTestId('week-done').click();
  await expect(mine).toHaveCount(0);

  // Leave member2's trees as the other specs expect them.
  expect((await page.request.delete(`/api/trees/${id}`)).ok()).toBe(true);
});
