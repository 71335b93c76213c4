import { expect, type Page } from '@playwright/test';

/** The /ask wizard, driven the way a grower taps through it. */
export class AskPage {
  constructor(readonly page: Page) {}

  async open(query = '') {
    await this.page.goto(`/ask${query}`);
    await expect(this.page.getByTestId('ask-loading')).toHaveCount(0);
  }

  step(name: string) {
    return this.page.getByTestId(`ask-step-${name}`);
  }

  async expectStep(name: string) {
    await expect(this.step(name)).toBeVisible();
    await expect(this.page).toHaveURL(new RegExp(`[?&]step=${name}\\b`));
  }

  async choose(group: string, value: string) {
    await this.page.getByTestId(`choice-${group}-${value}`).click();
  }

  async next() {
    await this.page.getByTestId('ask-next').click();
  }

  async pickSpecies(search: string, name: string) {
    await this.page.getByLabel('Search by common or botanical name').fill(search);
    await this.page
      .getByTestId('species-results')
      .getByRole('button', { name: new RegExp(name, 'i') })
      .click();
    await expect(this.page.getByTestId('species-chosen')).toContainText(name);
  }
}
