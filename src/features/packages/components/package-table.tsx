// The package table the contractor's desk, the site queue, the engineer's list and the
// administrator's overview share. Sorting and paging happen on the server; the table only
// says which sort is on. Rows take the keyboard: j/k or ↑/↓ move, Enter opens, and where
// rows can be selected (the coordinator's queue) x toggles a row and shift-click picks a range.
import { useMemo, useRef, useState, type KeyboardEvent, type MouseEvent, type ReactNode } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type RowSelectionState,
  type Updater,
} from '@tanstack/react-table';
import type { Role } from '@shared/schemas/common';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageSummary } from '@shared/schemas/packages';
import { StatusBadge } from '@/components/ui/status-badge';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { DateWithUrgency } from '@/components/ui/date-with-urgency';
import { formatDate, plural } from '@/lib/format';
import { waitingOn } from '../lib/waiting-on';
import type { PackageSort } from '../hooks/use-package-list-params';

export type PackageTableVariant = 'desk' | 'queue' | 'assigned';

const COLUMNS_BY_VARIANT: Record<PackageTableVariant, string[]> = {
  desk: ['reference', 'package', 'site', 'plannedLiftDate', 'revision', 'status', 'waitingOn'],
  queue: [
    'reference',
    'package',
    'contractor',
    'plannedLiftDate',
    'revision',
    'check',
    'engineer',
    'status',
    'updatedAt',
  ],
  assigned: [
    'reference',
    'package',
    'contractor',
    'plannedLiftDate',
    'revision',
    'check',
    'status',
    'waitingOn',
  ],
};

type SortableColumn = 'reference' | 'plannedLiftDate' | 'updatedAt' | 'openDiscrepancies' | 'revision';
const SORTABLE: Record<string, SortableColumn> = {
  reference: 'reference',
  plannedLiftDate: 'plannedLiftDate',
  updatedAt: 'updatedAt',
  check: 'openDiscrepancies',
  revision: 'revision',
};

/** Counts read most-first on the first press; dates and references earliest-first. */
const MOST_FIRST: ReadonlySet<SortableColumn> = new Set(['openDiscrepancies', 'revision']);
const SORT_WORDS: Record<SortableColumn, [string, string]> = {
  reference: ['reference, A to Z', 'reference, Z to A'],
  plannedLiftDate: ['planned lift, earliest first', 'planned lift, latest first'],
  updatedAt: ['last update, oldest first', 'last update, newest first'],
  openDiscrepancies: ['open discrepancies, fewest first', 'open discrepancies, most first'],
  revision: ['revision, lowest first', 'revision, highest first'],
};

export type RowSelection = {
  selected: ReadonlySet<string>;
  onChange: (next: Set<string>) => void;
};

const column = createColumnHelper<PackageSummary>();

