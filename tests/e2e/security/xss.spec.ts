import { expect, test, type Page } from '@playwright/test';
import { renderMarkdown } from '../../../lib/markdown/render';
import { constructs, loadVectors } from '../../support/xss-corpus';
import { signedIn } from '../../support/http-client';
import { SignInPage } from '../pages/auth';

// The rendered corpora in a real Chromium with alert/confirm/prompt/print hooked: nothing may
// call them. The page is served from a stand-in origin with no CSP, so the sanitizer alone must
// hold; every other request is aborted (so broken images fire their error events).
const ORIGIN = 'http://xss.test';

async function hookDialogs(page: Page) {
  const dialogs: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(`${d.type()}: ${d.message()}`);
    void d.dismiss();
  });
  await page.addInitScript(() => {
    const w = window as unknown as Record<string, unknown> & { __calls: string[] };
    w.__calls = [];
    for (const k of ['alert', 'confirm', 'prompt', 'print']) {
      w[k] = (...a: unknown[]) => {
        w.__calls.push(`${k}(${String(a[0])})`);
        return k === 'confirm' ? false : null;
      };
    }
  });
  return dialogs;
}

async function serve(page: Page, html: string) {
  await page.route('**/*', (route) =>
    route.request().url().startsWith(`${ORIGIN}/`) ? route.fulfill({ status: 200, contentType: 'text/html; charset=utf-8', body: html }) : route.abort(),
  );
  await page.goto(`${ORIGIN}/`);
}

/** Give handlers every chance: mouse and focus events on every element, then a pause. */
async function poke(page: Page) {
  await page.evaluate(async () => {
    for (const el of Array.from(document.querySelectorAll('body *'))) {
      for (const type of ['mouseover', 'mouseenter', 'focus', 'animationstart', 'animationend', 'transitionend']) {
        el.dispatchEvent(new Event(type, { bubbles: true }));
      }
    }
    await new Promise((r) => setTimeout(r, 750));
  });
}

const page = (body: string) => `<!doctype html><html><head><meta charset="utf-8"><title>corpus</title></head><body>${body}</body></html>`;

test('the detector sees an unsanitized vector fire (control)', async ({ page: p }) => {
  const dialogs = await hookDialogs(p);
  await serve(p, page('<img src="/missing.png" onerror="alert(1)">'));
  await poke(p);
  expect(await p.evaluate(() => (window as unknown as { __calls: string[] }).__calls)).toEqual(['alert(1)']);
  expect(dialogs).toEqual([]);
});

test('no vector of the corpora runs once rendered, in any Markdown construct', async ({ page: p }) => {
  test.setTimeout(180_000);
  const vectors = loadVectors();
  const sections: string[] = [];
  for (const [name, wrap] of Object.entries(constructs)) {
    for (const v of vectors) sections.push(`<section data-construct="${name}" data-vector="${v.id}">${await renderMarkdown(wrap(v.payload))}</section>`);
  }
  const dialogs = await hookDialogs(p);
  await serve(p, page(sections.join('\n')));
  expect(await p.locator('section').count()).toBe(sections.length);
  await poke(p);
  expect(await p.evaluate(() => (window as unknown as { __calls: string[] }).__calls)).toEqual([]);
  expect(dialogs).toEqual([]);
});

test('published meeting notes holding every vector run none of them, for a member reading them', async ({ page: p, baseURL }) => {
  test.setTimeout(300_000);
  const librarian = await signedIn(baseURL!, 'librarian@candlewise.test');
  // Each construct's vectors, packed into notes under the body limit.
  const bodies: string[] = [];
  for (const [name, wrap] of Object.entries(constructs)) {
    let body = '';
    for (const v of loadVectors()) {
      const part = `\n\n${wrap(v.payload)}\n\n---\n`;
      if (body.length + part.length > 90_000) {
        bodies.push(body);
        body = '';
      }
      body += part;
    }
    bodies.push(`<!-- ${name} -->${body}`);
  }
  const slugs: string[] = [];
  for (const [i, body] of bodies.entries()) {
    const r = await librarian.json('/api/notes', 'POST', { title: `Sanitizer check ${i + 1}`, meetingDate: '2026-12-01', body, status: 'published' });
    expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(201);
    slugs.push(r.body.note.slug);
  }

  const dialogs = await hookDialogs(p);
  await new SignInPage(p).withPassword('member@candlewise.test');
  for (const slug of slugs) {
    const res = await p.goto(`/notes/${slug}`);
    expect(res?.status()).toBe(200);
    await poke(p);
    expect(await p.evaluate(() => (window as unknown as { __calls: string[] }).__calls), slug).toEqual([]);
  }
  expect(dialogs).toEqual([]);
  await p.screenshot({ path: 'test-results/screens/xss-note.png' });
});
