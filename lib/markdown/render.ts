import { remark } from 'remark';
import remarkGfm from 'remark-gfm';
import remarkRehype from 'remark-rehype';
import rehypeSanitize, { defaultSchema } from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';
import type { Root as HastRoot, Element, ElementContent } from 'hast';
import { SKIP, visit } from 'unist-util-visit';
import type { VFile } from 'vfile';
import { markdownProblem } from './limits';

// The one Markdown pipeline of Candlewise (species care notes, meeting notes, digests):
// remark → remark-gfm → remark-rehype → rehype-sanitize → rehype-stringify.
// Raw HTML in the source is dropped (remark-rehype without allowDangerousHtml), and the
// sanitizer (GitHub's schema) removes scripts, event handlers, iframes, styles and any URL
// whose protocol is not http, https or mailto.

const schema = {
  ...defaultSchema,
  protocols: { ...defaultSchema.protocols, href: ['http', 'https', 'mailto'], src: ['http', 'https'] },
  tagNames: (defaultSchema.tagNames ?? []).filter((t) => !['input'].includes(t)),
};

/** Internal links the app recognises and can decorate (notes → answers and species). */
export type InternalLink = { type: 'answer'; id: string } | { type: 'species'; slug: string };

const answerPath = /^\/answers\/([A-Za-z0-9_-]{6,40})\/?$/;
const speciesPath = /^\/species\/([a-z]+(?:-[a-z]+)+)\/?$/;

export function parseInternalLink(href: string): InternalLink | null {
  let path = href;
  try {
    const u = new URL(href, 'http://candlewise.local');
    if (u.origin !== 'http://candlewise.local' && !/^https?:/.test(href)) return null;
    path = u.origin === 'http://candlewise.local' ? u.pathname : '';
  } catch {
    return null;
  }
  const a = answerPath.exec(path);
  if (a) return { type: 'answer', id: a[1] };
  const s = speciesPath.exec(path);
  if (s) return { type: 'species', slug: s[1] };
  return null;
}

/**
 * How a recognised link is shown when the caller knows more about its target (meeting notes):
 * a preview card, or plain text with a note when the target must not be shown (private or gone).
 * Resolutions are computed by the caller beforehand; the pipeline itself does no I/O.
 */
export type LinkResolution = { state: 'card'; meta: string } | { state: 'unavailable'; note: string };

export interface RenderOptions {
  resolveLink?: (link: InternalLink) => LinkResolution | undefined;
}

const text = (value: string) => ({ type: 'text' as const, value });
const span = (className: string[], children: ElementContent[]): Element => ({ type: 'element', tagName: 'span', properties: { className }, children });

// Runs after the sanitizer: every node built here holds only text (escaped on output) and
// class names from this file, and keeps the children the sanitizer already passed.
function markInternalLinks() {
  return (tree: HastRoot, file: VFile) => {
    const resolve = (file.data as { renderOptions?: RenderOptions }).renderOptions?.resolveLink;
    visit(tree, 'element', (node: Element, index, parent) => {
      if (node.tagName !== 'a' || typeof node.properties?.href !== 'string') return;
      const link = parseInternalLink(node.properties.href);
      if (!link) return;
      // data-* attributes survive the sanitizer only through this class, which the schema allows.
      node.properties.className = ['internal-link', `internal-${link.type}`];
      const res = resolve?.(link);
      if (!res) return;
      if (res.state === 'card') {
        node.properties.className.push('link-card');
        node.children = [span(['link-card-title'], node.children), span(['link-card-meta'], [text(res.meta)])];
        return;
      }
      if (parent && typeof index === 'number') {
        parent.children[index] = span(['link-unavailable'], [...node.children, text(' '), span(['link-note'], [text(res.note)])]);
        return SKIP;
      }
    });
  };
}

const processor = remark().use(remarkGfm).use(remarkRehype).use(rehypeSanitize, schema).use(markInternalLinks).use(rehypeStringify);

/** The source as escaped paragraphs: what is shown when it is over the limits or fails to render. */
function plainTextHtml(source: string): string {
  const esc = (t: string) => t.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
  const capped = source.length > 20_000 ? `${source.slice(0, 20_000)}…` : source;
  return capped
    .split(/\n{2,}/)
    .filter((p) => p.trim())
    .map((p) => `<p class="markdown-unrendered">${esc(p)}</p>`)
    .join('\n');
}

// Rendering never throws: a source over the limits (saved before they existed, or read from a
// file) is shown as plain text, and so is anything the pipeline fails on.
export async function renderMarkdown(source: string, options?: RenderOptions): Promise<string> {
  if (markdownProblem(source)) return plainTextHtml(source);
  try {
    return String(await processor.process({ value: source, data: { renderOptions: options } }));
  } catch {
    return plainTextHtml(source);
  }
}

export function renderMarkdownSync(source: string, options?: RenderOptions): string {
  if (markdownProblem(source)) return plainTextHtml(source);
  try {
    return String(processor.processSync({ value: source, data: { renderOptions: options } }));
  } catch {
    return plainTextHtml(source);
  }
}

/** Every internal link in a Markdown source, deduplicated, in order of first appearance. */
export function extractInternalLinks(source: string): InternalLink[] {
  if (markdownProblem(source)) return [];
  let tree;
  try {
    tree = remark().use(remarkGfm).parse(source);
  } catch {
    return [];
  }
  const seen = new Set<string>();
  const out: InternalLink[] = [];
  visit(tree, (node) => {
    if (node.type !== 'link' && node.type !== 'definition') return;
    const link = parseInternalLink((node as { url: string }).url);
    if (!link) return;
    const key = link.type === 'answer' ? `a:${link.id}` : `s:${link.slug}`;
    if (!seen.has(key)) {
      seen.add(key);
      out.push(link);
    }
  });
  return out;
}
