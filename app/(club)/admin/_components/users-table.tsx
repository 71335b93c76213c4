'use client';
import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { SortableTable } from '@/components/sortable-table';
import type { UserDto } from '@/lib/data/users';
import { fetcher, sendJson } from '@/components/fetcher';
import { roleLabels, type Role } from '@/lib/auth/roles';

const col = createColumnHelper<UserDto>();
const roleOptions: Role[] = ['member', 'editor', 'librarian', 'admin'];

export function UsersTable({ initial, currentUserId }: { initial: UserDto[]; currentUserId: string }) {
  const [q, setQ] = useState('');
  const key = `/api/users${q ? `?q=${encodeURIComponent(q)}` : ''}`;
  const { data, mutate } = useSWR<{ items: UserDto[] }>(key, fetcher, { fallbackData: q ? undefined : { items: initial }, keepPreviousData: true });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'createdAt', desc: false }]);
  const [message, setMessage] = useState<string | null>(null);

  const columns = useMemo(() => {
    async function patch(id: string, body: { role?: Role; disabled?: boolean }) {
      setMessage(null);
      try {
        await sendJson(`/api/users/${id}`, 'PATCH', body);
        await mutate();
        setMessage('Saved. The change applies from the member’s next request.');
      } catch (e) {
        setMessage((e as Error).message);
      }
    }
    return [
      col.accessor('name', { header: 'Name', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('email', { header: 'E-mail' }),
      col.accessor('role', {
        header: 'Role',
        cell: (c) => (
          <select
            aria-label={`Role of ${c.row.original.email}`}
            className="field-input min-w-36"
            value={c.getValue()}
            disabled={c.row.original.id === currentUserId}
            onChange={(e) => void patch(c.row.original.id, { role: e.target.value as Role })}
          >
            {roleOptions.map((r) => <option key={r} value={r}>{roleLabels[r]}</option>)}
          </select>
        ),
      }),
      col.accessor('disabled', {
        header: 'Status',
        cell: (c) => (
          <span className="flex items-center gap-3">
          <span className={c.getValue() ? 'text-clay-700' : 'text-moss-800'}>{c.getValue() ? 'Disabled' : 'Active'}</span>
          <button
            type="button"
            className={c.getValue() ? 'btn-secondary' : 'btn-danger'}
            disabled={c.row.original.id === currentUserId}
            aria-label={`${c.getValue() ? 'Enable' : 'Disable'} ${c.row.original.email}`}
            onClick={() => void patch(c.row.original.id, { disabled: !c.getValue() })}
          >
            {c.getValue() ? 'Enable' : 'Disable'}
          </button>
          </span>
        ),
      }),
      col.accessor('createdAt', { header: 'Joined', cell: (c) => c.getValue().slice(0, 10) }),
    ];
  }, [currentUserId, mutate]);

  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="space-y-3">
      <div className="max-w-sm">
        <label htmlFor="user-search" className="field-label">Search by name or e-mail</label>
        <input id="user-search" type="search" className="field-input" value={q} onChange={(e) => setQ(e.target.value)} />
      </div>
      <p role="status" className="min-h-6 text-sm text-moss-800">{message}</p>
      <div className="overflow-x-auto rounded-card border border-stone-200 bg-white">
        <SortableTable table={table} caption="Members and their roles. Select a column heading to sort." testId="users-table" rowTestId="user-row" />
      </div>
    </div>
  );
}
