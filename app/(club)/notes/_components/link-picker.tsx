'use client';
import { useState } from 'react';
import useSWR from 'swr';
import { fetcher } from '@/components/fetcher';
import type { LinkableAnswerDto } from '@/lib/data/linkable-answers';
import { formatMeetingDate } from '@/lib/validation/notes';

type SpeciesItem = { slug: string; botanicalName: string; commonNames: string[]; flushHabit: 'single' | 'double' | 'polycyclic' | null };

const actionOptions = [
  { value: '', label: 'Any action' },
  { value: 'pinch', label: 'Pinch' },
  { value: 'prune', label: 'Prune' },
  { value: 'let-grow', label: 'Let grow' },
  { value: 'decandle', label: 'Decandle' },
  { value: 'wait', label: 'Wait' },
];
const actionWord = (a: string) => actionOptions.find((o) => o.value === a)?.label ?? a;

/** Markdown link text may not contain unescaped brackets. */
const linkText = (s: string) => s.replace(/[[\]\\]/g, (c) => `\\${c}`);

function answerLinkMarkdown(a: LinkableAnswerDto): string {
  return `[${linkText(`${actionWord(a.action).toLowerCase()} on ${a.speciesName}`)}](${a.url})`;
}

function speciesLinkMarkdown(s: SpeciesItem): string {
  return `[${linkText(s.commonNames[0] ?? s.botanicalName)}](/species/${s.slug})`;
}

/**
 * Put an inserted link on a line of its own: a line break before it unless the cursor is at the
 * start of a line, and one after it unless a line break follows. Links inserted one after another
 * then never run together (`…](…)[…`) in the note or in the plain-text e-mail.
 */
export function onOwnLine(before: string, markdown: string, after: string): { text: string; caret: number } {
  const lead = before === '' || before.endsWith('\n') ? '' : '\n';
  const trail = after.startsWith('\n') ? '' : '\n';
  const inserted = `${lead}${markdown}${trail}`;
  return { text: before + inserted + after, caret: before.length + inserted.length };
}

const timeOf = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;

/** What a member reads to pick the right answer: action, species, date, member, tree. */
function describeAnswer(a: LinkableAnswerDto) {
  return `${actionWord(a.action)}, ${a.speciesName}, ${formatMeetingDate(a.observedOn)}, asked by ${a.askerName}${a.treeName ? `, tree “${a.treeName}”` : ', no tree named'}`;
}

