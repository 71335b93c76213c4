'use client';
import { useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { SortableTable } from '@/components/sortable-table';
import type { UserDto } from '@/lib/data/users';
import { fetcher, sendJson } from '@/components/fetcher';
import { roleLabels, type Role } from '@/lib/auth/roles';

const col = createColumnHelper<UserDto>();
const roleOptions: Role[] = ['member', 'editor', 'librarian', 'admin'];

/** A change the admin has picked but not saved yet. Nothing reaches the server until Save + confirm. */
type Draft = { role: Role; disabled: boolean };
type Result = { ok: boolean; text: string };

const who = (u: UserDto) => (u.name ? `${u.name} (${u.email})` : u.email);

/** The words of the confirmation: the person, and what they will become. */
function describeChange(u: UserDto, d: Draft): string {
  const parts: string[] = [];
  if (d.role !== u.role)
    parts.push(`make ${who(u)} ${roleLabels[d.role].toLowerCase().startsWith('a') ? 'an' : 'a'} ${roleLabels[d.role]} (now ${roleLabels[u.role]})`);
  if (d.disabled !== u.disabled)
    parts.push(
      d.disabled
        ? `disable ${parts.length ? 'their' : `${who(u)}’s`} account: they are signed out and cannot sign in`
        : `enable ${parts.length ? 'their' : `${who(u)}’s`} account again`,
    );
  const s = parts.join(', and ');
  return `${s.charAt(0).toUpperCase()}${s.slice(1)}?`;
}

export function UsersTable({ initial, currentUserId }: { initial: UserDto[]; currentUserId: string }) {
  const [q, setQ] = useState('');
  const key = `/api/users${q ? `?q=${encodeURIComponent(q)}` : ''}`;
  const { data, mutate } = useSWR<{ items: UserDto[] }>(key, fetcher, { fallbackData: q ? undefined : { items: initial }, keepPreviousData: true });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'createdAt', desc: false }]);
  const [drafts, setDrafts] = useState<Record<string, Draft>>({});
  const [confirming, setConfirming] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [results, setResults] = useState<Record<string, Result>>({});
  const [focusTarget, setFocusTarget] = useState<string | null>(null);

  // After an action, focus goes to what the admin needs next: the confirmation's button, the
  // row's result, or back to its Save button after a cancel. Matched by a data attribute so that
  // it finds the visible copy (the table on wide screens, the cards on a phone).
  useEffect(() => {
    if (!focusTarget) return;
    const el = Array.from(document.querySelectorAll<HTMLElement>(`[data-focus="${focusTarget}"]`)).find((e) => e.offsetParent !== null);
    el?.focus();
    setFocusTarget(null);
  });

  const items = data?.items ?? [];
  const byId = useMemo(() => new Map(items.map((u) => [u.id, u])), [items]);

  const draftOf = (u: UserDto): Draft => drafts[u.id] ?? { role: u.role, disabled: u.disabled };
  const changed = (u: UserDto) => {
    const d = draftOf(u);
    return d.role !== u.role || d.disabled !== u.disabled;
  };

  function setDraft(u: UserDto, patch: Partial<Draft>) {
    setDrafts((all) => ({ ...all, [u.id]: { ...draftOf(u), ...patch } }));
    setResults(({ [u.id]: _gone, ...rest }) => rest);
  }

  async function save(u: UserDto) {
    const d = draftOf(u);
    const body: { role?: Role; disabled?: boolean } = {};
    if (d.role !== u.role) body.role = d.role;
    if (d.disabled !== u.disabled) body.disabled = d.disabled;
    setBusy(true);
    try {
      await sendJson(`/api/users/${u.id}`, 'PATCH', body);
      await mutate();
      setDrafts(({ [u.id]: _done, ...rest }) => rest);
      const parts = [body.role ? `now ${roleLabels[body.role]}` : null, body.disabled === undefined ? null : body.disabled ? 'disabled' : 'enabled'].filter(
        Boolean,
      );
      setResults((r) => ({ ...r, [u.id]: { ok: true, text: `Saved: ${u.name ?? u.email} is ${parts.join(' and ')}. It applies from their next request.` } }));
    } catch (e) {
      setResults((r) => ({ ...r, [u.id]: { ok: false, text: `Not saved: ${(e as Error).message}` } }));
    } finally {
      setBusy(false);
      setConfirming(null);
      setFocusTarget(`result-${u.id}`);
    }
  }

  // A plain render function, not a component declared here (that would remount on every render).
  function rowControls(u: UserDto, layout: 'row' | 'card') {
    const d = draftOf(u);
    const self = u.id === currentUserId;
    const result = results[u.id];
    const isConfirming = confirming === u.id;
    return (
      <div className={layout === 'row' ? 'flex flex-wrap items-center gap-2' : 'space-y-2'}>
        <div className="flex flex-wrap items-center gap-2">
          <select
            aria-label={`Role of ${who(u)}`}
            className="field-input w-auto min-w-36"
            value={d.role}
            disabled={self || busy}
            onChange={(e) => setDraft(u, { role: e.target.value as Role })}
          >
            {roleOptions.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </select>
          <select
            aria-label={`Account of ${who(u)}`}
            className="field-input w-auto"
            value={d.disabled ? 'disabled' : 'active'}
            disabled={self || busy}
            onChange={(e) => setDraft(u, { disabled: e.target.value === 'disabled' })}
          >
            <option value="active">Active</option>
            <option value="disabled">Disabled</option>
          </select>
          {self ? (
            <span className="text-sm text-stone-700">(you)</span>
          ) : (
            <button
              type="button"
              className="btn-primary"
              data-focus={`save-${u.id}`}
              disabled={!changed(u) || busy || isConfirming}
              aria-label={`Save changes to ${who(u)}`}
              onClick={() => {
                setConfirming(u.id);
                setFocusTarget(`confirm-${u.id}`);
              }}
            >
              Save
            </button>
          )}
        </div>
        {isConfirming ? (
          <div
            role="alertdialog"
            aria-labelledby={`confirm-q-${layout}-${u.id}`}
            className="max-w-md space-y-2 rounded-lg border border-sun-500 bg-sun-100 p-3"
            data-testid="role-confirm"
          >
            <p id={`confirm-q-${layout}-${u.id}`}>{describeChange(u, d)}</p>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-primary" data-focus={`confirm-${u.id}`} disabled={busy} onClick={() => void save(u)}>
                {busy ? 'Saving…' : 'Yes, save'}
              </button>
              <button
                type="button"
                className="btn-secondary"
                disabled={busy}
                onClick={() => {
                  setConfirming(null);
                  setFocusTarget(`save-${u.id}`);
                }}
              >
                Cancel
              </button>
            </div>
          </div>
        ) : null}
        <p
          role="status"
          tabIndex={-1}
          data-focus={`result-${u.id}`}
          data-testid="user-result"
          className={`text-sm ${result?.ok === false ? 'text-clay-700' : 'text-moss-800'} ${result ? '' : 'sr-only'}`}
        >
          {result?.text}
        </p>
      </div>
    );
  }

  // tanstack renders a cell function as a component: it must keep its identity across renders,
  // or every render would remount the row's controls and drop the focus. The stable cell reads
  // the current render function through a ref.
  const controlsRef = useRef(rowControls);
  controlsRef.current = rowControls;
  const columns = useMemo(
    () => [
      col.accessor('name', { header: 'Name', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('email', { header: 'E-mail', cell: (c) => <span className="[overflow-wrap:anywhere] lg:whitespace-nowrap">{c.getValue()}</span> }),
      col.accessor('role', { header: 'Role and account', cell: (c) => controlsRef.current(c.row.original, 'row') }),
      col.accessor('createdAt', { header: 'Joined', cell: (c) => <span className="whitespace-nowrap">{c.getValue().slice(0, 10)}</span> }),
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
    <div className="space-y-3">
      <div className="max-w-sm">
        <label htmlFor="user-search" className="field-label">
          Search by name or e-mail
        </label>
        <input id="user-search" type="search" className="field-input" value={q} onChange={(e) => setQ(e.target.value)} />
      </div>
      <p className="text-sm text-stone-700">Pick a role or account state, then Save: nothing changes until you confirm.</p>
      {/* Wide screens: the sortable table. A phone: one card per member (same controls). */}
      <div className="hidden overflow-x-auto rounded-card border border-stone-200 bg-white md:block">
        <SortableTable table={table} caption="Members and their roles. Select a column heading to sort." testId="users-table" rowTestId="user-row" />
      </div>
      <ul className="space-y-3 md:hidden" data-testid="user-cards" aria-label="Members and their roles">
        {table.getRowModel().rows.map((row) => {
          const u = byId.get(row.original.id) ?? row.original;
          return (
            <li key={u.id} className="card space-y-2" data-testid="user-card">
              <div>
                <p className="font-semibold">{u.name ?? '—'}</p>
                <p className="break-all text-sm text-stone-700">{u.email}</p>
                <p className="text-sm text-stone-700">Joined {u.createdAt.slice(0, 10)}</p>
              </div>
              {rowControls(u, 'card')}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
