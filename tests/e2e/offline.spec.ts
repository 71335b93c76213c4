import { chromium, expect, test, type Page } from '@playwright/test';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { SignInPage, screenshotPath, signOut } from './pages/auth';
import { AskPage } from './pages/ask';

// A member opens Candlewise once with a signal, then stands at the tree with none.
test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true, serviceWorkers: 'allow' });

async function ownAnswerIds(page: Page): Promise<string[]> {
  const r = await page.request.get('/api/answers?limit=50');
  expect(r.status()).toBe(200);
  return ((await r.json()) as { items: { id: string }[] }).items.map((a) => a.id);
}

async function cached(page: Page, cacheName: string, path: string): Promise<boolean> {
  return page.evaluate(async ([c, p]) => !!(await (await caches.open(c)).match(new URL(p, location.origin).href)), [cacheName, path] as const);
}

/**
 * Waits until the service worker is active and controls this page. The worker registers after
 * the page is interactive and installs in the background; `clients.claim()` on activation can
 * miss a page that was navigating at that moment, and the next navigation is then the one
 * the worker controls, as it would be for a member. So: wait for an active worker, and
 * reload while the page is still not controlled.
 */
async function controlledByWorker(page: Page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect(async () => {
    if (!(await page.evaluate(() => !!navigator.serviceWorker.controller))) {
      await page.reload();
      expect(await page.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
    }
  }).toPass({ timeout: 30_000, intervals: [500, 1_000, 2_000] });
}

const noOverflow = async (page: Page) =>
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);

test('offline: the phone works the answer out, the save waits, and is sent once when the signal returns', async ({ page, context }) => {
  await new SignInPage(page).withPassword('member@candlewise.test');
  const before = await ownAnswerIds(page);

  // Online: the wizard page, the species data and the member's trees are kept for later.
  const ask = new AskPage(page);
  await ask.open();
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(() => cached(page, 'wizard-data', '/api/wizard/offline-data')).toBe(true);
  await expect.poll(() => cached(page, 'ask-page', '/ask')).toBe(true);
  await expect.poll(() => cached(page, 'member-data', '/api/trees')).toBe(true);
  await page.goto('/answers');
  await expect(page.getByRole('heading', { name: 'Your answers' })).toBeVisible();
  await controlledByWorker(page);

  await context.setOffline(true);
  await ask.open();
  await expect(page.getByTestId('offline-banner')).toBeVisible();
  await expect(page.getByTestId('current-user')).toContainText('Wren Alder');
  // The member's trees come from the kept copy.
  const trees = await page.evaluate(async () => (await (await fetch('/api/trees')).json()) as { items?: { name: string }[] });
  expect(trees.items?.length ?? 0).toBeGreaterThan(0);

  // The kept copy of the member's trees offers them first; this shoot is on a friend's tree.
  await ask.expectStep('tree');
  await ask.choose('tree', 'none');
  await ask.next();
  await ask.pickSpecies('scots', 'Scots pine');
  await ask.next();
  await ask.choose('health', 'average');
  await ask.next();
  await ask.choose('shoot', 'candle-extending');
  await ask.next();
  await ask.choose('branching', 'tertiary');
  await ask.next();
  await ask.choose('position', 'beyond-silhouette');
  await ask.next();
  await ask.expectStep('when');
  await page.getByLabel('Date you looked at the tree').fill('2027-05-10');
  await ask.next();

  await ask.expectStep('answer');
  const onPhone = page.getByTestId('worked-out-on-phone');
  await expect(onPhone).toContainText('Worked out on this phone');
  await expect(onPhone).toContainText(/rules version \d+\.\d+\.\d+ and species revision \d+/);
  // source: University of Wisconsin Plant Disease Diagnostics Clinic (2015): an average candle keeps a half to two-thirds
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText(/^Shorten this candle/);
  // Sharing needs the network: it says so instead of pretending.
  await page.getByText('Add a note or share with the club').click();
  await expect(page.getByLabel('Who can see it')).toBeDisabled();
  await expect(page.getByText('Sharing needs a connection.')).toBeVisible();
  await noOverflow(page);
  await page.screenshot({ path: screenshotPath('offline-answer-360'), fullPage: true });

  await page.locator('form:has(#save-note)').screenshot({ path: screenshotPath('offline-save-form-360') });
  await onPhone.screenshot({ path: screenshotPath('offline-worked-out-360') });
  await page.getByLabel('Note (optional)').fill('long shoot, south side');
  await page.getByRole('button', { name: 'Save on this phone' }).click();
  await expect(page.getByTestId('saved-waiting')).toContainText('waiting to send');
  await expect(page.getByTestId('waiting-count')).toHaveText('1');
  await expect(page.getByTestId('waiting-item')).toContainText('Scots pine, 2027-05-10');
  await page
    .getByTestId('saved-waiting')
    .locator('..')
    .screenshot({ path: screenshotPath('offline-save-waiting-360') });
  await noOverflow(page);
  await page.screenshot({ path: screenshotPath('offline-waiting-360'), fullPage: true });
  expect(await ownAnswerIds(page)).toEqual(before);

  // The answers page, from its kept copy, lists what is waiting.
  await page.goto('/answers');
  await expect(page.getByTestId('waiting-answers')).toContainText('Waiting to send: 1 answer');
  await noOverflow(page);
  await page.screenshot({ path: screenshotPath('offline-answers-360'), fullPage: true });

  // Back online: sent by itself, exactly once, and the list stops saying it waits.
  await context.setOffline(false);
  await expect.poll(async () => (await ownAnswerIds(page)).length).toBe(before.length + 1);
  await expect(page.getByTestId('waiting-answers')).toHaveCount(0);
  // Going offline and online again sends nothing twice.
  await context.setOffline(true);
  await context.setOffline(false);
  await page.waitForTimeout(1000);
  const after = await ownAnswerIds(page);
  expect(after.length).toBe(before.length + 1);
  const added = after.filter((id) => !before.includes(id));
  expect(added).toHaveLength(1);

  await page.goto(`/answers/${added[0]}`);
  await expect(page.getByTestId('answer-action').getByRole('heading')).toHaveText(/^Shorten this candle/);
  await expect(page.getByText('long shoot, south side')).toBeVisible();
  // Same engine, same species revision: nothing to compare.
  await expect(page.getByTestId('phone-comparison')).toHaveCount(0);
  await page.goto('/answers');
  await expect(page.getByTestId('waiting-answers')).toHaveCount(0);
  await expect(page.getByTestId('answers-list').locator(`a[href="/answers/${added[0]}"]`)).toHaveCount(1);
});

