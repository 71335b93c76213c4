import fs from 'node:fs';
import path from 'node:path';

// The public XSS vector corpora in tests/fixtures/xss (sources and licences in its README.md),
// and the Markdown constructs each vector is embedded in.
const dir = path.resolve(__dirname, '../fixtures/xss');

export interface Vector {
  id: string;
  corpus: 'dompurify' | 'h5sc' | 'rsnake';
  payload: string;
}

export function loadVectors(): Vector[] {
  const json = (file: string, corpus: Vector['corpus']) =>
    (JSON.parse(fs.readFileSync(path.join(dir, file), 'utf8')) as { id: string; payload: string }[]).map((v) => ({ id: v.id, corpus, payload: v.payload }));
  const rsnake = fs
    .readFileSync(path.join(dir, 'rsnake-vectors.txt'), 'utf8')
    .split('\n')
    .map((l) => l.replace(/\r$/, ''))
    .filter((l) => l.trim() !== '')
    .map((payload, i) => ({ id: `rsnake-${i + 1}`, corpus: 'rsnake' as const, payload }));
  return [...json('dompurify-payloads.json', 'dompurify'), ...json('h5sc-vectors.json', 'h5sc'), ...rsnake];
}

/** Markdown constructs a vector can hide in. A vector is one line in the inline ones. */
export const constructs: Record<string, (p: string) => string> = {
  raw: (p) => p,
  'raw, as its own block': (p) => `Before.\n\n${p}\n\nAfter.`,
  'link text': (p) => `[${oneLine(p)}](https://example.org/)`,
  'link URL': (p) => `[follow](${oneLine(p)})`,
  'link URL in angle brackets': (p) => `[follow](<${oneLine(p).replace(/[<>]/g, '')}>)`,
  'link title': (p) => `[follow](https://example.org/ "${oneLine(p).replace(/"/g, '&quot;')}")`,
  'reference definition': (p) => `[follow][r]\n\n[r]: ${oneLine(p)}`,
  image: (p) => `![${oneLine(p)}](${oneLine(p)})`,
  'table cell': (p) => `| species | note |\n|---|---|\n| ${oneLine(p)} | ${oneLine(p)} |`,
  blockquote: (p) =>
    p
      .split('\n')
      .map((l) => `> ${l}`)
      .join('\n'),
  'inline code': (p) => `\`${oneLine(p).replace(/`/g, '')}\``,
  'fenced code': (p) => `\`\`\`html\n${p}\n\`\`\``,
  heading: (p) => `## ${oneLine(p)}`,
  'list item': (p) => `- ${oneLine(p)}\n- second`,
  emphasis: (p) => `**${oneLine(p)}** and _${oneLine(p)}_`,
  autolink: (p) => `<${oneLine(p).replace(/[<>\s]/g, '')}>`,
};

function oneLine(p: string) {
  return p.replace(/[\r\n]+/g, ' ');
}
