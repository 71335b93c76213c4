'use client';
import { useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { mutate } from 'swr';
import { sendJson } from '@/components/fetcher';
import type { NoteStatus } from '@/lib/validation/notes';
import { SendDigest } from './send-digest';

export function NoteActions({ slug, title, status, writer }: { slug: string; title: string; status: NoteStatus; writer: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    if (!window.confirm(`Delete the note “${title}”? This cannot be undone.`)) return;
    try {
      await sendJson(`/api/notes/${slug}`, 'DELETE');
      await mutate((k) => typeof k === 'string' && k.startsWith('/api/notes'));
      router.push('/notes');
      router.refresh();
    } catch (e) {
      setError((e as Error).message);
    }
  }
  return (
    <div className="no-print space-y-4">
      <div className="flex flex-wrap gap-3">
        <button type="button" className="btn-secondary" onClick={() => window.print()}>
          Print
        </button>
        <a href={`/api/notes/${slug}?format=md`} className="btn-secondary" download={`${slug}.md`}>
          Download as Markdown
        </a>
        {writer ? (
          <Link href={`/notes/${slug}/edit`} className="btn-secondary">
            Edit
          </Link>
        ) : null}
        {writer ? (
          <button type="button" className="btn-danger" onClick={() => void remove()}>
            Delete
          </button>
        ) : null}
      </div>
      {error ? (
        <p role="alert" className="field-error">
          {error}
        </p>
      ) : null}
      {writer ? <SendDigest slug={slug} published={status === 'published'} /> : null}
    </div>
  );
}
