import { describe, expect, it } from 'vitest';
import { extractInternalLinks, parseInternalLink, renderMarkdown } from '@/lib/markdown/render';

describe('markdown pipeline', () => {
  it('renders GFM tables and strikethrough', async () => {
    const html = await renderMarkdown('| a | b |\n|---|---|\n| 1 | 2 |\n\n~~old~~');
    expect(html).toContain('<table>');
    expect(html).toContain('<del>old</del>');
  });

  it('drops scripts, event handlers, iframes and script URLs', async () => {
    const html = await renderMarkdown(
      '<script>alert(1)</script>\n\n<img src=x onerror=alert(1)>\n\n<iframe src="https://x"></iframe>\n\n[a](javascript:alert(1)) [b](data:text/html,hi) [c](https://ok.example)',
    );
    expect(html).not.toMatch(/<script|onerror|<iframe|javascript:|data:text/i);
    expect(html).toContain('href="https://ok.example"');
  });

  it('recognises links to answers and species', () => {
    expect(parseInternalLink('/answers/abc123XYZ')).toEqual({ type: 'answer', id: 'abc123XYZ' });
    expect(parseInternalLink('/species/pinus-mugo')).toEqual({ type: 'species', slug: 'pinus-mugo' });
    expect(parseInternalLink('https://elsewhere.example/species/pinus-mugo')).toBeNull();
    expect(parseInternalLink('/notes/x')).toBeNull();
    expect(extractInternalLinks('[x](/species/pinus-mugo) and [y](/answers/abcdef12) and [z](/species/pinus-mugo)')).toEqual([
      { type: 'species', slug: 'pinus-mugo' },
      { type: 'answer', id: 'abcdef12' },
    ]);
  });
});
