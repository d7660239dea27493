// The words for a check's outcome, declared once: the screens' label and the paper's short
// upper-case word (the stamped return and calculation sheet), and the words for how a contractor's
// stated figure compares with the recomputation.
import type { CheckStatus } from '@shared/engineering/types';

export const CHECK_STATUS_LABELS: Record<CheckStatus, string> = {
  pass: 'Pass',
  caution: 'Caution',
  fail: 'Fail',
  not_applicable: 'Not applicable',
};

/** On paper, where a column is narrow. */
export const CHECK_STATUS_WORDS: Record<CheckStatus, string> = {
  pass: 'PASS',
  caution: 'CAUTION',
  fail: 'FAIL',
  not_applicable: 'N/A',
};

export const DISCREPANCY_WORDS = {
  agrees: 'AGREES',
  discrepancy: 'DIFFERS',
  cannot_compare: 'NOT COMPARED',
} as const;
