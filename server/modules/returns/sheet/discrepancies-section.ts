// Section 3 of the calculation sheet: each figure the contractor stated against the
// recomputation and how a difference was resolved, then the findings and their responses.
import { formatQuantity } from '@shared/engineering/format';
import { DISCREPANCY_WORDS } from '@shared/vocabulary/check-statuses';
import type { StampInput } from '../stamp-input';
import { findingLabel } from '../finding-marks';
import type { StatusKey } from '../text-pdf';
import { table, WIDTH, type Flow, type Row } from './layout';

export function discrepanciesSection(flow: Flow, input: StampInput) {
  const { result, units, acceptedFigures } = input.calculation;
  const list = result?.discrepancies ?? [];
  const accepted = new Map(acceptedFigures.map((a) => [a.figure, a]));
  if (list.length === 0 && acceptedFigures.length === 0) {
    flow.para('The contractor stated no figures to compare with the recomputation.');
    return;
  }
  const rows: Row[] = list.map((d) => {
    const acc = accepted.get(d.figure);
    accepted.delete(d.figure);
    const outcome: StatusKey =
      d.status === 'agrees'
        ? 'pass'
        : d.status === 'discrepancy'
          ? acc
            ? 'caution'
            : 'fail'
          : 'not_applicable';
    const resolution =
      d.status === 'agrees'
        ? `Agrees within the ${d.tolerancePct}% tolerance.`
        : acc
          ? `Accepted by ${acc.engineer}: ${acc.reason}`
          : d.status === 'discrepancy'
            ? `Not accepted${d.unsafeSide ? '; stated figure is on the unsafe side' : ''}. See the findings.`
            : d.message;
    return {
      cells: [
        { text: DISCREPANCY_WORDS[d.status], status: outcome, bold: true },
        { text: d.label, bold: true },
        { text: formatQuantity(d.stated, d.unit, units) },
        { text: d.computed === null ? '—' : formatQuantity(d.computed, d.unit, units) },
        { text: d.differencePct === null ? '—' : `${d.differencePct.toFixed(1)}% (tol. ${d.tolerancePct}%)` },
        { text: resolution },
      ],
    };
  });
  for (const a of accepted.values())
    rows.push({
      cells: [
        { text: 'ACCEPTED', status: 'caution', bold: true },
        { text: a.figure, bold: true },
        { text: '—' },
        { text: '—' },
        { text: '—' },
        { text: `Accepted by ${a.engineer}: ${a.reason}` },
      ],
    });
  table(
    flow,
    [
      { title: 'Outcome', width: 74 },
      { title: 'Figure', width: 92 },
      { title: 'Stated', width: 58 },
      { title: 'Recomputed', width: 58 },
      { title: 'Difference', width: 66 },
      { title: 'How it was resolved', width: WIDTH - 348 },
    ],
    rows,
  );
}

export function findingsSection(flow: Flow, input: StampInput) {
  const { findings, result } = input.calculation;
  if (findings.length === 0) {
    flow.para('No findings were raised on this revision.');
    return;
  }
  const labels = new Map((result?.checks ?? []).map((c) => [c.id as string, c.label]));
  table(
    flow,
    [
      { title: '#', width: 24 },
      { title: 'Severity / state', width: 80 },
      { title: 'Finding', width: 170 },
      { title: 'On', width: 100 },
      { title: 'Response', width: WIDTH - 374 },
    ],
    findings.map((f, i) => ({
      cells: [
        { text: f.label ?? findingLabel(i), bold: true },
        { text: `${f.severity.toUpperCase()} · ${f.state}`, bold: true },
        { text: f.text },
        {
          text:
            [
              f.markup ?? (f.pageNumber ? `page ${f.pageNumber}` : null),
              f.checkId ? (labels.get(f.checkId) ?? f.checkId) : null,
            ]
              .filter(Boolean)
              .join(', ') || '—',
          soft: true,
        },
        { text: f.response ?? 'No response yet.', soft: !f.response },
      ],
    })),
  );
}
