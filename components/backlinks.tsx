import 'server-only';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/session';
import { getBacklinks } from '@/lib/data/notes';
import { formatMeetingDate } from '@/lib/validation/notes';

/**
 * "Discussed at the meeting of 14 March 2027": the published meeting notes that link this
 * answer or species. Meeting notes are for signed-in members, so the anonymous see nothing here.
 * Place on an answer page with `<Backlinks type="answer" id={answer.id} />` (only where the
 * viewer may see the answer) and on a species page with `<Backlinks type="species" id={slug} />`.
 */
export async function Backlinks({ type, id }: { type: 'answer' | 'species'; id: string }) {
  const viewer = await getCurrentUser();
  if (!viewer) return null;
  const links = await getBacklinks(type, id);
  if (links.length === 0) return null;
  return (
    <section aria-labelledby={`backlinks-${type}`} className="card space-y-2" data-testid="backlinks">
      <h2 id={`backlinks-${type}`} className="text-xl">
        At club meetings
      </h2>
      <ul className="space-y-1">
        {links.map((l) => (
          <li key={l.slug}>
            Discussed at the meeting of{' '}
            <Link href={`/notes/${l.slug}`}>
              <time dateTime={l.meetingDate}>{formatMeetingDate(l.meetingDate)}</time>
            </Link>
            <span className="text-stone-700"> — {l.title}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
