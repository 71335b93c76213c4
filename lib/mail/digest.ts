import { remark } from 'remark';
import remarkGfm from 'remark-gfm';
import { visit } from 'unist-util-visit';
import type { Root, Link, Definition } from 'mdast';
import { parseInternalLink, type InternalLink, type LinkResolution } from '@/lib/markdown/render';
import { formatMeetingDate } from '@/lib/validation/notes';
import { createElement } from 'react';
import { render } from '@react-email/render';
import { mailColors } from './layout';
import { DigestEmail } from './digest-email';

// The e-mail form of a published meeting note: an HTML part (the page's sanitized HTML with
// links made absolute) and a plain-text part (the Markdown, links resolved the same way).

export interface DigestInput {
  clubName: string;
  baseUrl: string;
  note: { slug: string; title: string; meetingDate: string; authorName: string; body: string };
  /** The note body rendered by the shared pipeline, links resolved (renderNoteBody). */
  html: string;
  resolutions: Map<string, LinkResolution>;
  unsubscribeUrl: string;
}

export interface DigestMail {
  subject: string;
  html: string;
  text: string;
}

/** The visible words of an inline node (text, code), without the Markdown around them. */
function plainText(node: unknown): string {
  const n = node as { value?: unknown; children?: unknown[] };
  if (typeof n.value === 'string') return n.value;
  return (n.children ?? []).map(plainText).join('');
}

const keyOf = (l: InternalLink) => (l.type === 'answer' ? `a:${l.id}` : `s:${l.slug}`);

/** Root-relative href/src in the sanitized HTML become absolute, for mail clients. */
export function absolutiseHtml(html: string, baseUrl: string): string {
  return html.replace(/(href|src)="\/(?!\/)/g, `$1="${baseUrl}/`);
}

export function digestText(input: Pick<DigestInput, 'baseUrl' | 'note' | 'resolutions'>): string {
  const tree = remark().use(remarkGfm).parse(input.note.body) as Root;
  const absolute = (url: string) => (url.startsWith('/') && !url.startsWith('//') ? `${input.baseUrl}${url}` : url);
  visit(tree, (node, index, parent) => {
    if (node.type === 'link') {
      const link = node as Link;
      const internal = parseInternalLink(link.url);
      const res = internal ? input.resolutions.get(keyOf(internal)) : undefined;
      if (res?.state === 'unavailable' && parent && typeof index === 'number') {
        // Plain text: the address of a private answer is not sent to anyone.
        parent.children.splice(index, 1, { type: 'text', value: `${plainText(link)} ${res.note}` });
        return index + 1;
      }
      link.url = absolute(link.url);
      if (res?.state === 'card' && parent && typeof index === 'number') {
        parent.children.splice(index + 1, 0, { type: 'text', value: ` (${res.meta})` });
        return index + 2;
      }
    }
    if (node.type === 'definition') {
      const def = node as Definition;
      const internal = parseInternalLink(def.url);
      const res = internal ? input.resolutions.get(keyOf(internal)) : undefined;
      def.url = res?.state === 'unavailable' ? `${input.baseUrl}/notes/${input.note.slug}` : absolute(def.url);
    }
    return undefined;
  });
  return remark().use(remarkGfm).stringify(tree).trimEnd();
}

/**
 * Inline styles for the classes the shared Markdown pipeline puts on preview cards (mail programs
 * drop <style> blocks): the body HTML is sanitized, so its class attributes are ours alone.
 */
const inlineByClass: Record<string, string> = {
  'link-card': `display:inline-block;border:1px solid ${mailColors.mossLine};background:${mailColors.mossWash};border-radius:8px;padding:2px 8px;text-decoration:none;color:${mailColors.moss}`,
  'link-card-title': 'display:block;font-weight:600;text-decoration:underline',
  'link-card-meta': `display:block;font-size:14px;color:${mailColors.muted};text-decoration:none`,
  'link-note': `font-style:italic;color:${mailColors.faint};font-size:14px`,
  'link-unavailable': `color:${mailColors.ink}`,
};

export function inlineBodyStyles(html: string): string {
  return html.replace(/<(a|span|p|div)\b([^>]*?)\sclass="([^"]*)"/g, (all, tag: string, before: string, cls: string) => {
    const style = cls
      .split(/\s+/)
      .map((c) => inlineByClass[c])
      .filter(Boolean)
      .join(';');
    return style ? `<${tag}${before} class="${cls}" style="${style}"` : all;
  });
}

/** The headers that let mail programs offer a one-click unsubscribe (RFC 2369, RFC 8058). */
export function digestHeaders(unsubscribeUrl: string): Record<string, string> {
  return {
    'List-Unsubscribe': `<${unsubscribeUrl.replace('/unsubscribe?', '/api/unsubscribe?')}>`,
    'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
  };
}

export async function renderDigest(input: DigestInput): Promise<DigestMail & { headers: Record<string, string> }> {
  const { note, clubName, baseUrl, unsubscribeUrl } = input;
  const when = formatMeetingDate(note.meetingDate);
  const noteUrl = `${baseUrl}/notes/${note.slug}`;
  const subject = `${clubName}: ${note.title} (meeting of ${when})`;
  const text = [
    `${clubName} — notes from the meeting of ${when}`,
    note.title,
    `Written by ${note.authorName}`,
    '',
    digestText(input),
    '',
    '—',
    `Read it on the club site: ${noteUrl}`,
    `You get these because you asked for meeting notes by e-mail. Stop them: ${unsubscribeUrl}`,
  ].join('\n');
  const html = await render(
    createElement(DigestEmail, {
      clubName,
      when,
      title: note.title,
      authorName: note.authorName,
      bodyHtml: inlineBodyStyles(absolutiseHtml(input.html, baseUrl)),
      noteUrl,
      unsubscribeUrl,
      subject,
    }),
  );
  return { subject, html, text, headers: digestHeaders(unsubscribeUrl) };
}
