import { expect, test, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { SignInPage } from './pages/auth';
import { expectNoPageOverflow } from './pages/species';

// Every page, as each role sees it, at a phone and a desktop size: axe-core finds no serious or
// critical violation and the page never scrolls sideways. Nothing is excluded from the scan.

const TREE = 'demoTreeWeirScots';
const ANSWER = 'demoAnsWeirScots1';
const NOTE = '2026-04-18-spring-candle-evening';
const SPECIES = 'pinus-thunbergii';

const memberPages = [
  '/',
  '/species',
  `/species/${SPECIES}`,
  '/ask',
  '/answers',
  `/answers/${ANSWER}`,
  '/trees',
  '/trees/new',
  `/trees/${TREE}`,
  `/trees/${TREE}/edit`,
  '/notes',
  `/notes/${NOTE}`,
  '/profile',
];
const roles: { role: string; email: string | null; pages: string[] }[] = [
  {
    role: 'visitor',
    email: null,
    pages: ['/', '/sign-in', '/sign-up', '/verify', '/unsubscribe', '/sign-up/confirm?token=not-a-real-confirmation-token', '/species', `/species/${SPECIES}`],
  },
  { role: 'member', email: 'member@candlewise.test', pages: [...memberPages, '/admin'] },
  {
    role: 'editor',
    email: 'editor@candlewise.test',
    pages: ['/species', `/species/${SPECIES}`, `/species/${SPECIES}/edit`, `/species/${SPECIES}/history`, '/species/new', '/species/import'],
  },
  { role: 'librarian', email: 'librarian@candlewise.test', pages: ['/notes', `/notes/${NOTE}`, `/notes/${NOTE}/edit`, '/notes/new'] },
  { role: 'admin', email: 'admin@candlewise.test', pages: ['/admin', '/admin/outbox', `/answers/${ANSWER}`, '/species', '/notes'] },
];
const sizes = [
  { name: 'phone', width: 360, height: 740 },
  { name: 'desktop', width: 1280, height: 900 },
];

async function scan(page: Page, path: string) {
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${path}: [${v.impact}] ${v.id}: ${v.help} — ${v.nodes
          .slice(0, 3)
          .map((n) => n.target.join(' '))
          .join(' | ')}`,
    );
}

for (const { role, email, pages } of roles) {
  for (const size of sizes) {
    test(`axe: ${role} at ${size.name} size, every page`, async ({ page }) => {
      test.setTimeout(240_000);
      // The outbox is scanned with a message in it (its HTML part sits in a frame axe also checks).
      if (role === 'admin') await new SignInPage(page).askForLink('editor@candlewise.test');
      if (email) await new SignInPage(page).withPassword(email);
      await page.setViewportSize({ width: size.width, height: size.height });
      const found: string[] = [];
      for (const path of pages) {
        found.push(...(await scan(page, path)));
        if (size.width === 360) await expectNoPageOverflow(page);
      }
      expect(found, found.join('\n')).toEqual([]);
    });
  }
}
