// The package table's columns: which each variant shows, and each cell. The selection column
// ticks a row, or with shift every row from the last one ticked by hand.
import { useMemo, type MouseEvent, type ReactNode, type RefObject } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import type { Role } from '@shared/schemas/common';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageSummary } from '@shared/schemas/packages';
import { StatusBadge } from '@/components/ui/status-badge';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { DateWithUrgency } from '@/components/ui/date-with-urgency';
import { formatDate, plural } from '@/lib/format';
import { waitingOn } from '../lib/waiting-on';

export type PackageTableVariant = 'desk' | 'queue' | 'assigned';

const COLUMNS_BY_VARIANT: Record<PackageTableVariant, string[]> = {
  desk: ['reference', 'package', 'site', 'plannedLiftDate', 'revision', 'status', 'waitingOn'],
  queue: [
    'reference',
    'package',
    'contractor',
    'plannedLiftDate',
    'reviewDue',
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
    'reviewDue',
    'revision',
    'check',
    'status',
    'waitingOn',
  ],
};

export function visibleColumns(variant: PackageTableVariant, selectable: boolean): string[] {
  return selectable ? ['select', ...COLUMNS_BY_VARIANT[variant]] : COLUMNS_BY_VARIANT[variant];
}

const column = createColumnHelper<PackageSummary>();

export function usePackageColumns({
  role,
  variant,
  engineerCell,
  anchorRef,
}: {
  role: Role;
  variant: PackageTableVariant;
  engineerCell?: (pkg: PackageSummary) => ReactNode;
  /** The row last ticked by hand, shared with the row keys ("x" ticks too). */
  anchorRef: RefObject<number | null>;
}) {
  return useMemo(
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
      column.accessor('reviewDueOn', {
        id: 'reviewDue',
        header: 'Review due',
        cell: (info) => {
          const pkg = info.row.original;
          if (!pkg.reviewDueOn) return <span className="text-ink-soft">Not submitted</span>;
          return (
            <span className="flex flex-col tabular">
              <time dateTime={pkg.reviewDueOn} className="whitespace-nowrap">
                {formatDate(pkg.reviewDueOn)}
              </time>
              {pkg.reviewOverdue && (
                <span className="whitespace-nowrap text-[12.5px] font-bold text-late">
                  <span aria-hidden="true">▲ </span>Overdue
                </span>
              )}
            </span>
          );
        },
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
    [role, variant, engineerCell, anchorRef],
  );
}
