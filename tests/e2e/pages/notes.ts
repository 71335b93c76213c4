import { expect, type Page } from '@playwright/test';

export class NoteEditorPage {
  constructor(readonly page: Page) {}

  get form() {
    return this.page.getByTestId('note-editor');
  }

  async openNew() {
    await this.page.goto('/notes');
    await this.page.getByRole('link', { name: 'Write a note' }).click();
    await expect(this.page.getByRole('heading', { name: 'Write a meeting note' })).toBeVisible();
  }

  async fill(title: string, meetingDate: string, body: string) {
    await this.form.getByLabel('Title').fill(title);
    await this.form.getByLabel('Meeting date').fill(meetingDate);
    await this.form.getByLabel('Note (Markdown)').fill(body);
  }

  /** Search shared answers by species and insert the first match at the cursor. */
  async insertSharedAnswer(species: string, rowText: string) {
    await this.page.getByRole('button', { name: 'Link an answer or species…' }).click();
    await this.page.getByLabel('Species name').fill(species);
    const row = this.page.getByTestId('picker-answers').getByRole('listitem').filter({ hasText: rowText }).first();
    await row.getByRole('button', { name: /^Insert link to/ }).click();
  }
}
