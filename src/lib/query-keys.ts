// Every TanStack Query key factory of the client, in one place. Keys run from general to
// specific and include every input, so invalidating a factory's `all` (or a package's detail
// key) reaches everything under it. Features import their keys from here, never from each other.
import type { PackageListQuery } from '@shared/schemas/packages';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** Every input of a package list request; the whole object is part of the query key. */
export type PackageListFilters = Pick<
  PackageListQuery,
  | 'status'
  | 'siteId'
  | 'contractorId'
  | 'engineerId'
  | 'critical'
  | 'discrepancies'
  | 'liftWithinDays'
  | 'revisionMin'
  | 'q'
  | 'sort'
  | 'cursor'
  | 'page'
  | 'pageSize'
>;

/** The filters that narrow the list (not the sort or the page): any of them on means "filtered". */
export const NARROWING_FILTERS = [
  'status',
  'siteId',
  'contractorId',
  'engineerId',
  'critical',
  'discrepancies',
  'liftWithinDays',
  'revisionMin',
  'q',
] as const satisfies readonly (keyof PackageListFilters)[];

export const packageKeys = {
  all: ['packages'] as const,
  lists: () => [...packageKeys.all, 'list'] as const,
  list: (filters: PackageListFilters) => [...packageKeys.lists(), filters] as const,
  details: () => [...packageKeys.all, 'detail'] as const,
  detail: (id: string) => [...packageKeys.details(), id] as const,
  // Under the package's detail key, so refreshing a package refreshes these too: its returns,
  // findings (one list read by the workspace and the contractor's page), markups and the
  // revision difference.
  returns: (id: string) => [...packageKeys.detail(id), 'returns'] as const,
  findings: (id: string) => [...packageKeys.detail(id), 'findings'] as const,
  markups: (id: string) => [...packageKeys.detail(id), 'markups'] as const,
  assignments: (id: string) => [...packageKeys.detail(id), 'assignments'] as const,
  /** Where the stamp block lands on page 1 (it moves when a markup takes its corner). */
  stampPlacement: (id: string) => [...packageKeys.detail(id), 'stamp-placement'] as const,
  compare: (id: string, from: number, to: number) =>
    [...packageKeys.detail(id), 'compare', { from, to }] as const,
};

export const engineerKeys = {
  all: ['engineers'] as const,
};

export const organisationKeys = {
  all: ['organisations'] as const,
};

export const verifyKeys = {
  all: ['verify'] as const,
  code: (code: string) => [...verifyKeys.all, code] as const,
};

export const siteKeys = {
  all: ['sites'] as const,
};

export const healthKeys = {
  all: ['health'] as const,
};

export const profileKeys = {
  all: ['profile'] as const,
};

export const handOffKeys = {
  all: ['hand-offs'] as const,
};

export const inviteKeys = {
  all: ['invites'] as const,
  token: (token: string) => [...inviteKeys.all, token] as const,
};

// The desk administration pages: every admin list sits under ['admin'], so a broad
// invalidation reaches them all.
export type PeopleFilters = { organisationId?: string; role?: string; state?: string };
export type MailFilters = { status?: 'queued' | 'sent' | 'failed'; page: number };

export const adminKeys = {
  all: ['admin'] as const,
  organisations: () => [...adminKeys.all, 'organisations'] as const,
  sites: () => [...adminKeys.all, 'sites'] as const,
  policy: (siteId: string) => [...adminKeys.sites(), siteId, 'policy'] as const,
  people: () => [...adminKeys.all, 'people'] as const,
  peopleList: (filters: PeopleFilters) => [...adminKeys.people(), filters] as const,
  mail: () => [...adminKeys.all, 'mail'] as const,
  mailList: (filters: MailFilters) => [...adminKeys.mail(), 'list', filters] as const,
  caught: () => [...adminKeys.mail(), 'caught'] as const,
};

// The fleet library.
export type CraneFilters = {
  q?: string;
  radius?: number;
  radiusUnit?: string;
  capacity?: number;
  capacityUnit?: string;
};

export const libraryKeys = {
  all: ['library'] as const,
  cranes: (filters: CraneFilters) => [...libraryKeys.all, 'cranes', filters] as const,
  crane: (id: string) => [...libraryKeys.all, 'crane', id] as const,
  configuration: (id: string) => [...libraryKeys.all, 'configuration', id] as const,
  version: (id: string) => [...libraryKeys.all, 'version', id] as const,
  uses: (packageId: string) => [...libraryKeys.all, 'uses', packageId] as const,
};