function AnswerSearch({ onInsert }: { onInsert: (md: string) => void }) {
  const [f, setF] = useState({ species: '', action: '', member: '', from: '', to: '' });
  const params = new URLSearchParams(Object.entries(f).filter(([, v]) => v.trim() !== ''));
  const { data, error, isLoading } = useSWR<{ items: LinkableAnswerDto[] }>(`/api/notes/linkable-answers?${params}`, fetcher, { keepPreviousData: true });
  const set = (k: keyof typeof f) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setF((x) => ({ ...x, [k]: e.target.value }));
  const items = data?.items ?? [];
  // Answers that read the same (same action, species, day, member and tree) also show when they were saved.
  const lookalike = new Map<string, number>();
  for (const a of items) lookalike.set(describeAnswer(a), (lookalike.get(describeAnswer(a)) ?? 0) + 1);
  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        <div>
          <label htmlFor="pick-species" className="field-label">
            Species name
          </label>
          <input id="pick-species" className="field-input" value={f.species} onChange={set('species')} placeholder="e.g. scots" />
        </div>
        <div>
          <label htmlFor="pick-action" className="field-label">
            Action
          </label>
          <select id="pick-action" className="field-input" value={f.action} onChange={set('action')}>
            {actionOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="pick-member" className="field-label">
            Member
          </label>
          <input id="pick-member" className="field-input" value={f.member} onChange={set('member')} placeholder="Name" />
        </div>
        <div>
          <label htmlFor="pick-from" className="field-label">
            Observed from
          </label>
          <input id="pick-from" type="date" className="field-input" value={f.from} onChange={set('from')} />
        </div>
        <div>
          <label htmlFor="pick-to" className="field-label">
            Observed to
          </label>
          <input id="pick-to" type="date" className="field-input" value={f.to} onChange={set('to')} />
        </div>
      </div>
      <p className="text-sm text-stone-700">Only answers their askers shared with the club are listed.</p>
      {error ? <p className="field-error">{(error as Error).message}</p> : null}
      <ul className="max-h-72 space-y-2 overflow-auto" aria-busy={isLoading} data-testid="picker-answers">
        {items.length === 0 && !isLoading ? <li className="text-stone-700">No shared answer matches.</li> : null}
        {items.map((a) => (
          <li
            key={a.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-stone-200 bg-white px-3 py-1"
            data-testid="picker-answer"
          >
            <span className="min-w-0 break-words">
              <strong>{actionWord(a.action)}</strong> · {a.speciesName} · {formatMeetingDate(a.observedOn)}
              <span className="block text-sm text-stone-700">
                {a.askerName} · {a.treeName ? <>tree “{a.treeName}”</> : 'no tree named'}
                {(lookalike.get(describeAnswer(a)) ?? 0) > 1 ? <> · saved {timeOf(a.savedAt)}</> : null}
              </span>
            </span>
            <button
              type="button"
              className="btn-secondary"
              onClick={() => onInsert(answerLinkMarkdown(a))}
              aria-label={`Insert link to ${describeAnswer(a)}${(lookalike.get(describeAnswer(a)) ?? 0) > 1 ? `, saved ${timeOf(a.savedAt)}` : ''}`}
            >
              Insert
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}

function SpeciesSearch({ onInsert }: { onInsert: (md: string) => void }) {
  const [q, setQ] = useState('');
  const { data, isLoading } = useSWR<{ items: SpeciesItem[] }>(`/api/species?limit=10${q.trim() ? `&q=${encodeURIComponent(q.trim())}` : ''}`, fetcher, {
    keepPreviousData: true,
  });
  const items = data?.items ?? [];
  return (
    <div className="space-y-3">
      <div className="max-w-sm">
        <label htmlFor="pick-species-q" className="field-label">
          Find a species
        </label>
        <input id="pick-species-q" className="field-input" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Name or misspelling" />
      </div>
      <ul className="max-h-72 space-y-2 overflow-auto" aria-busy={isLoading} data-testid="picker-species">
        {items.length === 0 && !isLoading ? <li className="text-stone-700">No species matches.</li> : null}
        {items.map((s) => (
          <li key={s.slug} className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-stone-200 bg-white px-3 py-1">
            <span>
              <strong>{s.commonNames[0] ?? s.botanicalName}</strong> <em>{s.botanicalName}</em>
              {s.flushHabit ? ` · ${s.flushHabit} flush` : ''}
            </span>
            <button type="button" className="btn-secondary" onClick={() => onInsert(speciesLinkMarkdown(s))} aria-label={`Insert link to ${s.botanicalName}`}>
              Insert
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Search shared answers or species and insert a Markdown link where the cursor was in the note. */
export function LinkPicker({ onInsert }: { onInsert: (md: string) => void }) {
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<'answers' | 'species'>('answers');
  return (
    <div className="rounded-card border border-stone-200 bg-stone-100 p-3" data-testid="link-picker">
      <button type="button" className="btn-secondary" aria-expanded={open} aria-controls="link-picker-panel" onClick={() => setOpen((o) => !o)}>
        {open ? 'Close the link finder' : 'Link an answer or species…'}
      </button>
      {open ? (
        <div id="link-picker-panel" className="mt-3 space-y-3">
          <fieldset className="flex flex-wrap gap-4">
            <legend className="sr-only">What to link</legend>
            <label className="flex min-h-target items-center gap-2">
              <input type="radio" name="pick-kind" className="h-5 w-5" checked={kind === 'answers'} onChange={() => setKind('answers')} /> Shared answers
            </label>
            <label className="flex min-h-target items-center gap-2">
              <input type="radio" name="pick-kind" className="h-5 w-5" checked={kind === 'species'} onChange={() => setKind('species')} /> Species
            </label>
          </fieldset>
          {kind === 'answers' ? <AnswerSearch onInsert={onInsert} /> : <SpeciesSearch onInsert={onInsert} />}
        </div>
      ) : null}
    </div>
  );
}
