import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { AskPage } from './pages/ask';

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

test('a beginner on a phone runs the wizard and saves the answer', async ({ page }) => {
  await new SignInPage(page).withPassword('member@candlewise.test');
  const ask = new AskPage(page);
  await ask.open('?start=new');
  // A member with trees is asked which one first.
  await ask.expectStep('tree');
  await ask.choose('tree', 'none');
  await ask.next();
  await ask.expectStep('species');
  await expect(page.getByTestId('ask-next')).toBeDisabled();
  await ask.pickSpecies('scots', 'Scots pine');
  await ask.next();

  await ask.expectStep('health');
  await ask.choose('health', 'average');
  await ask.next();
  await ask.expectStep('shoot');
  await ask.choose('shoot', 'candle-extending');
  await ask.next();
  await ask.expectStep('branching');
  await ask.choose('branching', 'tertiary');
  await ask.next();
  await ask.expectStep('position');
  await ask.choose('position', 'beyond-silhouette');
  await ask.next();

  await ask.expectStep('when');
  await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
  await page.getByLabel('Shape').selectOption('rectangle');
  await page.getByLabel('Length (cm)').fill('40');
  await page.getByLabel('Width (cm)').fill('30');

  // Refresh keeps the step and the answers; the back button walks back a step and forward again.
  await page.reload();
  await ask.expectStep('when');
  await expect(page.getByLabel('Width (cm)')).toHaveValue('30');
  await page.goBack();
  await ask.expectStep('position');
  await expect(page.getByTestId('choice-position-beyond-silhouette').getByRole('radio')).toBeChecked();
  await page.goForward();
  await ask.expectStep('when');
  await ask.next();

  await ask.expectStep('answer');
  const action = page.getByTestId('answer-action');
  // source: University of Wisconsin Plant Disease Diagnostics Clinic (2015): an average candle keeps a half to two-thirds
  await expect(action.getByRole('heading')).toHaveText(/^Shorten this candle/);
  await expect(page.getByTestId('keep-candle')).toContainText('about a half to two-thirds of this candle');
  await expect(page.getByTestId('day-length')).toContainText('of daylight at 45.5° N');
  // Reasons, cautions and feeding are folded sections below Save: one tap opens each.
  for (const id of ['feeding', 'why', 'cautions']) await page.getByTestId(id).locator('summary').first().click();
  await expect(page.getByTestId('feeding')).toContainText('4 piles of 6–8 pellets');
  await expect(page.getByTestId('reasons')).toContainText('Source: common practice');
  await expect(page.getByTestId('cautions')).toContainText('pets and children');
  // Large targets: the main buttons are at least 44 px tall.
  for (const b of await page.getByRole('button', { name: /Save answer|Change my answers/ }).all()) {
    expect((await b.boundingBox())!.height).toBeGreaterThanOrEqual(44);
  }
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('wizard-answer-phone'), fullPage: true });

  await page.getByText('Add a note or share with the club').click();
  await page.getByLabel('Note (optional)').fill('long shoot, south side');
  await page.getByRole('button', { name: 'Save answer' }).click();
  await expect(page.getByTestId('saved')).toBeVisible();
  await page.getByRole('link', { name: 'Open the saved answer' }).click();
  await expect(page).toHaveURL(/\/answers\/[A-Za-z0-9_-]{10,}$/);
  await expect(page.getByTestId('asker')).toContainText('Wren Alder');
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText(/^Shorten this candle/);
  await page.getByLabel('What happened since').fill('pinched on 12 May; second elongation by 1 June');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByText('Saved.')).toBeVisible();
  await page.getByRole('button', { name: 'Re-run this answer' }).click();
  await expect(page.getByTestId('rerun-result')).toContainText('Same answer today');
  await page.screenshot({ path: screenshotPath('answer-permalink-phone'), fullPage: true });

  await page.goto('/answers');
  await expect(page.getByTestId('answers-list')).toContainText('Scots pine');
  await page.screenshot({ path: screenshotPath('answers-history-phone'), fullPage: true });
});

test('a link pre-fills species and pot; a development branch skips the outline question', async ({ page }) => {
  const ask = new AskPage(page);
  // A step that cannot be reached yet opens the first open question instead.
  await ask.open('?species=pinus-thunbergii&shape=round&lengthCm=30&step=when');
  await ask.expectStep('health');
  await expect(page.getByTestId('ask-progress')).toContainText('Question 2 of 6');
  await ask.choose('health', 'strong');
  await ask.next();
  await ask.choose('shoot', 'needles-hardened');
  await page.screenshot({ path: screenshotPath('wizard-shoot-phone'), fullPage: true });
  await ask.next();
  await ask.expectStep('branching');
  await ask.choose('branching', 'secondary');
  await expect(page.getByTestId('ask-progress')).toContainText('of 5');
  await ask.choose('backBuds', 'yes');
  await page.screenshot({ path: screenshotPath('wizard-branching-phone'), fullPage: true });
  await ask.next();
  await ask.expectStep('when');
  await expect(page.getByLabel('Diameter (cm)')).toHaveValue('30');
  await page.getByLabel('Date you looked at the tree').fill('2027-08-01');
  await ask.next();
  // common practice, no published source: back buds present and needles hardened in development → cut back to them
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText('Cut this shoot back, leaving at least 2 needle pairs');
  await page.getByTestId('feeding').locator('summary').first().click();
  await expect(page.getByTestId('feeding')).toContainText('10–12 pellets');
  await expect(page.getByRole('link', { name: 'Sign in to save it' })).toBeVisible();
  await page.setViewportSize({ width: 360, height: 740 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('wizard-answer-360'), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.screenshot({ path: screenshotPath('wizard-answer-desktop'), fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });

  // Signing in to save comes back to the same answer.
  await page.getByRole('link', { name: 'Sign in to save it' }).click();
  const form = page.getByTestId('password-form');
  await form.getByLabel('E-mail').fill('member2@candlewise.test');
  await form.getByLabel('Password').fill('candlewise-demo');
  await form.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/ask\?step=answer/);
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText('Cut this shoot back, leaving at least 2 needle pairs');
  await page.getByText('Add a note or share with the club').click();
  await page.getByLabel('Who can see it').selectOption('club');
  await page.getByRole('button', { name: 'Save answer' }).click();
  await expect(page.getByTestId('saved')).toBeVisible();

  await page.getByRole('button', { name: 'Change my answers' }).click();
  await ask.expectStep('when');
  await page.getByRole('button', { name: 'Back' }).click();
  await ask.expectStep('branching');
});
