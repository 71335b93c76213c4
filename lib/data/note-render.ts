import 'server-only';
import { extractInternalLinks, renderMarkdown, type InternalLink, type LinkResolution } from '@/lib/markdown/render';
import { getAnswerPreview, type AnswerPreview } from '@/lib/data/answers';
import { getWizardSpecies } from '@/lib/data/species';
import { formatMeetingDate } from '@/lib/validation/notes';

// Notes are read by the whole club and sent by e-mail, so their links are resolved as a club
// reader sees them, whoever renders the note: an answer appears only once it is shared with the
// club; a private or deleted answer becomes plain text with the same note either way, so the
// note never tells whether a private answer exists.

/** A reader who owns nothing: the answer log shows them exactly the answers shared with the club. */
const CLUB_READER = { id: '' } as const;

export const UNAVAILABLE_ANSWER = '(answer not available: it is private or was removed)';
export const UNKNOWN_SPECIES = '(species not in the knowledge base)';

const actionWords: Record<string, string> = { pinch: 'Pinch', prune: 'Prune', 'let-grow': 'Let grow', decandle: 'Decandle', wait: 'Wait' };

function answerCardMeta(p: AnswerPreview): string {
  return `${actionWords[p.action] ?? p.action} · ${p.speciesName} · ${formatMeetingDate(p.observedOn)} · asked by ${p.askerName}`;
}

function speciesCardMeta(s: { commonName: string; botanicalName: string; flushHabit: 'single' | 'double' | 'polycyclic' }): string {
  const flush = { single: 'single flush', double: 'double flush', polycyclic: 'several flushes a season' }[s.flushHabit];
  return `${s.commonName} (${s.botanicalName}) · ${flush}`;
}

const keyOf = (l: InternalLink) => (l.type === 'answer' ? `a:${l.id}` : `s:${l.slug}`);

/** How each internal link of a note body is shown (preview card or plain text with a note). */
export async function resolveNoteLinks(body: string): Promise<Map<string, LinkResolution>> {
  const out = new Map<string, LinkResolution>();
  for (const link of extractInternalLinks(body)) {
    if (link.type === 'answer') {
      const p = await getAnswerPreview(link.id, CLUB_READER);
      out.set(keyOf(link), p ? { state: 'card', meta: answerCardMeta(p) } : { state: 'unavailable', note: UNAVAILABLE_ANSWER });
    } else {
      const s = await getWizardSpecies(link.slug);
      out.set(keyOf(link), s ? { state: 'card', meta: speciesCardMeta(s) } : { state: 'unavailable', note: UNKNOWN_SPECIES });
    }
  }
  return out;
}

/** A note body as sanitized HTML with its links resolved, and the resolutions (for the text e-mail). */
export async function renderNoteWithLinks(body: string): Promise<{ html: string; resolutions: Map<string, LinkResolution> }> {
  const resolutions = await resolveNoteLinks(body);
  return { html: await renderMarkdown(body, { resolveLink: (l) => resolutions.get(keyOf(l)) }), resolutions };
}

/** A note body as sanitized HTML with its links resolved: the one renderer for pages, previews and digests. */
export async function renderNoteBody(body: string): Promise<string> {
  return (await renderNoteWithLinks(body)).html;
}
