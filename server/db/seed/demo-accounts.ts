// The demo scenario's people (invented). Printed by the start command and listed in the README.
import type { Role } from '@shared/schemas/common';

export const DEMO_PASSWORD = 'lift-desk-demo';

export interface DemoAccount {
  email: string;
  name: string;
  role: Role;
  organisation: string;
  what: string;
}

export const DEMO_ACCOUNTS: DemoAccount[] = [
  {
    email: 'lena.brisk@brackwater-lifting.example',
    name: 'Lena Brisk',
    role: 'contractor',
    organisation: 'Brackwater Lifting Ltd',
    what: 'lift planner, submits packages',
  },
  {
    email: 'tomas.hale@selsdon-hale.example',
    name: 'Tomas Hale',
    role: 'contractor',
    organisation: 'Selsdon & Hale Crane Hire',
    what: 'rigging supervisor at the second contractor',
  },
  {
    email: 'rhea.okafor@tamsin-ridge.example',
    name: 'Rhea Okafor',
    role: 'reviewer',
    organisation: 'Tamsin Ridge Energy',
    what: 'lift coordinator, runs the queue for both sites',
  },
  {
    email: 'dev.marsh@tamsin-ridge.example',
    name: 'Dev Marsh, PE',
    role: 'engineer',
    organisation: 'Tamsin Ridge Energy',
    what: 'engineer of record',
  },
  {
    email: 'ines.varga@tamsin-ridge.example',
    name: 'Ines Varga, PE',
    role: 'engineer',
    organisation: 'Tamsin Ridge Energy',
    what: 'second engineer of record',
  },
  {
    email: 'admin@tamsin-ridge.example',
    name: 'Paul Anand',
    role: 'admin',
    organisation: 'Tamsin Ridge Energy',
    what: 'runs the desk: people, sites, policies',
  },
];
