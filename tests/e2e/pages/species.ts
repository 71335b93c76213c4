import { expect, type Page } from '@playwright/test';

export class SpeciesListPage {
  constructor(readonly page: Page) {}

  async open(query = '') {
    await this.page.goto(`/species${query}`);
    await expect(this.page.getByTestId('species-table')).toBeVisible();
  }

  search(text: string) {
    return this.page.getByTestId('species-search').fill(text);
  }

  rows() {
    return this.page.getByTestId('species-row');
  }

  firstRowName() {
    return this.rows().first().getByRole('link');
  }

  filterFlush(label: string) {
    return this.page.getByLabel('Flush habit').selectOption({ label });
  }
}

export class SpeciesEditPage {
  constructor(readonly page: Page) {}

  async open(slug: string) {
    await this.page.goto(`/species/${slug}/edit`);
    await expect(this.page.getByTestId('species-form')).toBeVisible();
  }

  async appendToNotes(text: string) {
    const editor = this.page.getByTestId('body-editor');
    await editor.focus();
    await editor.press('ControlOrMeta+End');
    await editor.pressSequentially(`\n\n${text}`);
  }

  async saveDraft(summary: string) {
    await this.page.getByLabel('Edit summary').fill(summary);
    await this.page.getByRole('button', { name: 'Save as draft' }).click();
  }
}

/** The page has no horizontal scroll at the current viewport. */
export async function expectNoPageOverflow(page: Page) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
}
