// A dense, sortable table for desk work: header buttons sort by keyboard or mouse, rows stay compact.
import { useState } from 'react';
import { flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState, type Table } from '@tanstack/react-table';

export function TableFrame<Row>({
  caption,
  columns,
  rows,
  rowId,
  initialSort = [],
}: {
  caption: string;
  // `any` value type: TanStack's column helpers give each column its own value type.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<Row, any>[];
  rows: Row[];
  rowId: (row: Row) => string;
  initialSort?: SortingState;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort);
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getRowId: rowId,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return <TableGrid caption={caption} table={table} />;
}

/**
 * The table's markup for any TanStack table instance, so a page that adds filters, pages or selection
 * to its own `useReactTable` still renders the same dense, keyboard-sortable table.
 */
export function TableGrid<Row>({ caption, table, rowClassName }: { caption: string; table: Table<Row>; rowClassName?: (row: Row) => string }) {
  return (
    <div className="relative overflow-x-auto rounded-lg bg-white ring-1 ring-soil-300/60">
      <table className="min-w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-straw-100 text-xs text-soil-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    className="whitespace-nowrap px-3 py-2 font-semibold"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 rounded hover:text-field-800 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        {label}
                        <span aria-hidden="true" className="text-soil-400">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-straw-200">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={`hover:bg-field-50/60 ${rowClassName?.(row.original) ?? ''}`}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-top">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
