'use client';
import { useId, useState } from 'react';
import type { Term } from '@/lib/wizard/types';
import { splitTerms } from '@/lib/wizard/terms';
import { TermDrawing } from './drawings';

/** What a term means, with our drawing of it. */
export function TermExplanation({ term, onClose, id }: { term: Term; onClose?: () => void; id?: string }) {
  return (
    <span
      id={id}
      className="mt-2 flex items-start gap-3 rounded-lg border border-stone-300 bg-white p-3 font-sans text-base font-normal normal-case leading-normal tracking-normal text-stone-900"
      data-testid="term-explanation"
    >
      <TermDrawing term={term.term} />
      <span className="min-w-0 flex-1">
        <strong className="block capitalize">{term.term}</strong>
        <span className="block">{term.definition}</span>
      </span>
      {onClose && (
        <button type="button" className="btn-secondary min-w-target shrink-0 px-2" onClick={onClose} aria-label={`Close: ${term.term}`}>
          ✕
        </button>
      )}
    </span>
  );
}

/**
 * Text in which every trade term is a button: one tap shows what it means beneath the text, and
 * another (or Close) hides it. Inline, so a term reads as part of the sentence.
 */
export function TermText({ text, terms, as: Tag = 'span' }: { text: string; terms: Term[] | undefined; as?: 'span' | 'p' }) {
  const [open, setOpen] = useState<string | null>(null);
  const base = useId();
  const list = terms ?? [];
  const parts = list.length
    ? splitTerms(
        text,
        list.map((t) => t.term),
      )
    : [{ text }];
  const shown = list.find((t) => t.term === open);
  const panelId = `${base}-term`;
  return (
    <Tag>
      {parts.map((p, i) =>
        p.term ? (
          <button
            key={i}
            type="button"
            className="inline-flex min-h-target min-w-target items-center justify-center px-0.5 align-baseline underline decoration-dotted decoration-2 underline-offset-4"
            aria-expanded={open === p.term}
            aria-controls={open === p.term ? panelId : undefined}
            data-testid="term"
            onClick={() => setOpen(open === p.term ? null : p.term!)}
          >
            {p.text}
          </button>
        ) : (
          <span key={i}>{p.text}</span>
        ),
      )}
      {shown && <TermExplanation id={panelId} term={shown} onClose={() => setOpen(null)} />}
    </Tag>
  );
}
