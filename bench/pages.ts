import zlib from 'node:zlib';
import { extra, log, notAvailable, record, round } from './lib';

// Pages: the JavaScript a first visit downloads (every script the server-rendered HTML loads,
// summed, raw and gzip), and Lighthouse scores with Debian's Chromium.
const PAGES = ['/', '/species', '/ask', '/species/pinus-thunbergii'];
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export async function firstLoadJs(base: string) {
  const section = 'pages';
  const out: Record<string, unknown> = {};
  for (const page of PAGES) {
    const res = await fetch(base + page);
    const html = await res.text();
    if (res.status !== 200) {
      notAvailable(section, `first-load JS ${page}`, `the page answered ${res.status}`, '');
      continue;
    }
    const srcs = new Set<string>();
    // A `nomodule` script (Next's polyfills) is skipped by every browser that runs modules: not counted.
    let legacy = 0;
    for (const m of html.matchAll(/<script([^>]*)\ssrc="([^"]+)"([^>]*)>/g)) {
      if (/\bnomodule\b/i.test(m[1] + m[3])) legacy++;
      else srcs.add(m[2]);
    }
    for (const m of html.matchAll(/<link[^>]*rel="(?:modulepreload|preload)"[^>]*as="script"[^>]*href="([^"]+)"/g)) srcs.add(m[1]);
    for (const m of html.matchAll(/<link[^>]*href="([^"]+)"[^>]*as="script"/g)) srcs.add(m[1]);
    let raw = 0;
    let gz = 0;
    for (const src of srcs) {
      const body = Buffer.from(await (await fetch(new URL(src.replace(/&amp;/g, '&'), base))).arrayBuffer());
      raw += body.length;
      gz += zlib.gzipSync(body, { level: 9 }).length;
    }
    // Inline scripts (the streamed RSC payload and bootstrap) count too.
    const inline = [...html.matchAll(/<script(?![^>]*\ssrc=)[^>]*>([\s\S]*?)<\/script>/g)].reduce((n, m) => n + Buffer.byteLength(m[1]), 0);
    record({
      section,
      name: `first-load JS ${page}`,
      value: round(gz / 1024, 1),
      unit: 'kB gzip',
      target: page === '/' ? '≤ 130 kB' : undefined,
      pass: page === '/' ? gz / 1024 <= 130 : null,
      note: `${srcs.size} scripts, ${round(raw / 1024, 1)} kB raw, +${round(inline / 1024, 1)} kB inline${legacy ? `, ${legacy} nomodule not counted` : ''}`,
    });
    out[page] = { scripts: [...srcs], rawBytes: raw, gzipBytes: gz, inlineBytes: inline };
  }
  extra.firstLoadJs = out;
}

export async function lighthouseScores(base: string) {
  const section = 'lighthouse';
  let lighthouse: (
    url: string,
    flags: Record<string, unknown>,
  ) => Promise<{ lhr: { categories: Record<string, { score: number | null }>; audits: Record<string, { numericValue?: number }> } } | undefined>;
  let chromeLauncher: typeof import('chrome-launcher');
  try {
    lighthouse = (await import('lighthouse')).default as unknown as typeof lighthouse;
    chromeLauncher = await import('chrome-launcher');
  } catch (e) {
    for (const p of PAGES) notAvailable(section, `${p}`, `lighthouse could not load (${(e as Error).message})`, 'performance ≥ 95, accessibility ≥ 95');
    return;
  }
  const chrome = await chromeLauncher.launch({
    chromePath: CHROMIUM,
    chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--no-first-run', '--disable-background-networking'],
  });
  const out: Record<string, unknown> = {};
  try {
    for (const page of PAGES) {
      log(`lighthouse ${page}`);
      // Lighthouse's defaults: a mid-range phone with simulated slow 4G and 4× CPU slowdown.
      const r = await lighthouse(base + page, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['performance', 'accessibility', 'best-practices'],
      });
      if (!r) {
        notAvailable(section, page, 'lighthouse returned nothing');
        continue;
      }
      const score = (k: string) => Math.round((r.lhr.categories[k]?.score ?? 0) * 100);
      const metric = (k: string) => round(r.lhr.audits[k]?.numericValue ?? NaN, 0);
      const perf = score('performance');
      const a11y = score('accessibility');
      const bp = score('best-practices');
      const cls = r.lhr.audits['cumulative-layout-shift']?.numericValue ?? NaN;
      record({ section, name: `${page} CLS`, value: round(cls, 3), unit: '', target: '≤ 0.05', pass: cls <= 0.05 });
      record({
        section,
        name: `${page} performance`,
        value: perf,
        unit: '',
        target: '≥ 95',
        pass: perf >= 95,
        note: `LCP ${metric('largest-contentful-paint')} ms, TBT ${metric('total-blocking-time')} ms, CLS ${r.lhr.audits['cumulative-layout-shift']?.numericValue?.toFixed(3)}`,
      });
      record({ section, name: `${page} accessibility`, value: a11y, unit: '', target: '≥ 95', pass: a11y >= 95 });
      record({ section, name: `${page} best practices`, value: bp, unit: '', pass: null });
      out[page] = {
        performance: perf,
        accessibility: a11y,
        bestPractices: bp,
        lcpMs: metric('largest-contentful-paint'),
        fcpMs: metric('first-contentful-paint'),
        tbtMs: metric('total-blocking-time'),
        si: metric('speed-index'),
        failedAudits: Object.entries(r.lhr.audits as Record<string, { score: number | null; title?: string; scoreDisplayMode?: string }>)
          .filter(
            ([, a]) =>
              a.score !== null &&
              a.score < 0.9 &&
              a.scoreDisplayMode !== 'informative' &&
              a.scoreDisplayMode !== 'manual' &&
              a.scoreDisplayMode !== 'notApplicable',
          )
          .map(([k, a]) => `${k}: ${a.title} (${a.score})`),
        consoleErrors: ((r.lhr.audits['errors-in-console'] as { details?: { items?: { description?: string; source?: string }[] } })?.details?.items ?? []).map(
          (i) => `${i.source}: ${i.description}`,
        ),
      };
    }
  } finally {
    await chrome.kill();
  }
  extra.lighthouse = out;
}
