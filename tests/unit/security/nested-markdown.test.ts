import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { extractInternalLinks, renderMarkdown, renderMarkdownSync } from '@/lib/markdown/render';
import { MAX_MARKDOWN_DEPTH, markdownDepth, markdownProblem } from '@/lib/markdown/limits';
import { noteInputSchema } from '@/lib/validation/notes';
import { speciesCreateSchema } from '@/lib/validation/species';
import { parseSpeciesMarkdown } from '@/lib/species/content';

// Deeply nested Markdown is refused on save and never makes rendering throw.
const NESTED: [string, string, string][] = [
  ['3000 nested quotes', `${'> '.repeat(3000)}deep`, 'deep'],
  ['3000 nested list markers', `${'- '.repeat(3000)}deep`, 'deep'],
  ['3000 nested ordered markers', `${'1. '.repeat(3000)}deep`, 'deep'],
  ['3000 indented list levels', Array.from({ length: 3000 }, (_, i) => `${'  '.repeat(i)}- level ${i}`).join('\n'), '- level 1'],
  ['3000 quotes, one per line', Array.from({ length: 3000 }, (_, i) => `${'>'.repeat(i + 1)} q`).join('\n'), '&gt; q'],
  ['20000 nested link brackets', `${'['.repeat(20000)}x${'](a)'.repeat(20000)}`, '[[[['],
  ['mixed quote and list markers', `${'> - '.repeat(2000)}deep`, 'deep'],
];

const speciesDir = path.join(__dirname, '../../../content/species');

describe('nested Markdown', () => {
  for (const [name, source, shown] of NESTED) {
    it(`${name}: rendered without throwing, refused on save`, async () => {
      expect(markdownProblem(source)).not.toBeNull();
      const html = await renderMarkdown(source);
      expect(typeof html).toBe('string');
      // Shown as escaped plain text: the words are there, no markup from the source.
      expect(html).toContain(shown);
      expect(html).not.toMatch(/<(blockquote|ul|ol|a)\b/);
      expect(() => renderMarkdownSync(source)).not.toThrow();
      expect(() => extractInternalLinks(source)).not.toThrow();
      const note = noteInputSchema.safeParse({ title: 'Nested', meetingDate: '2027-03-14', body: source, status: 'draft' });
      expect(note.success).toBe(false);
      expect(note.error?.issues.some((i) => i.path[0] === 'body')).toBe(true);
    });
  }

  it('refuses nested care notes in a species edit and in an imported file', () => {
    const file = fs.readFileSync(path.join(speciesDir, 'pinus-thunbergii.md'), 'utf8');
    const parsed = parseSpeciesMarkdown(file);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const bad = speciesCreateSchema.safeParse({ record: parsed.record, body: NESTED[0][1], summary: 'x', publish: false });
    expect(bad.success).toBe(false);
    const good = speciesCreateSchema.safeParse({ record: parsed.record, body: parsed.body, summary: 'x', publish: false });
    expect(good.success).toBe(true);
    expect(parseSpeciesMarkdown(`${file.trimEnd()}\n\n${NESTED[1][1]}\n`).ok).toBe(false);
  });

  it('accepts every shipped species file and ordinary nesting', async () => {
    for (const name of fs.readdirSync(speciesDir).filter((n) => n.endsWith('.md'))) {
      const parsed = parseSpeciesMarkdown(fs.readFileSync(path.join(speciesDir, name), 'utf8'));
      expect(parsed.ok, name).toBe(true);
      if (parsed.ok) expect(markdownProblem(parsed.body), name).toBeNull();
    }
    const ordinary = '> Quoted\n> - with a list\n>   - and a sub-item [link](/species/pinus-thunbergii)\n\n```\n' + '        deep code\n'.repeat(5) + '```';
    expect(markdownDepth(ordinary)).toBeLessThanOrEqual(MAX_MARKDOWN_DEPTH);
    expect(await renderMarkdown(ordinary)).toContain('<blockquote>');
  });
});
