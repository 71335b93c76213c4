import { expect, test, type Page } from '@playwright/test';
import { SignInPage, screenshotPath } from './pages/auth';
import { AskPage } from './pages/ask';

// The wizard on a 360 px phone: fresh starts, the offer to continue, the tree question first,
// the recovering tree's short path, why Next is disabled, where focus goes, and the answer's layout.
test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

async function noHorizontalOverflow(page: Page) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
}

/** Every visible control (buttons, links, summaries, inputs) is at least 44 × 44 px. */
async function targetsAtLeast44(page: Page, where = 'main, header') {
  const small = await page.evaluate((sel) => {
    const out: string[] = [];
    for (const root of document.querySelectorAll(sel)) {
      for (const el of root.querySelectorAll<HTMLElement>(
        'button, a[href], summary, select, input:not([type=radio]):not([type=checkbox]), textarea, label:has(input[type=radio]), label:has(input[type=checkbox])',
      )) {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0) continue; // not shown
        const style = getComputedStyle(el);
        if (style.visibility === 'hidden') continue;
        if (r.width < 43.5 || r.height < 43.5)
          out.push(`${el.tagName.toLowerCase()} "${(el.textContent ?? '').trim().slice(0, 40)}" ${Math.round(r.width)}×${Math.round(r.height)}`);
      }
    }
    return out;
  }, where);
  expect(small).toEqual([]);
}

async function startFromHeader(page: Page) {
  await page.getByTestId('menu-button').click();
  await page.getByTestId('main-nav').getByRole('link', { name: 'Ask' }).click();
  await expect(page.getByTestId('ask-loading')).toHaveCount(0);
}

