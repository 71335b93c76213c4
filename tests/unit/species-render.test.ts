import { describe, expect, it } from 'vitest';
import { renderMarkdown, renderMarkdownSync } from '@/lib/markdown/render';
import { wizardSummary } from '@/lib/species/wizard-summary';
import { parseSpeciesMarkdown } from '@/lib/species/content';
import fs from 'node:fs';
import path from 'node:path';

const read = (slug: string) => {
  const r = parseSpeciesMarkdown(fs.readFileSync(path.resolve(__dirname, `../../content/species/${slug}.md`), 'utf8'));
  if (!r.ok) throw new Error(slug);
  return r;
};

describe('care notes through the sanitizing pipeline', () => {
  const hostile = [
    '<script>alert(1)</script>',
    '<img src="x" onerror="alert(1)">',
    '<a href="#" onclick="alert(1)">x</a>',
    '<iframe src="https://example.org"></iframe>',
    '[js](javascript:alert(1))',
    '[data](data:text/html;base64,PHNjcmlwdD4=)',
    '![img](javascript:alert(1))',
  ].join('\n\n');

  it('strips scripts, event handlers, iframes and javascript:/data: links', async () => {
    const html = await renderMarkdown(`${read('pinus-mugo').body}\n\n${hostile}`);
    expect(html).not.toMatch(/<script|onerror|onclick|<iframe|javascript:|data:text/i);
    expect(html).toContain('<h2>Growing it in a container</h2>');
  });

  it('the live preview (sync) gives the same HTML as the page', async () => {
    const src = `${read('pinus-thunbergii').body}\n\n${hostile}`;
    expect(renderMarkdownSync(src)).toBe(await renderMarkdown(src));
  });
});

describe('what the wizard does for a species', () => {
  it('follows the traits', () => {
    expect(wizardSummary(read('pinus-thunbergii').record).join(' ')).toMatch(/second, shorter flush/);
    expect(wizardSummary(read('pinus-sylvestris').record).join(' ')).toMatch(/never removing one whole/);
    expect(wizardSummary(read('pinus-mugo').record).join(' ')).toMatch(/holds back spring feeding/);
    expect(wizardSummary(read('pinus-contorta').record).join(' ')).toMatch(/Multinodal/);
    expect(wizardSummary(read('pinus-contorta').record).join(' ')).toMatch(/polycyclic/);
    expect(wizardSummary(read('pinus-contorta').record).join(' ')).not.toMatch(/Single flush/);
    expect(wizardSummary(read('larix-decidua').record).join(' ')).toMatch(/not a pine/);
  });

  it('changes when an editor changes a trait', () => {
    const rec = structuredClone(read('pinus-sylvestris').record);
    rec.traits.flushHabit.value = 'double';
    expect(wizardSummary(rec).join(' ')).toMatch(/second, shorter flush/);
  });
});
