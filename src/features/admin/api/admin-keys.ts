// Query keys for the desk administration pages, general to specific. Every admin list
// sits under ['admin'], so signing out (which clears the cache) or a broad invalidation
// reaches them all.
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