test.describe('the wizard flow on a phone', () => {
  test.beforeEach(async ({ page }) => {
    await new SignInPage(page).withPassword('member@candlewise.test');
  });

  test('the tree comes first, a recovering tree skips the shape questions, and Save sits at the top', async ({ page }) => {
    const ask = new AskPage(page);
    await startFromHeader(page);
    await ask.expectStep('tree');
    await page.screenshot({ path: screenshotPath('flow-360-tree'), fullPage: true });

    // Next says why it is disabled, tied to the button for screen readers.
    const next = page.getByTestId('ask-next');
    await expect(next).toBeDisabled();
    await expect(page.getByTestId('next-reason')).toHaveText('Pick one of your trees, or “Not one of mine”');
    await expect(next).toHaveAttribute('aria-describedby', 'next-reason');
    await noHorizontalOverflow(page);
    await targetsAtLeast44(page);

    // The collected mugo: species and collection come from the tree, health is next.
    await ask.choose('tree', await treeValue(page, 'Mill-race mugo'));
    await expect(page.getByTestId('next-reason')).toHaveCount(0);
    await ask.next();
    await ask.expectStep('health');
    // A new step moves focus to its heading and starts at the top.
    await expect(page.getByTestId('ask-progress')).toBeFocused();
    await expect(page.getByTestId('ask-progress')).toContainText('for Mill-race mugo');
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
    await expect(page.getByRole('checkbox', { name: /Collected from the wild/ })).toBeChecked();
    await expect(page.getByTestId('recovery-note')).toBeVisible();
    await expect(page.getByTestId('next-reason')).toHaveText('Say how the tree is doing');
    await ask.choose('health', 'strong');
    // tree, health, shoot, when: no branching, no outline
    await expect(page.getByTestId('ask-progress')).toContainText('Question 2 of 4');
    await page.screenshot({ path: screenshotPath('flow-360-health'), fullPage: true });
    await ask.next();
    await ask.expectStep('shoot');
    await ask.choose('shoot', 'candle-extending');
    await ask.next();
    await ask.expectStep('when');
    await noHorizontalOverflow(page);
    await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
    // The pot came from the tree; a rectangle without a width is refused with a reason.
    await expect(page.getByLabel('Shape')).toHaveValue('oval');
    await page.getByLabel('Width (cm)').fill('');
    await expect(page.getByTestId('next-reason')).toHaveText('Give the pot’s width');
    await expect(next).toBeDisabled();
    await page.getByLabel('Width (cm)').fill('26');
    await page.getByLabel('Date you looked at the tree').fill('');
    await expect(page.getByTestId('next-reason')).toHaveText('Pick a date');
    await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
    await ask.next();

    await ask.expectStep('answer');
    await expect(page.locator('#answer-headline')).toBeFocused();
    await expect(page.getByTestId('answer-action')).toContainText('Recovery');
    // Save and Done are on the first screen, without scrolling; the rest is folded away.
    const save = page.getByRole('button', { name: 'Save answer' });
    await expect(save).toBeInViewport({ ratio: 1 });
    await expect(page.getByTestId('ask-done')).toBeInViewport({ ratio: 1 });
    await page.screenshot({ path: screenshotPath('flow-360-answer-top'), fullPage: false });
    for (const id of ['why', 'cautions', 'feeding', 'calculator-section']) {
      await expect(page.getByTestId(id)).not.toHaveAttribute('open', '');
    }
    // Rule ids are kept for the details view, not shown to members.
    await expect(page.getByTestId('reasons')).not.toContainText('stage.recovery');
    await page.getByTestId('why').locator('summary').first().click();
    await expect(page.getByTestId('reasons')).toBeVisible();
    await expect(page.getByTestId('rule-details')).not.toHaveAttribute('open', '');
    await page.getByTestId('rule-details').locator('summary').click();
    await expect(page.getByTestId('rule-details')).toContainText('stage.recovery-collected');
    await page.getByTestId('why').locator('summary').first().click();
    await page.screenshot({ path: screenshotPath('flow-360-answer'), fullPage: false });
    await noHorizontalOverflow(page);
    await targetsAtLeast44(page);

    await save.click();
    // After saving, focus goes to the result of saving.
    await expect(page.getByTestId('saved')).toBeFocused();
    await expect(page.getByTestId('saved')).toBeInViewport();
  });

  test('a trade term opens its explanation with a drawing in one tap', async ({ page }) => {
    const ask = new AskPage(page);
    await startFromHeader(page);
    await ask.choose('tree', await treeValue(page, 'Weir-side Scots'));
    await ask.next();
    await ask.choose('health', 'average');
    await ask.next();
    await ask.choose('shoot', 'candle-extending');
    await ask.next();
    await ask.expectStep('branching');
    await ask.choose('branching', 'tertiary');
    await ask.next();
    await ask.choose('position', 'beyond-silhouette');
    await ask.next();
    await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
    await ask.next();
    await ask.expectStep('answer');
    const term = page
      .getByTestId('answer-action')
      .getByTestId('term')
      .filter({ hasText: /candle/i })
      .first();
    await expect(term).toHaveAttribute('aria-expanded', 'false');
    await term.click();
    await expect(term).toHaveAttribute('aria-expanded', 'true');
    const explained = page.getByTestId('answer-action').getByTestId('term-explanation');
    await expect(explained).toContainText('new spring shoot');
    await expect(explained.locator('svg')).toBeVisible();
    await page.screenshot({ path: screenshotPath('flow-360-term'), fullPage: false });
    await targetsAtLeast44(page);
    await explained.getByRole('button', { name: /Close/ }).click();
    await expect(explained).toHaveCount(0);
  });

  test('starts fresh from a link, offers the unfinished run when coming back, and starts over from any step', async ({ page }) => {
    const ask = new AskPage(page);
    await startFromHeader(page);
    await ask.choose('tree', 'none');
    await ask.next();
    await ask.pickSpecies('scots', 'Scots pine');
    await ask.next();
    await ask.choose('health', 'average');
    await ask.next();
    await ask.expectStep('shoot');

    // Coming back to /ask (no start link): offered the unfinished run.
    await page.goto('/');
    await ask.open();
    const offer = page.getByTestId('resume-offer');
    const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long' }).format(new Date());
    await expect(offer.getByRole('heading')).toHaveText(`Continue with Scots pine, ${day}?`);
    await page.screenshot({ path: screenshotPath('flow-360-continue'), fullPage: true });
    await page.getByTestId('resume-continue').click();
    await ask.expectStep('shoot');
    await expect(page.getByTestId('ask-progress')).toBeFocused();

    // Every start link starts fresh: the header, the home page and a tree page.
    await startFromHeader(page);
    await ask.expectStep('tree');
    await expect(page.getByTestId('resume-offer')).toHaveCount(0);
    await expect(page.getByTestId('choice-tree-none').getByRole('radio')).not.toBeChecked();

    await ask.choose('tree', 'none');
    await ask.next();
    await ask.pickSpecies('scots', 'Scots pine');
    await page.goto('/');
    await page.getByTestId('door-ask').click();
    await expect(page.getByTestId('ask-loading')).toHaveCount(0);
    await ask.expectStep('tree');

    await page.goto('/trees');
    await page.getByRole('link', { name: 'Weir-side Scots' }).click();
    await page
      .getByRole('link', { name: /Ask about this tree/ })
      .first()
      .click();
    await expect(page.getByTestId('ask-loading')).toHaveCount(0);
    // The tree is picked and its species known: straight to health.
    await ask.expectStep('health');
    await expect(page.getByTestId('ask-progress')).toContainText('for Weir-side Scots');
    await expect(page).not.toHaveURL(/tree=/);
    // A reload carries on rather than starting again.
    await ask.choose('health', 'strong');
    await page.reload();
    await ask.expectStep('health');
    await expect(page.getByTestId('choice-health-strong').getByRole('radio')).toBeChecked();

    // Start over is on every step and forgets everything but the date.
    await page.getByTestId('start-over').click();
    await ask.expectStep('tree');
    await expect(page.getByTestId('choice-tree-none').getByRole('radio')).not.toBeChecked();
    await page.goto('/');
    await ask.open();
    await expect(page.getByTestId('resume-offer')).toHaveCount(0);
  });

  test('the header is one line on a 360 px phone, with a menu for the rest', async ({ page }) => {
    await page.goto('/');
    const header = page.getByTestId('site-header');
    const box = (await header.boundingBox())!;
    expect(box.height).toBeLessThanOrEqual(72);
    const brand = (await page.getByTestId('brand').boundingBox())!;
    const menu = (await page.getByTestId('menu-button').boundingBox())!;
    expect(Math.abs(brand.y + brand.height / 2 - (menu.y + menu.height / 2))).toBeLessThan(4);
    await expect(page.getByTestId('main-nav')).toBeHidden();
    await page.getByTestId('menu-button').click();
    await expect(page.getByTestId('menu-button')).toHaveAttribute('aria-expanded', 'true');
    await expect(page.getByTestId('main-nav').getByRole('link', { name: 'Trees' })).toBeVisible();
    await page.screenshot({ path: screenshotPath('flow-360-menu'), fullPage: false });
    await targetsAtLeast44(page, 'header');
    await noHorizontalOverflow(page);
    // A visible focus ring on the header's controls: dark on the white gap, at least 3:1 against the moss.
    await page.getByTestId('menu-button').focus();
    await page.keyboard.press('Tab');
    const ring = await page.evaluate(() => {
      const s = getComputedStyle(document.activeElement!);
      return { style: s.outlineStyle, width: parseFloat(s.outlineWidth), color: s.outlineColor, shadow: s.boxShadow };
    });
    expect(ring.style).toBe('solid');
    expect(ring.width).toBeGreaterThanOrEqual(2);
    expect(contrast(ring.color, 'rgb(255, 255, 255)')).toBeGreaterThanOrEqual(3);
  });

  test('the species page source markers are 44 px targets', async ({ page }) => {
    await page.goto('/species/pinus-sylvestris');
    const markers = page.getByTestId('source-marker');
    expect(await markers.count()).toBeGreaterThan(0);
    for (const m of (await markers.all()).slice(0, 10)) {
      const b = (await m.boundingBox())!;
      expect(b.width).toBeGreaterThanOrEqual(44);
      expect(b.height).toBeGreaterThanOrEqual(44);
    }
    await noHorizontalOverflow(page);
  });
});

