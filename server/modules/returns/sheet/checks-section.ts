// Section 2 of the calculation sheet: every check recomputed from the inputs, with its value,
// limit, outcome (word and shape), the source of the limit and the formula in words.
import { formatFormula, formatQuantity } from '@shared/engineering/format';
import { sourceText } from '@shared/engineering/sources';
import type { CheckItem, CheckStatus, LiftResult, UnitSystem } from '@shared/engineering/types';
import { CHECK_STATUS_WORDS } from '@shared/vocabulary/check-statuses';
import type { StatusKey } from '../text-pdf';
import { table, WIDTH, type Col, type Flow, type Row } from './layout';

function limitText(item: Pick<CheckItem, 'limit' | 'limitType' | 'unit'>, units: UnitSystem): string {
  if (item.limit === null) return '—';
  const v = formatQuantity(item.limit, item.unit, units);
  return item.limitType === 'max' ? `max ${v}` : item.limitType === 'min' ? `min ${v}` : v;
}

const statusKey = (s: CheckStatus): StatusKey => s;

export function checksSection(flow: Flow, result: LiftResult, units: UnitSystem) {
  const cols: Col[] = [
    { title: 'Status', width: 60 },
    { title: 'Check', width: 146 },
    { title: 'Value', width: 62 },
    { title: 'Limit', width: 66 },
    { title: 'Source of the limit', width: WIDTH - 334 },
  ];
  const rows: Row[] = [];
  result.checks.forEach((c, ci) => {
    const shade = ci % 2 === 1;
    const single = c.items.length <= 1;
    rows.push({
      cells: [
        { text: CHECK_STATUS_WORDS[statusKey(c.status)], status: statusKey(c.status), bold: true },
        { text: c.label, bold: true },
        { text: c.value === null ? '—' : formatQuantity(c.value, c.unit, units), bold: true },
        { text: limitText(c, units), bold: true },
        { text: sourceText(c.source, units), soft: true },
      ],
      note: {
        text: single ? [c.message, formatFormula(c.formula, units)].filter(Boolean).join(' — ') : c.message,
        from: 1,
      },
      shade,
    });
    if (!single)
      for (const it of c.items)
        rows.push({
          cells: [
            { text: CHECK_STATUS_WORDS[statusKey(it.status)], status: statusKey(it.status) },
            { text: it.label },
            { text: it.value === null ? '—' : formatQuantity(it.value, it.unit, units) },
            { text: limitText(it, units) },
            { text: it.source.text === c.source.text ? '' : sourceText(it.source, units), soft: true },
          ],
          note: { text: formatFormula(it.formula, units), from: 1 },
          indent: 8,
          shade,
        });
  });
  table(flow, cols, rows);
}
