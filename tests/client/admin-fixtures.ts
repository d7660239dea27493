// Small admin payloads for the client tests of the desk administration pages.
import type { Person } from '@shared/schemas/admin';

export const OWNER_ORG = {
  id: '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
  name: 'Saltmarsh Utilities',
  kind: 'owner' as const,
};
export const CONTRACTOR_ORG = {
  id: '6b2c3d4e-5f6a-4b7c-9d8e-0f1a2b3c4d5e',
  name: 'Fenwick Lifting Ltd',
  kind: 'contractor' as const,
};

export const organisationsReply = {
  status: 200,
  body: {
    items: [
      { ...OWNER_ORG, people: 4 },
      { ...CONTRACTOR_ORG, people: 2 },
    ],
  },
};

export function makePerson(index: number, overrides: Partial<Person> = {}): Person {
  const n = String(index).padStart(2, '0');
  return {
    id: `7c3d4e5f-6a7b-4c8d-8e9f-1a2b3c4d5e${n}`,
    email: `person${n}@saltmarsh.example`,
    name: `Person ${index}`,
    role: 'engineer',
    organisation: OWNER_ORG,
    active: true,
    state: 'active',
    createdAt: '2030-01-10T09:00:00.000Z',
    ...overrides,
  };
}

export const SITE_ID = '8d4e5f6a-7b8c-4d9e-9f0a-2b3c4d5e6f7a';
export const adminSite = {
  id: SITE_ID,
  name: 'North Yard',
  code: 'NYD',
  address: '1 Quay Road',
  timeZone: 'Europe/London',
  unitSystem: null,
  reviewTurnaroundDays: 5,
  reviewMarginDays: 2,
  policyVersion: 3,
  reviewers: [],
};

export function bodyOf(init: RequestInit | undefined): unknown {
  return JSON.parse(String(init?.body));
}
