import { expect, test } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { NoteEditorPage } from './pages/notes';

const SHARED_ANSWER = 'demoAnsWeirScots1'; // seeded, shared with the club

test('a librarian writes a note linking a shared answer, publishes it and sends the digest, which reaches the outbox', async ({ page, browser }) => {
  await new SignInPage(page).withPassword('librarian@candlewise.test');
  const editor = new NoteEditorPage(page);
  await editor.openNew();
  const title = `Needle-hardening evening ${Date.now()}`;
  await editor.fill(title, '2026-06-20', 'We looked again at ');
  // The cursor sits at the end of the text: the link goes there.
  await page.getByLabel('Note (Markdown)').press('End');
  await editor.insertSharedAnswer('scots', 'Wren Alder');
  const body = page.getByLabel('Note (Markdown)');
  // Each link goes on a line of its own, so two in a row never run together.
  await expect(body).toHaveValue(`We looked again at \n[pinch on Scots pine](/answers/${SHARED_ANSWER})\n`);
  // The picker tells lookalike answers apart: member and tree beside action, species and date.
  await expect(page.getByTestId('picker-answer').filter({ hasText: 'Wren Alder' }).first()).toContainText(/tree “[^”]+”|no tree named/);
  await page
    .getByTestId('picker-answers')
    .getByRole('button', { name: /^Insert link to/ })
    .first()
    .click();
  await expect(body).toHaveValue(
    new RegExp(`^We looked again at \\n\\[pinch on Scots pine\\]\\(/answers/${SHARED_ANSWER}\\)\\n\\[[^\\]]+\\]\\(/answers/\\w+\\)\\n$`),
  );
  await page.screenshot({ path: screenshotPath('note-picker-desktop'), fullPage: true });
  await body.press('ControlOrMeta+End');
  await body.pressSequentially(' and agreed to pinch early.\n\n<script>alert(1)</script>');
  const preview = page.getByTestId('note-preview');
  await expect(preview.locator('a.link-card').first()).toContainText('asked by Wren Alder');
  await expect(preview).toContainText('agreed to pinch early');
  await expect(preview.locator('script')).toHaveCount(0);
  await page.screenshot({ path: screenshotPath('note-editor-desktop'), fullPage: true });

  await page.getByRole('button', { name: 'Publish' }).click();
  await expect(page.getByTestId('note-title')).toHaveText(title);
  await expect(page.getByTestId('focus-notice')).toHaveText('Saved and published: members can read this note.');
  await expect(page.getByTestId('focus-notice')).toBeFocused();
  const card = page.getByTestId('note-body').locator('a.link-card').first();
  await expect(card).toHaveAttribute('href', `/answers/${SHARED_ANSWER}`);
  await expect(card).toContainText('Pinch · Scots pine · 12 April 2026 · asked by Wren Alder');
  await page.screenshot({ path: screenshotPath('note-desktop'), fullPage: true });

  // Print view: the site header and the actions are gone.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByTestId('brand')).toBeHidden();
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await page.screenshot({ path: screenshotPath('note-print'), fullPage: true });
  await page.emulateMedia({ media: 'screen' });

  const digest = page.getByTestId('send-digest');
  const optedIn = Number((await digest.getByText(/members? asked for meeting notes/).innerText()).match(/(\d+) member/)![1]);
  await digest.getByRole('button', { name: 'Send to members' }).click();
  // First a preview, as a member will get it, with the number of recipients; nothing is sent yet.
  const digestPreview = digest.getByTestId('digest-preview');
  await expect(digestPreview.getByRole('heading', { name: 'Check the e-mail before it goes out' })).toBeFocused();
  await expect(digestPreview.getByTestId('digest-recipients')).toHaveText(
    `It goes to ${optedIn} member${optedIn === 1 ? '' : 's'}, one message each with their own link to stop them.`,
  );
  const htmlPart = digestPreview.frameLocator('[data-testid=digest-preview-html]');
  await expect(htmlPart.getByRole('heading', { level: 1 })).toHaveText(title);
  await expect(htmlPart.getByText('asked by Wren Alder').first()).toBeVisible();
  await expect(htmlPart.getByRole('link', { name: 'Stop these e-mails' })).toHaveAttribute('href', /\/unsubscribe\?token=/);
  await page.screenshot({ path: screenshotPath('digest-preview-desktop'), fullPage: true });
  await digestPreview.getByRole('button', { name: 'As plain text' }).click();
  await expect(digestPreview.getByTestId('digest-preview-text')).toContainText('Stop them: http');
  await expect(page.getByTestId('digest-sends')).toHaveCount(0);
  await digestPreview.getByRole('button', { name: `Send to ${optedIn} member${optedIn === 1 ? '' : 's'}` }).click();
  await expect(digest.getByRole('status')).toContainText(/Sent to \d+ members/);
  await expect(digest.getByRole('status')).toBeFocused();
  await expect(page.getByTestId('digest-sends').getByRole('listitem')).toHaveCount(1);
  // A second send asks first.
  await digest.getByRole('button', { name: 'Send to members' }).click();
  await digest.getByRole('button', { name: /^Send to \d+ member/ }).click();
  await expect(digest.getByRole('alertdialog')).toContainText('already went out');
  await digest.getByRole('button', { name: 'Cancel' }).click();
  await expect(page.getByTestId('digest-sends').getByRole('listitem')).toHaveCount(1);

  await page.setViewportSize({ width: 360, height: 740 });
  await page.reload();
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
  await page.screenshot({ path: screenshotPath('note-360'), fullPage: true });
  await page.goto('/notes');
  await expect(page.getByTestId('note-cards')).toContainText(title);
  await page.screenshot({ path: screenshotPath('notes-360'), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.getByLabel('Search the notes').fill('needle-hardening');
  await expect(page.getByTestId('note-row')).toHaveCount(1);
  await page.screenshot({ path: screenshotPath('notes-desktop'), fullPage: true });

  const adminCtx = await browser.newContext();
  const admin = await adminCtx.newPage();
  await new SignInPage(admin).withPassword('admin@candlewise.test');
  await admin.goto('/admin/outbox');
  const message = admin.getByTestId('outbox-message').filter({ hasText: title }).filter({ hasText: 'member@candlewise.test' });
  await expect(message).toHaveCount(1);
  await expect(message.getByTestId('outbox-text')).toContainText('asked by Wren Alder');
  await expect(message.getByTestId('outbox-text')).toContainText('/unsubscribe?token=');
  // The HTML part, rendered in a sandboxed frame beside the text part.
  await message.getByTestId('outbox-html').scrollIntoViewIfNeeded();
  await expect(message.getByTestId('outbox-html')).toHaveAttribute('sandbox', '');
  const mailHtml = message.frameLocator('[data-testid=outbox-html]');
  await expect(mailHtml.getByRole('heading', { level: 1 })).toHaveText(title);
  await expect(mailHtml.getByRole('link', { name: 'Stop these e-mails' })).toBeVisible();
  await admin.screenshot({ path: screenshotPath('outbox-desktop'), fullPage: true });
  await admin.setViewportSize({ width: 360, height: 740 });
  expect(await admin.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
  await admin.screenshot({ path: screenshotPath('outbox-360') });
  await adminCtx.close();
});

test('a member reads published notes only and has no editor', async ({ page }) => {
  await new SignInPage(page).withPassword('member2@candlewise.test');
  await page.goto('/notes');
  await expect(page.getByRole('link', { name: 'Write a note' })).toHaveCount(0);
  await page.getByRole('link', { name: 'Spring candle evening' }).click();
  await expect(page.getByTestId('note-body').locator('a.link-card').first()).toContainText('asked by Wren Alder');
  await expect(page.getByRole('button', { name: 'Send to members' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Download as Markdown' })).toBeVisible();
});
