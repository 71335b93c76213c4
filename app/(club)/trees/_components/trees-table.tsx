'use client';
import { useMemo, useState } from 'react';
import Link from 'next/link';
import useSWR from 'swr';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { SortableTable } from '@/components/sortable-table';
import type { TreeDto } from '@/lib/data/trees';
import { fetcher } from '@/components/fetcher';
import { describeCollected, describeContainer } from '@/lib/trees/describe';

const col = createColumnHelper<TreeDto>();

export function TreesTable({ initial, due }: { initial: TreeDto[]; due: Record<string, string> }) {
  const { data } = useSWR<{ items: TreeDto[] }>('/api/trees', fetcher, { fallbackData: { items: initial } });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);

  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Name',
        cell: (c) => (
          <Link href={`/trees/${c.row.original.id}`} className="inline-flex min-h-target items-center font-medium">
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor((t) => t.speciesName ?? t.speciesSlug, { id: 'species', header: 'Species' }),
      col.accessor((t) => (t.containerShape ? (t.containerLengthCm ?? 0) * (t.containerWidthCm ?? t.containerLengthCm ?? 0) : -1), {
        id: 'container',
        header: 'Container',
        cell: (c) => describeContainer(c.row.original),
      }),
      col.accessor((t) => t.acquiredOn ?? '', { id: 'acquiredOn', header: 'Acquired', cell: (c) => c.getValue() || '—' }),
      col.accessor((t) => (t.collectedFromWild ? `1${t.collectedOn ?? ''}` : '0'), {
        id: 'collected',
        header: 'From the wild',
        cell: (c) => describeCollected(c.row.original),
      }),
      col.accessor((t) => due[t.id] ?? '', { id: 'due', header: 'Due now', cell: (c) => c.getValue() || '—' }),
      col.accessor('updatedAt', { header: 'Updated', cell: (c) => c.getValue().slice(0, 10) }),
    ],
    [due],
  );

  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  if ((data?.items ?? []).length === 0) {
    return (
      <div className="card space-y-2" data-testid="trees-empty">
        <p>You have not added a tree yet.</p>
        <p className="text-stone-700">Add one to keep its container, history and photos together, and to ask about it with those details filled in.</p>
      </div>
    );
  }

  const sortOptions = [
    { value: 'name:asc', label: 'Name, A to Z' },
    { value: 'name:desc', label: 'Name, Z to A' },
    { value: 'species:asc', label: 'Species' },
    { value: 'acquiredOn:desc', label: 'Acquired, newest first' },
    { value: 'updatedAt:desc', label: 'Updated, newest first' },
  ];
  const current = sorting[0] ? `${sorting[0].id}:${sorting[0].desc ? 'desc' : 'asc'}` : 'name:asc';

  return (
    <>
      {/* Phones get one card per tree and a sort select; wider screens get the sortable table. */}
      <div className="space-y-3 sm:hidden">
        <div>
          <label htmlFor="tree-sort" className="field-label">
            Sort by
          </label>
          <select
            id="tree-sort"
            className="field-input"
            value={sortOptions.some((o) => o.value === current) ? current : ''}
            onChange={(e) => {
              const [id, dir] = e.target.value.split(':');
              setSorting([{ id, desc: dir === 'desc' }]);
            }}
          >
            {sortOptions.some((o) => o.value === current) ? null : <option value="">Column order</option>}
            {sortOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
        <ul className="space-y-3" data-testid="tree-cards">
          {table.getRowModel().rows.map(({ original: t }) => (
            <li key={t.id} className="card py-3">
              <Link href={`/trees/${t.id}`} className="inline-flex min-h-target items-center text-lg font-medium">
                {t.name}
              </Link>
              <p className="text-stone-700">{t.speciesName ?? t.speciesSlug}</p>
              <p className="text-sm text-stone-600">
                {describeContainer(t)} · From the wild: {describeCollected(t)}
              </p>
              {due[t.id] ? <p className="text-sm font-medium text-moss-800">Due now: {due[t.id]}</p> : null}
            </li>
          ))}
        </ul>
      </div>
      <div className="hidden overflow-x-auto rounded-card border border-stone-200 bg-white sm:block">
        <SortableTable
          table={table}
          caption="Your trees. Select a column heading to sort."
          testId="trees-table"
          rowTestId="tree-row"
          className="min-w-[40rem]"
        />
      </div>
    </>
  );
}
