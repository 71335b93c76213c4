'use client';
import { useMemo, useState } from 'react';
import Link from 'next/link';
import useSWR from 'swr';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { SortableTable } from '@/components/sortable-table';
import type { NoteSummaryDto } from '@/lib/data/notes';
import { fetcher } from '@/components/fetcher';
import { formatMeetingDate } from '@/lib/validation/notes';

const col = createColumnHelper<NoteSummaryDto>();

export function StatusBadge({ status }: { status: NoteSummaryDto['status'] }) {
  return status === 'published' ? (
    <span className="rounded bg-moss-100 px-2 py-0.5 text-sm text-moss-900">Published</span>
  ) : (
    <span className="rounded bg-sun-100 px-2 py-0.5 text-sm text-sun-700">Draft</span>
  );
}

export function NotesList({ initial }: { initial: NoteSummaryDto[] }) {
  const [q, setQ] = useState('');
  const key = `/api/notes${q.trim() ? `?q=${encodeURIComponent(q.trim())}` : ''}`;
  const { data, isLoading } = useSWR<{ items: NoteSummaryDto[] }>(key, fetcher, {
    fallbackData: q.trim() ? undefined : { items: initial },
    keepPreviousData: true,
  });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'meetingDate', desc: true }]);
  const items = data?.items ?? [];

  const columns = useMemo(
    () => [
      col.accessor('meetingDate', { header: 'Meeting', cell: (c) => <time dateTime={c.getValue()}>{formatMeetingDate(c.getValue())}</time> }),
      col.accessor('title', {
        header: 'Title',
        cell: (c) => (
          <Link href={`/notes/${c.row.original.slug}`} className="inline-flex min-h-target items-center font-medium">
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor('authorName', { header: 'Author' }),
      col.accessor('status', { header: 'Status', cell: (c) => <StatusBadge status={c.getValue()} /> }),
    ],
    [],
  );
  const table = useReactTable({
    data: items,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="space-y-4">
      <div className="max-w-md">
        <label htmlFor="note-search" className="field-label">
          Search the notes
        </label>
        <input
          id="note-search"
          type="search"
          className="field-input"
          placeholder="Title, words in the note, or author"
          value={q}
          onChange={(e) => setQ(e.target.value)}
        />
      </div>
      <p role="status" className="sr-only">
        {isLoading ? 'Searching…' : `${items.length} notes`}
      </p>
      {items.length === 0 ? (
        <p className="card text-stone-700" data-testid="notes-empty">
          {q.trim() ? 'No note matches that search.' : 'No meeting notes yet.'}
        </p>
      ) : (
        <>
          {/* Phones: one card per note, newest meeting first. */}
          <ul className="space-y-3 sm:hidden" data-testid="note-cards">
            {table.getRowModel().rows.map(({ original: n }) => (
              <li key={n.slug} className="card py-3">
                <p className="text-sm text-stone-700">
                  <time dateTime={n.meetingDate}>{formatMeetingDate(n.meetingDate)}</time> · {n.authorName}
                </p>
                <Link href={`/notes/${n.slug}`} className="inline-flex min-h-target items-center text-lg font-medium">
                  {n.title}
                </Link>
                <div>
                  <StatusBadge status={n.status} />
                </div>
              </li>
            ))}
          </ul>
          <div className="hidden overflow-x-auto rounded-card border border-stone-200 bg-white sm:block">
            <SortableTable table={table} caption="Meeting notes. Select a column heading to sort." testId="notes-table" rowTestId="note-row" />
          </div>
        </>
      )}
    </div>
  );
}
