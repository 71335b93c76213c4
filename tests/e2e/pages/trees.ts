import { expect, type Page } from '@playwright/test';

export class TreesPage {
  constructor(readonly page: Page) {}

  async open() {
    await this.page.goto('/trees');
    await expect(this.page.getByRole('heading', { name: 'Your trees' })).toBeVisible();
  }

  async add(t: { name: string; species: string; shape?: 'Round' | 'Rectangular' | 'Oval'; length?: string; width?: string; collectedOn?: string }) {
    await this.page.goto('/trees/new');
    const form = this.page.getByTestId('tree-form');
    await form.getByLabel('Name').fill(t.name);
    await form.getByLabel('Species').selectOption({ label: t.species });
    if (t.shape) {
      await form.getByLabel('Shape').selectOption({ label: t.shape });
      await form.getByLabel(t.shape === 'Round' ? 'Diameter (cm)' : 'Length (cm)').fill(t.length ?? '30');
      if (t.shape !== 'Round') await form.getByLabel('Width (cm)').fill(t.width ?? '20');
    }
    if (t.collectedOn) {
      await form.getByLabel('Yes').check();
      await expect(form.getByTestId('collecting-caution')).toContainText('landowner');
      await form.getByLabel('Date collected').fill(t.collectedOn);
    }
    await form.getByRole('button', { name: 'Add tree' }).click();
    await expect(this.page.getByTestId('tree-name')).toHaveText(t.name);
  }
}