function SortHeader({
  label,
  field,
  sort,
  onSortChange,
}: {
  label: string;
  field: SortableColumn;
  sort: PackageSort;
  onSortChange: (sort: PackageSort) => void;
}) {
  const active = sort === field || sort === `-${field}`;
  const descending = sort === `-${field}`;
  // The first press gives the useful order; the next press turns it round.
  const nextDescending = active ? !descending : MOST_FIRST.has(field);
  const nextSort = (nextDescending ? `-${field}` : field) as PackageSort;
  return (
    <button
      type="button"
      onClick={() => onSortChange(nextSort)}
      className={`inline-flex items-center gap-1 font-bold uppercase tracking-[0.06em] hover:text-verdigris ${active ? 'text-ink' : ''}`}
      title={`Sort by ${SORT_WORDS[field][nextDescending ? 1 : 0]}`}
    >
      {label}
      <svg className="size-3" viewBox="0 0 12 12" aria-hidden="true" fill="currentColor">
        <path d="M6 1.5 L9.5 5 H2.5 Z" opacity={active && !descending ? 1 : 0.3} />
        <path d="M6 10.5 L2.5 7 H9.5 Z" opacity={active && descending ? 1 : 0.3} />
      </svg>
    </button>
  );
}

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
  const [activeIndex, setActiveIndex] = useState(0);
  const rowRefs = useRef<(HTMLTableRowElement | null)[]>([]);
  // The row last ticked by hand: a shift-click ticks every row between it and the next.
  const anchorRef = useRef<number | null>(null);
  const selectable = selection !== undefined;

  const columns = useMemo(
    () => [
      column.display({
        id: 'select',
        header: ({ table }) => (
          <input
            type="checkbox"
            aria-label="Select every package on this page"
            className="size-4 accent-verdigris"
            checked={table.getIsAllPageRowsSelected()}
            ref={(element) => {
              if (element) element.indeterminate = table.getIsSomePageRowsSelected();
            }}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        ),
        cell: ({ row, table }) => (
          <input
            type="checkbox"
            aria-label={`Select ${row.original.reference}`}
            className="size-4 accent-verdigris"
            checked={row.getIsSelected()}
            tabIndex={-1}
            onClick={(event: MouseEvent<HTMLInputElement>) => {
              event.stopPropagation();
              const rows = table.getRowModel().rows;
              const anchor = anchorRef.current;
              if (event.shiftKey && anchor !== null && anchor !== row.index && rows[anchor]) {
                const [from, to] = anchor < row.index ? [anchor, row.index] : [row.index, anchor];
                const value = !row.getIsSelected();
                table.setRowSelection((current) => {
                  const next = { ...current };
                  for (const r of rows.slice(from, to + 1)) {
                    if (value) next[r.id] = true;
                    else delete next[r.id];
                  }
                  return next;
                });
              } else {
                row.toggleSelected();
              }
              anchorRef.current = row.index;
            }}
            onChange={() => undefined}
          />
        ),
      }),
      column.accessor('reference', {
        id: 'reference',
        header: 'Reference',
        cell: (info) => (
          <Link
            to={`/packages/${info.row.original.id}`}
            tabIndex={-1}
            className="font-mono text-[13px] font-bold text-verdigris underline decoration-verdigris/40 underline-offset-2 hover:decoration-verdigris"
          >
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('title', {
        id: 'package',
        header: 'Lift',
        cell: (info) => {
          const pkg = info.row.original;
          const critical = pkg.critical && (
            <span className="inline-flex items-center gap-1 text-[11px] font-black uppercase tracking-[0.06em] text-ink">
              <svg className="size-2.5" viewBox="0 0 10 10" aria-hidden="true">
                <path d="M5 0.5 L9.5 5 L5 9.5 L0.5 5 Z" fill="none" stroke="currentColor" strokeWidth="1.6" />
              </svg>
              Critical
            </span>
          );
          return (
            <div className="min-w-[13rem]">
              <div className="font-bold">{pkg.title}</div>
              {(variant !== 'desk' || critical) && (
                <div className="flex flex-wrap items-center gap-x-2 text-[12.5px] text-ink-soft">
                  {variant !== 'desk' && <span>{pkg.site.name}</span>}
                  {critical}
                </div>
              )}
            </div>
          );
        },
      }),
      column.accessor((pkg) => pkg.site.name, { id: 'site', header: 'Site' }),
      column.accessor((pkg) => pkg.contractor.name, {
        id: 'contractor',
        header: 'Contractor',
        cell: (info) => <span className="block min-w-[8rem]">{info.getValue()}</span>,
      }),
      column.accessor('plannedLiftDate', {
        id: 'plannedLiftDate',
        header: 'Planned lift',
        cell: (info) => (
          <DateWithUrgency value={info.getValue()} settled={info.row.original.status === 'returned'} />
        ),
      }),
      column.accessor('revisionNumber', {
        id: 'revision',
        header: 'Rev.',
        cell: (info) => <span className="tabular">{info.getValue()}</span>,
      }),
      column.display({
        id: 'check',
        header: 'Check',
        cell: (info) => {
          const pkg = info.row.original;
          if (!pkg.worstStatus) return <span className="text-ink-soft">Not run</span>;
          return (
            <div className="flex flex-col items-start gap-0.5">
              <CheckStatusMark status={pkg.worstStatus} />
              {pkg.openDiscrepancies > 0 && (
                <span className="text-[12px] font-bold text-fail-ink">
                  {plural(pkg.openDiscrepancies, 'discrepancy', 'discrepancies')}
                </span>
              )}
            </div>
          );
        },
      }),
      column.accessor((pkg) => pkg.engineer?.name ?? null, {
        id: 'engineer',
        header: 'Engineer',
        cell: (info) =>
          engineerCell
            ? engineerCell(info.row.original)
            : (info.getValue() ?? <span className="text-ink-soft">Unassigned</span>),
      }),
      column.accessor('status', {
        id: 'status',
        header: 'Status',
        cell: (info) => {
          const pkg = info.row.original;
          return (
            <div className="flex flex-col items-start gap-0.5">
              <StatusBadge status={pkg.status} />
              {pkg.decision && <span className="text-[12px] font-bold">{DECISION_LABELS[pkg.decision]}</span>}
            </div>
          );
        },
      }),
      column.display({
        id: 'waitingOn',
        header: 'Waiting on',
        cell: (info) => {
          const waiting = waitingOn(info.row.original, role);
          return waiting.onYou ? (
            <span className="inline-flex items-center gap-1 font-bold text-ink">
              <svg className="size-2.5" viewBox="0 0 10 10" aria-hidden="true">
                <path d="M1 1 L9 5 L1 9 Z" fill="currentColor" />
              </svg>
              {waiting.text}
            </span>
          ) : (
            <span className="text-ink-soft">{waiting.text}</span>
          );
        },
      }),
      column.accessor('updatedAt', {
        id: 'updatedAt',
        header: 'Updated',
        cell: (info) => (
          <span className="whitespace-nowrap tabular text-ink-soft">{formatDate(info.getValue())}</span>
        ),
      }),
    ],
    [role, variant, engineerCell],
  );

  const visibleIds = selectable ? ['select', ...COLUMNS_BY_VARIANT[variant]] : COLUMNS_BY_VARIANT[variant];
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
  const current = Math.min(activeIndex, Math.max(rows.length - 1, 0));

  function moveTo(index: number) {
    const bounded = Math.max(0, Math.min(rows.length - 1, index));
    setActiveIndex(bounded);
    rowRefs.current[bounded]?.focus();
  }

  function onRowKeyDown(event: KeyboardEvent<HTMLTableRowElement>, index: number, id: string) {
    if (event.altKey || event.ctrlKey || event.metaKey) return;
    // Keys typed into a control inside the row (the engineer picker) belong to that control.
    if (event.target !== event.currentTarget) return;
    switch (event.key) {
      case 'x':
        if (!selectable) return;
        event.preventDefault();
        rows[index]?.toggleSelected();
        anchorRef.current = index;
        break;
      case 'j':
      case 'ArrowDown':
        event.preventDefault();
        moveTo(index + 1);
        break;
      case 'k':
      case 'ArrowUp':
        event.preventDefault();
        moveTo(index - 1);
        break;
      case 'Home':
        event.preventDefault();
        moveTo(0);
        break;
      case 'End':
        event.preventDefault();
        moveTo(rows.length - 1);
        break;
      case 'Enter':
        event.preventDefault();
        navigate(`/packages/${id}`);
        break;
    }
  }

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
                const ariaSort = sortField
                  ? sort === sortField
                    ? 'ascending'
                    : sort === `-${sortField}`
                      ? 'descending'
                      : 'none'
                  : undefined;
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={ariaSort}
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
              ref={(element) => {
                rowRefs.current[index] = element;
              }}
              tabIndex={index === current ? 0 : -1}
              onFocus={() => setActiveIndex(index)}
              onKeyDown={(event) => onRowKeyDown(event, index, row.original.id)}
              onClick={() => navigate(`/packages/${row.original.id}`)}
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