test('a saved answer the phone worked out differently shows both answers; offline its edits say they need a connection', async ({ page, context }) => {
  await new SignInPage(page).withPassword('member@candlewise.test');
  const body = {
    species: 'pinus-sylvestris',
    branching: 'tertiary',
    date: '2027-05-10',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'average',
  };
  const server = await (await page.request.post('/api/wizard/evaluate', { data: body })).json();
  const phoneResult = {
    ...server,
    action: 'wait',
    headline: 'Wait: nothing to do now',
    speciesRevision: server.speciesRevision - 1,
    reasons: server.reasons.slice(0, 1),
  };
  const saved = await page.request.post('/api/answers', { data: { ...body, phoneResult }, headers: { 'Idempotency-Key': `e2e-${Date.now()}-compare-key` } });
  expect(saved.status()).toBe(201);
  await page.goto((await saved.json()).url);
  const both = page.getByTestId('phone-comparison');
  await expect(both.getByTestId('phone-answer')).toContainText('Wait: nothing to do now');
  await expect(both.getByTestId('phone-answer')).toContainText(`species revision ${server.speciesRevision - 1}`);
  await expect(both.getByTestId('server-answer')).toContainText(server.headline);
  await both.getByText('Which reasons differ').click();
  await noOverflow(page);
  await both.screenshot({ path: screenshotPath('phone-comparison-360') });
  await page.setViewportSize({ width: 1280, height: 900 });
  await both.screenshot({ path: screenshotPath('phone-comparison-desktop') });
  await page.setViewportSize({ width: 360, height: 740 });

  // Offline, the kept copy of the page says what needs a connection instead of pretending.
  // The worker registers after the page is interactive and installs in the background: wait for it.
  await controlledByWorker(page);
  await page.reload();
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByTestId('offline-banner')).toBeVisible();
  await expect(page.getByTestId('owner-offline')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Save changes' })).toBeDisabled();
  await expect(page.getByRole('button', { name: 'Delete…' })).toBeDisabled();
  await expect(page.getByText('Adding and removing photos needs a connection.')).toBeVisible();
  await expect(page.getByTestId('photo-input')).toBeDisabled();
  await expect(page.getByRole('button', { name: 'Re-run this answer' })).toBeDisabled();
  await noOverflow(page);
  await page.screenshot({ path: screenshotPath('answer-offline-360'), fullPage: true });
  await context.setOffline(false);
  await expect(page.getByRole('button', { name: 'Save changes' })).toBeEnabled({ timeout: 15_000 });
});

