// The package table the contractor's desk, the site queue, the engineer's list and the
// administrator's overview share. Sorting and paging happen on the server; the table only
// says which sort is on. Rows take the keyboard (../hooks/use-row-keys.ts), and where rows can
// be selected (the coordinator's queue) x toggles a row and shift-click picks a range.
import { useMemo, useRef, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type RowSelectionState,
  type Updater,
} from '@tanstack/react-table';
import type { Role } from '@shared/schemas/common';
import type { PackageSummary } from '@shared/schemas/packages';
import type { PackageSort } from '../hooks/use-package-list-params';
import { useRowKeys } from '../hooks/use-row-keys';
import { usePackageColumns, visibleColumns, type PackageTableVariant } from './package-columns';
import { ariaSort, SortHeader, SORTABLE } from './sort-header';

export type RowSelection = {
  selected: ReadonlySet<string>;
  onChange: (next: Set<string>) => void;
};

export function PackageTable({
  items,
  role,
  variant,
  sort,
  onSortChange,
  busy = false,
  caption,
  selection,
  engineerCell,
}: {
  items: PackageSummary[];
  role: Role;
  variant: PackageTableVariant;
  sort: PackageSort;
  onSortChange: (sort: PackageSort) => void;
  busy?: boolean;
  caption: string;
  /** Rows get a checkbox column; the set of selected ids may reach past this page. */
  selection?: RowSelection;
  /** What the engineer column shows instead of the name (e.g. a way to assign). */
  engineerCell?: (pkg: PackageSummary) => ReactNode;
}) {
  const navigate = useNavigate();
  // The row last ticked by hand: a shift-click ticks every row between it and the next.
  const anchorRef = useRef<number | null>(null);
  const selectable = selection !== undefined;

  const columns = usePackageColumns({ role, variant, engineerCell, anchorRef });

  const visibleIds = visibleColumns(variant, selectable);
  const rowSelection = useMemo<RowSelectionState>(
    () => Object.fromEntries([...(selection?.selected ?? [])].map((id) => [id, true])),
    [selection?.selected],
  );
  function onRowSelectionChange(updater: Updater<RowSelectionState>) {
    if (!selection) return;
    const next = typeof updater === 'function' ? updater(rowSelection) : updater;
    selection.onChange(new Set(Object.keys(next).filter((id) => next[id])));
  }
  // The app does not run the React Compiler; TanStack Table re-reads its state each render.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: items,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => row.id,
    manualPagination: true,
    manualSorting: true,
    enableRowSelection: selectable,
    onRowSelectionChange,
    state: {
      rowSelection,
      columnOrder: visibleIds,
      columnVisibility: Object.fromEntries(
        columns.map((c) => [c.id as string, visibleIds.includes(c.id as string)]),
      ),
    },
  });

  const rows = table.getRowModel().rows;
  const open = (index: number) => navigate(`/packages/${rows[index].original.id}`);
  const { rowProps } = useRowKeys({
    count: rows.length,
    onOpen: open,
    onToggle: selectable ? (index) => rows[index]?.toggleSelected() : undefined,
    anchorRef,
  });

  return (
    <div className="overflow-x-auto border border-rule bg-sheet">
      <table
        className={`w-full border-collapse text-left text-[13.5px] ${busy ? 'opacity-60' : ''}`}
        aria-busy={busy}
      >
        <caption className="sr-only">
          {caption}. Use j and k or the arrow keys to move between rows, Enter to open
          {selectable ? ', x to select a row' : ''}.
        </caption>
        <thead className="bg-sheet-alt">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b-2 border-rule-strong">
              {group.headers.map((header) => {
                const sortField = SORTABLE[header.column.id];
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={ariaSort(header.column.id, sort)}
                    className="whitespace-nowrap px-2.5 py-2 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft"
                  >
                    {sortField ? (
                      <SortHeader
                        label={String(header.column.columnDef.header)}
                        field={sortField}
                        sort={sort}
                        onSortChange={onSortChange}
                      />
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row, index) => (
            <tr
              key={row.id}
              {...rowProps(index)}
              onClick={() => open(index)}
              data-selected={row.getIsSelected() || undefined}
              className={`cursor-pointer border-b border-rule align-top last:border-b-0 hover:bg-verdigris-tint focus:bg-verdigris-tint ${
                row.getIsSelected()
                  ? 'bg-verdigris-tint shadow-[inset_3px_0_0_var(--color-verdigris)]'
                  : 'even:bg-sheet-alt'
              }`}
            >
              {row.getVisibleCells().map((cell) => (
                <td
                  key={cell.id}
                  className={cell.column.id === 'select' ? 'w-8 py-2 pl-3 pr-1' : 'px-2.5 py-2'}
                  onClick={
                    cell.column.id === 'select'
                      ? (event) => {
                          // A near miss beside the small checkbox should not open the package.
                          event.stopPropagation();
                          if (event.target === event.currentTarget)
                            (event.currentTarget.querySelector('input') as HTMLInputElement | null)?.click();
                        }
                      : undefined
                  }
                >
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
