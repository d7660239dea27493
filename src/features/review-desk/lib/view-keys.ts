// The URL parameters a saved view keeps: every filter and the sort, not the page.
export const NARROWING_KEYS = [
  'status',
  'siteId',
  'contractorId',
  'engineerId',
  'critical',
  'discrepancies',
  'liftWithinDays',
  'revisionMin',
  'q',
  'sort',
  'pageSize',
] as const;