test('signing out drops the member caches', async ({ page }) => {
  await new SignInPage(page).withPassword('member@candlewise.test');
  await new AskPage(page).open();
  await expect.poll(() => cached(page, 'member-data', '/api/trees')).toBe(true);
  await expect.poll(() => cached(page, 'ask-page', '/ask')).toBe(true);
  await signOut(page);
  await expect.poll(() => cached(page, 'member-data', '/api/trees')).toBe(false);
  // The species data is the same for everyone and stays.
  await expect.poll(() => cached(page, 'wizard-data', '/api/wizard/offline-data')).toBe(true);
  // A signed-out wizard page is kept again later, never the member's.
  await expect
    .poll(async () =>
      page.evaluate(async () => {
        const r = await (await caches.open('ask-page')).match(new URL('/ask', location.origin).href);
        return r ? !(await r.text()).includes('Wren Alder') : true;
      }),
    )
    .toBe(true);
});

test('the manifest and the service worker are served with the right types', async ({ page }) => {
  const m = await page.request.get('/manifest.webmanifest');
  expect(m.headers()['content-type']).toMatch(/^application\/manifest\+json/);
  const manifest = await m.json();
  expect(manifest.icons.map((i: { sizes: string; purpose: string }) => `${i.sizes} ${i.purpose}`)).toEqual(
    expect.arrayContaining(['192x192 any', '512x512 any', '512x512 maskable']),
  );
  for (const icon of manifest.icons as { src: string; type: string }[]) {
    const r = await page.request.get(icon.src);
    expect(r.status()).toBe(200);
    expect(r.headers()['content-type']).toBe(icon.type);
  }
  const sw = await page.request.get('/serwist/sw.js');
  expect(sw.status()).toBe(200);
  expect(sw.headers()['content-type']).toMatch(/^(application|text)\/javascript/);
  expect(sw.headers()['service-worker-allowed']).toBe('/');
  await page.goto('/');
  await expect(page.locator('link[rel="manifest"]')).toHaveAttribute('href', '/manifest.webmanifest');
});

test('Chromium finds the app installable: its own installability check reports no errors', async ({ baseURL }) => {
  // The check behind Lighthouse's installability audit (dropped from Lighthouse 12): Chromium's
  // own, through the DevTools protocol. A persistent profile, because Chromium never installs from
  // an off-the-record window, which every ordinary Playwright context is.
  const profile = await mkdtemp(join(tmpdir(), 'candlewise-install-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run'],
    baseURL,
    viewport: { width: 360, height: 740 },
    isMobile: true,
    hasTouch: true,
    serviceWorkers: 'allow',
  });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto('/');
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    const cdp = await context.newCDPSession(page);
    const manifest = await cdp.send('Page.getAppManifest');
    expect(manifest.errors).toEqual([]);
    expect(manifest.url).toMatch(/\/manifest\.webmanifest$/);
    await expect.poll(async () => (await cdp.send('Page.getInstallabilityErrors')).installabilityErrors.map((e) => e.errorId), { timeout: 15_000 }).toEqual([]);
  } finally {
    await context.close();
    await rm(profile, { recursive: true, force: true });
  }
});
