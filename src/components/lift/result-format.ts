// Values of a check in the reader's unit system: 3 significant figures, and a percentage
// of a limit as "82% of 16.0 t" rather than a bare ratio.
import { formatFormula, formatPercent, formatPercentOf, formatQuantity } from '@shared/engineering/format';
import type { CheckItem, LiftResult, UnitSystem } from '@shared/engineering/types';

export function formatCheckValue(
  item: Pick<CheckItem, 'value' | 'unit'> & { id: string },
  result: LiftResult,
  system: UnitSystem,
): string {
  if (item.value === null) return '—';
  // Why the lift is critical: the reasons, not how many there are.
  if (item.id === 'critical-triggers') {
    const reasons = (result.checks.find((c) => c.id === 'critical-triggers')?.items ?? [])
      .filter((i) => i.id !== 'critical-triggers.none')
      .map((i) => formatFormula(i.formula, system));
    return reasons.length ? reasons.join(' · ') : 'No trigger applies';
  }
  if (item.id === 'critical-triggers.none') return 'None';
  if (item.id.startsWith('critical-triggers.')) return 'Applies';
  if (item.unit === 'percent' && item.id.startsWith('capacity') && result.figures.chartCapacity !== null) {
    return formatPercentOf(item.value, result.figures.chartCapacity, 'weight', system);
  }
  if (item.unit === 'percent') return formatPercent(item.value);
  return formatQuantity(item.value, item.unit, system);
}

export function formatCheckLimit(
  item: Pick<CheckItem, 'limit' | 'limitType' | 'unit'>,
  system: UnitSystem,
): string {
  if (item.limit === null) return '—';
  const text =
    item.unit === 'percent' ? formatPercent(item.limit) : formatQuantity(item.limit, item.unit, system);
  if (item.limitType === 'max') return `≤ ${text}`;
  if (item.limitType === 'min') return `≥ ${text}`;
  return text;
}

export const SOURCE_KIND_LABELS: Record<string, string> = {
  standard: 'Standard',
  site_policy: 'Site policy',
  common_practice: 'Common practice',
  from_memory: 'Reference value',
  input: 'Your input',
  computed: 'Computed',
};
