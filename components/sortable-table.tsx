'use client';
import { flexRender, type Table } from '@tanstack/react-table';

/**
 * The table shell every list in Candlewise uses: sortable column headings (buttons with
 * aria-sort, large enough to tap), a caption for screen readers, one row per item.
 * A column whose `meta.narrowHidden` is true is hidden below the `sm` breakpoint.
 */
export function SortableTable<T>({
  table,
  caption,
  testId,
  rowTestId,
  className = '',
}: {
  table: Table<T>;
  caption: string;
  testId: string;
  rowTestId: string;
  className?: string;
}) {
  const narrow = (meta: unknown) => ((meta as { narrowHidden?: boolean } | undefined)?.narrowHidden ? 'hidden sm:table-cell' : '');
  return (
    <table className={`w-full text-left text-sm ${className}`} data-testid={testId}>
      <caption className="sr-only">{caption}</caption>
      <thead className="bg-stone-100 text-stone-800">
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => {
              const sorted = h.column.getIsSorted();
              return (
                <th
                  key={h.id}
                  scope="col"
                  className={`px-3 py-1 ${narrow(h.column.columnDef.meta)}`}
                  aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                >
                  {h.column.getCanSort() ? (
                    <button type="button" className="inline-flex min-h-target items-center gap-1 font-semibold" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden className="inline-block w-3 text-stone-600">
                        {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
                      </span>
                    </button>
                  ) : (
                    <span className="font-semibold">{flexRender(h.column.columnDef.header, h.getContext())}</span>
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className="border-t border-stone-200" data-testid={rowTestId}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={`px-3 py-2 align-middle ${narrow(cell.column.columnDef.meta)}`}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
