import { describe, expect, it } from 'vitest';
import { fromHtml } from 'hast-util-from-html';
import type { Element, Nodes } from 'hast';
import { renderMarkdown } from '@/lib/markdown/render';
import { constructs, loadVectors } from '../../support/xss-corpus';

// Every vector of the public corpora, raw and inside each Markdown construct, through THE
// Markdown pipeline; the output is parsed as a browser would and must hold nothing that can run.
const vectors = loadVectors();

// Elements that run script, load active content, restyle the page or submit data.
const FORBIDDEN = new Set([
  'script',
  'iframe',
  'object',
  'embed',
  'style',
  'frame',
  'frameset',
  'applet',
  'base',
  'link',
  'meta',
  'form',
  'button',
  'input',
  'textarea',
  'select',
  'svg',
  'math',
  'template',
  'noscript',
  'portal',
  'video',
  'audio',
  'source',
]);
// Attributes that hold a URL (hast property names).
const URL_PROPS = new Set([
  'href',
  'src',
  'srcSet',
  'action',
  'formAction',
  'cite',
  'poster',
  'background',
  'longDesc',
  'data',
  'ping',
  'useMap',
  'xLinkHref',
  'codeBase',
  'manifest',
  'dynsrc',
  'lowsrc',
]);
const SAFE_SCHEMES = new Set(['http', 'https', 'mailto']);

/** The scheme a browser would see: it drops ASCII whitespace and control characters first. */
export function schemeOf(url: string): string | null {
  const cleaned = url.replace(/[\u0000-\u0020\u007f]+/g, '');
  const m = /^([a-z][a-z0-9+.-]*):/i.exec(cleaned);
  return m ? m[1].toLowerCase() : null;
}

function problems(html: string): string[] {
  const out: string[] = [];
  const visit = (node: Nodes) => {
    if (node.type === 'element') {
      const el = node as Element;
      if (FORBIDDEN.has(el.tagName)) out.push(`<${el.tagName}> element`);
      for (const [name, value] of Object.entries(el.properties ?? {})) {
        if (/^on/i.test(name)) out.push(`${name} attribute on <${el.tagName}>`);
        if (name === 'style') out.push(`style attribute on <${el.tagName}>`);
        if (URL_PROPS.has(name) && value != null) {
          const urls =
            name === 'srcSet'
              ? String(value)
                  .split(',')
                  .map((c) => c.trim().split(/\s+/)[0])
              : [String(Array.isArray(value) ? value.join(' ') : value)];
          for (const u of urls) {
            const s = schemeOf(u);
            if (s !== null && !SAFE_SCHEMES.has(s)) out.push(`${name}="${u.slice(0, 60)}" on <${el.tagName}>`);
          }
        }
      }
    }
    if ('children' in node) for (const c of node.children) visit(c as Nodes);
  };
  visit(fromHtml(html, { fragment: true }));
  return out;
}

describe('the checker itself', () => {
  it('flags what it must flag', () => {
    expect(problems('<p><script>x</script></p>')).toEqual(['<script> element']);
    expect(problems('<img src="x" onerror="alert(1)">')).toEqual(['onError attribute on <img>']);
    expect(problems('<a href=" jav&#x09;ascript:alert(1)">x</a>')).toHaveLength(1);
    expect(problems('<a href="data:text/html,x">x</a>')).toHaveLength(1);
    expect(problems('<p style="x:y">x</p><iframe></iframe><object></object><embed>')).toHaveLength(4);
    expect(problems('<a href="/answers/abc123">x</a><a href="https://e.org">y</a><a href="mailto:a@b.c">z</a><a href="#top">t</a>')).toEqual([]);
  });
});

describe('XSS corpora through the Markdown pipeline', () => {
  it('loads all three corpora', () => {
    const by = (c: string) => vectors.filter((v) => v.corpus === c).length;
    // source: tests/fixtures/xss/README.md (counts of each file)
    expect(by('dompurify')).toBe(223);
    expect(by('h5sc')).toBe(149);
    expect(by('rsnake')).toBe(73);
  });

  it.each(Object.keys(constructs))('leaves nothing that can run: %s', async (name) => {
    const wrap = constructs[name];
    const failures: string[] = [];
    for (const v of vectors) {
      const html = await renderMarkdown(wrap(v.payload));
      for (const p of problems(html)) failures.push(`${v.id}: ${p}`);
    }
    expect(failures).toEqual([]);
  });

  it('keeps ordinary Markdown working (the sanitizer is not simply dropping everything)', async () => {
    const html = await renderMarkdown(
      '# Pines\n\n**Pinch** the [candle](https://example.org/c) — see [answer](/answers/abc123xyz).\n\n| a | b |\n|---|---|\n| 1 | 2 |\n\n> quote\n\n`code`',
    );
    const tree = fromHtml(html, { fragment: true });
    const tags: string[] = [];
    const walk = (n: Nodes) => {
      if (n.type === 'element') tags.push(n.tagName);
      if ('children' in n) n.children.forEach((c) => walk(c as Nodes));
    };
    walk(tree);
    for (const t of ['h1', 'strong', 'a', 'table', 'td', 'blockquote', 'code']) expect(tags).toContain(t);
    expect(html).toContain('href="https://example.org/c"');
    expect(html).toContain('href="/answers/abc123xyz"');
  });
});
