import { paths } from '../lib/paths';
import { may, placeAccess } from '../../shared/access/roles';
import type { Role } from '../../shared/schemas/common';

export interface NavigationEntry {
  to: string;
  label: string;
  /** Who sees the entry and may open the page: shared/access/roles.ts, which the server checks on every request. */
  roles: readonly Role[];
  /** One line for the dashboard's list of places. */
  description: string;
  /** Match the path exactly (for "/"). */
  end?: boolean;
}

/**
 * The side navigation, in order. A new page adds one line here (and its route in router.tsx); Benchwire's names
 * for the places to come are Catalog, Roundups, Matrix, My bench, Samples and Benches.
 */
export const navigation: readonly NavigationEntry[] = [
  {
    to: paths.dashboard,
    label: 'Dashboard',
    roles: placeAccess.dashboard,
    end: true,
    description: 'Where you start: what your role does and where to go next.',
  },
  {
    to: paths.catalog,
    label: 'Catalog',
    roles: placeAccess.catalog,
    description: 'Boards with their power design, features and prices; CSV import and export.',
  },
  {
    to: paths.roundups,
    label: 'Roundups',
    roles: placeAccess.roundups,
    description: 'Roundups from Planning to Live: products, test matrix, samples and the test plan.',
  },
  {
    to: paths.myBench,
    label: 'My bench',
    roles: placeAccess.myBench,
    description: 'Your assigned cells by due date, your bench bookings, and booking a bench.',
  },
  {
    to: paths.benches,
    label: 'Benches',
    roles: placeAccess.benches,
    description: 'The lab’s test systems, the week’s bookings, and booking a slot; with the bench safety notes.',
  },
  {
    to: paths.users,
    label: 'Users',
    roles: placeAccess.users,
    description: 'Staff accounts: add colleagues, set roles, deactivate accounts, reset passwords.',
  },
  {
    to: paths.logCheck,
    label: 'Log check',
    roles: placeAccess.logCheck,
    description: 'Upload a logger file from a soak: check how it reads, map the columns, get the figures and verdict.',
  },
  {
    to: paths.subscribers,
    label: 'Subscribers',
    roles: placeAccess.subscribers,
    description: 'Readers who asked for mail, the subjects they choose from, and each roundup’s mailings.',
  },
  {
    to: paths.devInbox,
    label: 'Dev inbox',
    roles: placeAccess.devInbox,
    description: 'Every message the local mail relay received, as a reader would see it (development only).',
  },
  {
    to: paths.account,
    label: 'Account',
    roles: placeAccess.account,
    description: 'Your details, your password and the devices you are signed in on.',
  },
];

export function navigationFor(role: Role): NavigationEntry[] {
  return navigation.filter((entry) => may(role, entry.roles));
}

/** Whether a role may open a page; pages without a navigation entry are open to every signed-in role. */
export function canOpen(path: string, role: Role): boolean {
  const entry = navigation.find((candidate) => candidate.to === path);
  return entry ? may(role, entry.roles) : true;
}
