import { remark } from 'remark';
import remarkGfm from 'remark-gfm';
import { visit } from 'unist-util-visit';
import type { Root, Link, Definition } from 'mdast';
import { parseInternalLink, type InternalLink, type LinkResolution } from '@/lib/markdown/render';
import { formatMeetingDate } from '@/lib/validation/notes';
import { escapeHtml } from './templates';

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

export function renderDigest(input: DigestInput): DigestMail {
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
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title>
<style>
body{font-family:system-ui,sans-serif;color:#1f1f1c;line-height:1.55;max-width:40rem;margin:0 auto;padding:16px}
a{color:#33522c}
.link-card{display:inline-block;border:1px solid #9dbf8e;background:#f3f7f1;border-radius:8px;padding:2px 8px;text-decoration:none}
.link-card-title{display:block;font-weight:600;text-decoration:underline}
.link-card-meta{display:block;font-size:14px;color:#484842}
.link-note{font-style:italic;color:#5c5c53;font-size:14px}
.foot{margin-top:32px;border-top:1px solid #dcdcd5;padding-top:12px;font-size:14px;color:#5c5c53}
</style></head>
<body>
<p style="text-transform:uppercase;letter-spacing:.05em;font-size:13px;color:#5c4533">${escapeHtml(clubName)} · meeting of ${escapeHtml(when)}</p>
<h1 style="font-family:Georgia,serif;color:#233721">${escapeHtml(note.title)}</h1>
<p>Written by ${escapeHtml(note.authorName)}</p>
${absolutiseHtml(input.html, baseUrl)}
<div class="foot">
<p><a href="${escapeHtml(noteUrl)}">Read it on the club site</a></p>
<p>You get these because you asked for meeting notes by e-mail. <a href="${escapeHtml(unsubscribeUrl)}">Stop these e-mails</a>.</p>
</div>
</body></html>`;
  return { subject, html, text };
}