test.describe('at 1280 px', () => {
  test.use({ viewport: { width: 1280, height: 900 }, hasTouch: false, isMobile: false });
  test('the header shows everything in one line and the answer keeps its order', async ({ page }) => {
    await new SignInPage(page).withPassword('member@candlewise.test');
    await expect(page.getByTestId('menu-button')).toBeHidden();
    await expect(page.getByTestId('main-nav').getByRole('link', { name: 'Ask' })).toBeVisible();
    const ask = new AskPage(page);
    await ask.open('?start=new');
    await ask.choose('tree', 'none');
    await ask.next();
    await ask.pickSpecies('scots', 'Scots pine');
    await ask.next();
    await ask.choose('health', 'weak');
    await ask.next();
    await ask.choose('shoot', 'dormant-bud');
    await ask.next();
    await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
    await ask.next();
    await ask.expectStep('answer');
    await expect(page.getByRole('button', { name: 'Save answer' })).toBeInViewport();
    await page.screenshot({ path: screenshotPath('flow-1280-answer'), fullPage: true });
  });
});

async function treeValue(page: Page, name: string): Promise<string> {
  const label = page.locator('[data-testid^="choice-tree-"]').filter({ hasText: name });
  return (await label.getByRole('radio').getAttribute('value'))!;
}

function contrast(a: string, b: string): number {
  const lum = (c: string) => {
    const [r, g, bl] = (c.match(/\d+(\.\d+)?/g) ?? ['0', '0', '0']).slice(0, 3).map((x) => {
      const v = Number(x) / 255;
      return v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [hi, lo] = [lum(a), lum(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}
