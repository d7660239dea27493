// Worst first: the order every list of checks and stated figures is shown in.
import type { CheckResult, CheckStatus, Discrepancy } from '@shared/engineering/types';

const RANK: Record<CheckStatus, number> = { fail: 0, caution: 1, pass: 2, not_applicable: 3 };

export function sortChecks(checks: readonly CheckResult[]): CheckResult[] {
  return checks
    .map((check, index) => ({ check, index }))
    .sort((a, b) => RANK[a.check.status] - RANK[b.check.status] || a.index - b.index)
    .map(({ check }) => check);
}

const DISCREPANCY_RANK: Record<Discrepancy['status'], number> = {
  discrepancy: 0,
  cannot_compare: 1,
  agrees: 2,
};

export function sortDiscrepancies(items: readonly Discrepancy[]): Discrepancy[] {
  return [...items].sort(
    (a, b) =>
      DISCREPANCY_RANK[a.status] - DISCREPANCY_RANK[b.status] ||
      Number(b.unsafeSide) - Number(a.unsafeSide) ||
      (b.differencePct ?? 0) - (a.differencePct ?? 0),
  );
}

export function countByStatus(checks: readonly CheckResult[]): Record<CheckStatus, number> {
  const counts: Record<CheckStatus, number> = { fail: 0, caution: 0, pass: 0, not_applicable: 0 };
  for (const check of checks) counts[check.status] += 1;
  return counts;
}
