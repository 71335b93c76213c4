import { expect, test, type Page } from '@playwright/test';
import { screenshotPath } from './pages/auth';
import { AskPage } from './pages/ask';

// The answer screen on a phone shows how to do the action, how much of the candle to keep, and
// the trade words it uses, each opening to its explanation.
test.use({ viewport: { width: 360, height: 780 }, hasTouch: true, isMobile: true });

async function runTo(page: Page, o: { species: string; shoot: string; position?: string; health: string; date: string; repotted?: boolean }) {
  const ask = new AskPage(page);
  await ask.open(`?species=${o.species}`);
  await ask.expectStep('health');
  await ask.choose('health', o.health);
  if (o.repotted) await page.getByTestId('repotted-this-year').check();
  await ask.next();
  await ask.choose('shoot', o.shoot);
  await ask.next();
  await ask.choose('branching', 'tertiary');
  await ask.next();
  await ask.choose('position', o.position ?? 'beyond-silhouette');
  await ask.next();
  await ask.expectStep('when');
  await page.getByLabel('Date you looked at the tree').fill(o.date);
  await ask.next();
  await ask.expectStep('answer');
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
}

async function openTerm(page: Page, term: string) {
  // The words sit in a folded section at the end of the answer: one tap opens it, one more the word.
  await page.getByTestId('terms').locator('summary').first().click();
  const item = page.getByTestId('terms').locator('details', { has: page.locator('summary', { hasText: new RegExp(`^${term}$`) }) });
  await item.locator('summary').click();
  await expect(item.getByTestId('term-explanation')).toBeVisible();
}

test('a pinch on a Scots pine in spring: keep part of the candle, with steps and terms', async ({ page }) => {
  await runTo(page, { species: 'pinus-sylvestris', shoot: 'candle-extending', health: 'average', date: '2027-05-10' });
  // source: University of Wisconsin Plant Disease Diagnostics Clinic (2015): remove up to half to two-thirds of a candle
  await expect(page.getByTestId('keep-candle')).toContainText('Keep about a half to two-thirds of this candle');
  await expect(page.getByTestId('how-to').locator('li')).not.toHaveCount(0);
  await openTerm(page, 'candle');
  await expect(page.getByTestId('keep-needles')).toHaveCount(0);
  await page.screenshot({ path: screenshotPath('answer-v2-pinch-360'), fullPage: true });
});

test('a decandle on a strong black pine once its needles open', async ({ page }) => {
  // common practice, no published source: strong, refined, unrepotted double-flush pines are decandled once candles finish
  await runTo(page, { species: 'pinus-thunbergii', shoot: 'needles-opening', health: 'strong', date: '2027-06-20' });
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText(/decandle/i);
  await expect(page.getByTestId('how-to')).toContainText('strongest areas last');
  await openTerm(page, 'decandle');
  await expect(page.getByTestId('feed-now')).toHaveText('Do not feed now');
  await page.screenshot({ path: screenshotPath('answer-v2-decandle-360'), fullPage: true });
});

test('the same black pine repotted this year keeps its candles', async ({ page }) => {
  // common practice, no published source: no repotting and candle cutting in one year
  await runTo(page, { species: 'pinus-thunbergii', shoot: 'needles-opening', health: 'strong', date: '2027-06-20', repotted: true });
  await expect(page.getByTestId('answer-action').getByRole('heading')).not.toHaveText(/decandle/i);
  await page.getByTestId('why').locator('summary').first().click();
  await expect(page.getByTestId('reasons')).toContainText('repotted this year');
});

test('autumn on a Scots pine at the outline: select buds and thin old needles', async ({ page }) => {
  // common practice, no published source: autumn bud selection and needle thinning
  await runTo(page, { species: 'pinus-sylvestris', shoot: 'needles-hardened', position: 'at-silhouette', health: 'average', date: '2027-10-05' });
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText('Select buds and thin old needles');
  await expect(page.getByTestId('how-to')).toContainText('keep two');
  await expect(page.getByTestId('keep-candle')).toHaveCount(0);
  await page.screenshot({ path: screenshotPath('answer-v2-autumn-360'), fullPage: true });
});
