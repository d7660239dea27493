// The URL parameters a saved view keeps: every filter and the sort, not the page.
import { NARROWING_FILTERS } from '@/lib/query-keys';

export const NARROWING_KEYS = [...NARROWING_FILTERS, 'sort', 'pageSize'] as const;
