import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { expectNoPageOverflow } from './pages/species';

// An administrator sends a week's reminders and watches the run settle; the demo member, whose
// Scots pine has its candle work in May, gets one message; the link in it stops the reminders.
test('an administrator runs a week of reminders and sees it settle; the member stops them from the mail', async ({ page, browser }) => {
  await new SignInPage(page).withPassword('admin@candlewise.test');
  await page.goto('/admin');
  const panel = page.getByTestId('reminder-runs');
  await panel.getByLabel('Week of').fill('2027-05-11');
  await panel.getByRole('button', { name: 'Send the week’s reminders' }).click();
  const run = panel.getByTestId('reminder-run').filter({ hasText: 'Week of 2027-05-10' }).first();
  await expect(run).toHaveAttribute('data-finished', 'yes', { timeout: 30_000 });
  await expect(run.getByTestId('run-sent')).toHaveText('1 sent');
  await expect(run).toContainText('finished');
  await page.screenshot({ path: screenshotPath('admin-reminders-desktop'), fullPage: true });

  // The button is a full touch target, and the panel fits a phone.
  const box = await panel.getByRole('button', { name: 'Send the week’s reminders' }).boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(44);
  await page.setViewportSize({ width: 360, height: 800 });
  await page.reload();
  await expectNoPageOverflow(page);
  await page.getByTestId('reminder-runs').scrollIntoViewIfNeeded();
  await page.screenshot({ path: screenshotPath('admin-reminders-phone'), fullPage: true });

  // The mail in the outbox carries its own link; opening it and confirming turns reminders off.
  const res = await page.request.get('/api/outbox?limit=200');
  const mail = ((await res.json()).items as { to: string[]; subject: string; text: string }[]).find(
    (m) => m.to.includes('member@candlewise.test') && m.subject.includes('week of 10 May 2027'),
  )!;
  expect(mail.text).toContain('Pinch or shorten candles');
  const link = new URL(/https?:\/\/\S+\/unsubscribe\?token=\S+/.exec(mail.text)![0]);

  const memberContext = await browser.newContext({ viewport: { width: 360, height: 800 } });
  const member = await memberContext.newPage();
  await new SignInPage(member).withPassword('member@candlewise.test');
  await member.goto('/profile');
  await expect(member.getByLabel('Send me a weekly e-mail of the tasks due on my trees')).toBeChecked();
  await member.goto(link.pathname + link.search);
  await expect(member.getByRole('heading', { name: 'Stop the weekly reminders' })).toBeVisible();
  await expectNoPageOverflow(member);
  await member.screenshot({ path: screenshotPath('unsubscribe-reminders-phone'), fullPage: true });
  await member.getByRole('button', { name: 'Stop these e-mails' }).click();
  await expect(member.getByTestId('unsubscribed')).toContainText('no more weekly reminders');
  await member.goto('/profile');
  await expect(member.getByLabel('Send me a weekly e-mail of the tasks due on my trees')).not.toBeChecked();
  await expect(member.getByLabel('Send me meeting notes by e-mail when the librarian publishes them')).toBeChecked();
  await expectNoPageOverflow(member);
  await member.screenshot({ path: screenshotPath('profile-reminders-phone'), fullPage: true });
  // Back on, for the specs that follow.
  await member.getByLabel('Send me a weekly e-mail of the tasks due on my trees').check();
  await member.getByRole('button', { name: 'Save' }).click();
  await expect(member.getByRole('status').filter({ hasText: 'Saved.' })).toBeVisible();
  await memberContext.close();
});
