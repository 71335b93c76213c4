'use client';
import { useEffect, useMemo, useRef, useState } from 'react';
import Link from 'next/link';
import { usePathname, useRouter } from 'next/navigation';
import useSWR from 'swr';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { SortableTable } from '@/components/sortable-table';
import { fetcher } from '@/components/fetcher';
import type { SpeciesListItem, SpeciesListPage } from '@/lib/data/species-list';
import { buildSpeciesIndex, matchNote, searchSpecies } from '@/lib/species/search';
import { groupLabels, valueLabels } from '@/lib/species/labels';
import { flushHabits, levels, speciesGroups } from '@/lib/validation/species';

export interface SpeciesFilters {
  q: string;
  group: string;
  flush: string;
  vigour: string;
  needleMin: string;
  needleMax: string;
}

const col = createColumnHelper<SpeciesListItem>();
const num = (s: string) => (s.trim() === '' || Number.isNaN(Number(s)) ? undefined : Number(s));

function applyFilters(items: SpeciesListItem[], f: SpeciesFilters) {
  const min = num(f.needleMin);
  const max = num(f.needleMax);
  return items.filter(
    (i) =>
      (!f.group || i.group === f.group) &&
      (!f.flush || i.flushHabit === f.flush) &&
      (!f.vigour || i.vigour === f.vigour) &&
      (min === undefined || (i.needleLengthMm.max ?? 0) >= min) &&
      (max === undefined || (i.needleLengthMm.min ?? Infinity) <= max),
  );
}

