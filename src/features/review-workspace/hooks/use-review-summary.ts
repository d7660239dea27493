// What the workspace's panels and tab labels derive from the package, its findings and the
// checks: labels for what a finding is tied to, findings per check, the order n / p steps
// through, the counts of what is still open and what stands against an acceptance.
import { useMemo } from 'react';
import type { LiftResult } from '@shared/engineering/types';
import type { PackageDetail } from '@shared/schemas/packages';
import type { Finding } from '@shared/schemas/reviews';
import { decisionBlockers } from '@shared/rules/decision-gate';
import { acceptedFigures, figureCheckId } from '../lib/accepted-figures';

export function useReviewSummary(detail: PackageDetail, result: LiftResult | null, findings: Finding[]) {
  const revision = detail.current.number;
  const files = detail.current.files;
  const accepted = useMemo(() => acceptedFigures(detail), [detail]);
  const fileNames = useMemo(() => new Map(files.map((f) => [f.id, f.originalName])), [files]);
  const checkLabels = useMemo(() => {
    const labels = new Map<string, string>();
    for (const c of result?.checks ?? []) labels.set(c.id, c.label);
    for (const d of result?.discrepancies ?? [])
      labels.set(figureCheckId(d.figure), `Stated figure: ${d.label}`);
    return labels;
  }, [result]);
  const findingsByCheck = useMemo(() => {
    const counts = new Map<string, number>();
    for (const f of findings)
      if (f.checkId && f.revisionNumber === revision) counts.set(f.checkId, (counts.get(f.checkId) ?? 0) + 1);
    return counts;
  }, [findings, revision]);
  // This revision's findings first, then those carried from earlier ones, as the list shows them.
  const ordered = useMemo(
    () => [
      ...findings.filter((f) => f.revisionNumber === revision),
      ...findings.filter((f) => f.revisionNumber < revision),
    ],
    [findings, revision],
  );
  const openFindings = findings.filter((f) => f.state !== 'closed').length;
  const openDiscrepancies =
    result?.discrepancies.filter((d) => d.status === 'discrepancy' && !accepted.has(d.figure)).length ?? 0;

  // What stands against an acceptance, as the server's gate finds it (the figures accepted on this
  // revision from the revision itself and from its history).
  const storedAccepted = detail.current.acceptedFigures;
  const blockers = useMemo(
    () =>
      decisionBlockers({
        result,
        findings,
        acceptedFigures: [...storedAccepted.map((a) => a.figure), ...accepted.keys()],
      }),
    [result, findings, storedAccepted, accepted],
  );

  return {
    accepted,
    fileNames,
    checkLabels,
    findingsByCheck,
    ordered,
    openFindings,
    openDiscrepancies,
    blockers,
  };
}
