// The recomputed checks as a table, worst first: check, value, limit, status (word and
// shape), the formula in words with the numbers used, and where the limit comes from.
// Sub-checks open under their check.
import { Fragment, useState } from 'react';
import { formatFormula } from '@shared/engineering/format';
import type { CheckItem, CheckResult, LiftResult, UnitSystem } from '@shared/engineering/types';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { sortChecks } from './result-order';
import { formatCheckLimit, formatCheckValue, SOURCE_KIND_LABELS } from './result-format';

function Row({
  item,
  id,
  result,
  system,
  sub,
  toggle,
}: {
  item: CheckItem | CheckResult;
  id: string;
  result: LiftResult;
  system: UnitSystem;
  sub?: boolean;
  toggle?: React.ReactNode;
}) {
  return (
    <tr
      className={`border-b border-rule align-top ${sub ? 'bg-sheet-alt text-[12.5px]' : ''}`}
      data-testid={sub ? undefined : 'check-row'}
    >
      <th
        scope="row"
        className={`min-w-[12rem] px-2 py-1.5 text-left ${sub ? 'pl-7 font-normal' : 'font-bold'}`}
      >
        {item.label}
        {item.message && (
          <p className="mt-0.5 max-w-[34rem] text-[12px] font-normal leading-snug text-ink-soft">
            {item.message}
          </p>
        )}
        {toggle}
      </th>
      <td
        className={`px-2 py-1.5 tabular ${id === 'critical-triggers' ? 'min-w-[12rem] text-left' : 'whitespace-nowrap text-right'}`}
      >
        {formatCheckValue({ ...item, id }, result, system)}
      </td>
      <td className="whitespace-nowrap px-2 py-1.5 text-right tabular">{formatCheckLimit(item, system)}</td>
      <td className="px-2 py-1.5">
        <CheckStatusMark status={item.status} />
      </td>
      <td className="min-w-[14rem] px-2 py-1.5 text-[12.5px] leading-snug">
        {formatFormula(item.formula, system) || '—'}
      </td>
      <td className="min-w-[10rem] px-2 py-1.5 text-[12px] leading-snug">
        <span className="font-bold">{SOURCE_KIND_LABELS[item.source.kind] ?? item.source.kind}</span>
        <span className="block text-ink-soft">{item.source.text}</span>
      </td>
    </tr>
  );
}

export function CheckResultsTable({ result, system }: { result: LiftResult; system: UnitSystem }) {
  const [open, setOpen] = useState<Record<string, boolean>>({});
  const checks = sortChecks(result.checks);
  return (
    <div className="overflow-x-auto border border-rule bg-sheet">
      <table className="w-full border-collapse text-[13px]">
        <caption className="sr-only">Recomputed checks, failures and cautions first</caption>
        <thead className="bg-sheet-alt text-left text-[12px] uppercase tracking-[0.05em] text-ink-soft">
          <tr className="border-b-2 border-rule-strong">
            <th scope="col" className="px-2 py-1.5">
              Check
            </th>
            <th scope="col" className="px-2 py-1.5 text-right">
              Value
            </th>
            <th scope="col" className="px-2 py-1.5 text-right">
              Limit
            </th>
            <th scope="col" className="px-2 py-1.5">
              Status
            </th>
            <th scope="col" className="px-2 py-1.5">
              Formula
            </th>
            <th scope="col" className="px-2 py-1.5">
              Limit from
            </th>
          </tr>
        </thead>
        <tbody>
          {checks.map((check) => {
            const subs = check.items.length > 1 ? check.items : [];
            const expanded = open[check.id] ?? check.status === 'fail';
            return (
              <Fragment key={check.id}>
                <Row
                  item={check}
                  id={check.id}
                  result={result}
                  system={system}
                  toggle={
                    subs.length > 0 && (
                      <button
                        type="button"
                        aria-expanded={expanded}
                        onClick={() => setOpen((current) => ({ ...current, [check.id]: !expanded }))}
                        className="mt-0.5 block text-[12px] font-bold text-verdigris underline underline-offset-2"
                      >
                        {expanded ? 'Hide' : 'Show'} {subs.length} parts
                      </button>
                    )
                  }
                />
                {expanded &&
                  subs.map((item) => (
                    <Row key={item.id} item={item} id={item.id} result={result} system={system} sub />
                  ))}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