export function SpeciesTable({ items: initialItems, initial, showDrafts }: { items: SpeciesListItem[]; initial: SpeciesFilters; showDrafts: boolean }) {
  const router = useRouter();
  const pathname = usePathname();
  const [f, setF] = useState<SpeciesFilters>(initial);
  const [sorting, setSorting] = useState<SortingState>([]);
  const { data } = useSWR<SpeciesListPage>('/api/species?limit=100', fetcher, {
    fallbackData: { items: initialItems, nextCursor: null },
    revalidateOnMount: false,
  });
  // More than one page: keep the complete list the server rendered.
  const all = data && data.nextCursor === null ? data.items : initialItems;
  const index = useMemo(() => buildSpeciesIndex(all), [all]);

  // The same ranking module as GET /api/species?q=, so the order here is the server's order.
  const { rows, notes } = useMemo(() => {
    const filtered = applyFilters(all, f);
    if (!f.q.trim()) return { rows: filtered, notes: new Map<string, string>() };
    const allowed = new Set(filtered.map((i) => i.slug));
    const hits = searchSpecies(all, f.q, index).filter((r) => allowed.has(r.item.slug));
    const notes = new Map<string, string>();
    for (const h of hits) {
      const note = matchNote(h.match);
      if (note) notes.set(h.item.slug, note);
    }
    return { rows: hits.map((r) => r.item), notes };
  }, [all, f, index]);

  // The URL holds the search and filters so a search can be shared; replace, not push, so
  // typing does not fill the history.
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const t = setTimeout(() => {
      const qs = new URLSearchParams();
      for (const [k, v] of Object.entries(f)) if (v.trim()) qs.set(k, v.trim());
      const s = qs.toString();
      router.replace(s ? `${pathname}?${s}` : pathname, { scroll: false });
    }, 250);
    return () => clearTimeout(t);
  }, [f, pathname, router]);

  const columns = useMemo(
    () => [
      col.accessor('botanicalName', {
        header: 'Botanical name',
        cell: (c) => (
          <span className="flex flex-col">
            <Link href={`/species/${c.row.original.slug}`} className="inline-flex min-h-target items-center font-medium italic">
              {c.getValue()}
            </Link>
            <span className="text-stone-700 sm:hidden">{c.row.original.commonNames.join(', ')}</span>
            {notes.has(c.row.original.slug) && (
              <span className="text-sm text-stone-700" data-testid="species-match-note">
                {notes.get(c.row.original.slug)}
              </span>
            )}
            {showDrafts && c.row.original.publishedRevision === null && (
              <span className="w-fit rounded bg-sun-100 px-1.5 text-xs text-sun-700">Not published</span>
            )}
            {showDrafts && c.row.original.publishedRevision !== null && c.row.original.hasDraft && (
              <span className="w-fit rounded bg-sun-100 px-1.5 text-xs text-sun-700">Draft waiting</span>
            )}
          </span>
        ),
      }),
      col.accessor((r) => r.commonNames.join(', '), { id: 'commonNames', header: 'Common names', meta: { narrowHidden: true } }),
      col.accessor('group', { header: 'Group', cell: (c) => groupLabels[c.getValue()] ?? c.getValue(), meta: { narrowHidden: true } }),
      col.accessor('flushHabit', { header: 'Flush', cell: (c) => (c.getValue() ? valueLabels[c.getValue()!] : '—') }),
      col.accessor((r) => r.needleLengthMm.min ?? 0, {
        id: 'needleLength',
        header: 'Needles (mm)',
        cell: (c) => {
          const n = c.row.original.needleLengthMm;
          return n.min == null ? '—' : `${n.min}–${n.max}`;
        },
      }),
      col.accessor((r) => (r.vigour ? levels.indexOf(r.vigour) : -1), {
        id: 'vigour',
        header: 'Vigour',
        cell: (c) => (c.row.original.vigour ? valueLabels[c.row.original.vigour] : '—'),
        meta: { narrowHidden: true },
      }),
    ],
    [showDrafts, notes],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  const set = (k: keyof SpeciesFilters) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setF((p) => ({ ...p, [k]: e.target.value }));
  const filtersOn = Object.values(f).some((v) => v.trim());

  return (
    <div className="space-y-4">
      <form role="search" className="card grid gap-4 sm:grid-cols-2 lg:grid-cols-6" onSubmit={(e) => e.preventDefault()}>
        <div className="sm:col-span-2 lg:col-span-6">
          <label htmlFor="species-q" className="field-label">
            Search
          </label>
          <input
            id="species-q"
            type="search"
            className="field-input"
            placeholder="e.g. Scots pine, mugho, sylvestris"
            value={f.q}
            onChange={set('q')}
            autoComplete="off"
            data-testid="species-search"
          />
        </div>
        <div className="lg:col-span-2">
          <label htmlFor="species-group" className="field-label">
            Group
          </label>
          <select id="species-group" className="field-input" value={f.group} onChange={set('group')}>
            <option value="">All groups</option>
            {speciesGroups.map((g) => (
              <option key={g} value={g}>
                {groupLabels[g]}
              </option>
            ))}
          </select>
        </div>
        <div className="lg:col-span-2">
          <label htmlFor="species-flush" className="field-label">
            Flush habit
          </label>
          <select id="species-flush" className="field-input" value={f.flush} onChange={set('flush')}>
            <option value="">Any</option>
            {flushHabits.map((v) => (
              <option key={v} value={v}>
                {valueLabels[v]}
              </option>
            ))}
          </select>
        </div>
        <div className="lg:col-span-2">
          <label htmlFor="species-vigour" className="field-label">
            Vigour
          </label>
          <select id="species-vigour" className="field-input" value={f.vigour} onChange={set('vigour')}>
            <option value="">Any</option>
            {levels.map((v) => (
              <option key={v} value={v}>
                {valueLabels[v]}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="sm:col-span-2 lg:col-span-4">
          <legend className="field-label">Needle length overlaps (mm)</legend>
          <div className="flex items-center gap-2">
            <label htmlFor="species-nmin" className="sr-only">
              Shortest needle length in mm
            </label>
            <input
              id="species-nmin"
              type="number"
              inputMode="numeric"
              min={1}
              max={500}
              className="field-input"
              placeholder="from"
              value={f.needleMin}
              onChange={set('needleMin')}
            />
            <span aria-hidden>–</span>
            <label htmlFor="species-nmax" className="sr-only">
              Longest needle length in mm
            </label>
            <input
              id="species-nmax"
              type="number"
              inputMode="numeric"
              min={1}
              max={500}
              className="field-input"
              placeholder="to"
              value={f.needleMax}
              onChange={set('needleMax')}
            />
          </div>
        </fieldset>
        <div className="flex items-end lg:col-span-2">
          <button
            type="button"
            className="btn-secondary w-full"
            disabled={!filtersOn}
            onClick={() => setF({ q: '', group: '', flush: '', vigour: '', needleMin: '', needleMax: '' })}
          >
            Clear all
          </button>
        </div>
      </form>

      <p role="status" aria-live="polite" className="text-sm text-stone-700" data-testid="species-count">
        {rows.length === 1 ? '1 species' : `${rows.length} species`}
        {f.q.trim() ? `, best match first for “${f.q.trim()}”` : ''}
      </p>

      {rows.length === 0 ? (
        <div className="card text-stone-700">No species match. Try fewer filters or another spelling.</div>
      ) : (
        <div className="overflow-x-auto rounded-card border border-stone-200 bg-white">
          <SortableTable table={table} caption="Species; select a column heading to sort" testId="species-table" rowTestId="species-row" />
        </div>
      )}
    </div>
  );
}
