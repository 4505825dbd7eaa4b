import { roles, type Role } from '../schemas/common';

// Who may do what, in one place. The server's routes declare these lists as their access and check them on every
// request; the client's navigation and page guards read the same lists to show only what a role may use.
// Admins manage accounts; in planning they read everything and change nothing.

/** Every staff role: the dashboard and your own account. */
export const staff: readonly Role[] = roles;
/** Manage staff accounts: add colleagues, change roles, deactivate, reset passwords. */
export const accountManagers: readonly Role[] = ['admin'];
/** Read the catalog, roundups, plans, matrices, benches and their calendars. */
export const planningReaders: readonly Role[] = ['admin', 'editor', 'writer', 'tester'];
/** Edit catalog products and prices, and import. */
export const catalogEditors: readonly Role[] = ['editor', 'tester'];
/** Plan roundups (create, edit, add products, assign, accept), manage benches and test plans, delete from the catalog. */
export const planEditors: readonly Role[] = ['editor'];
/** Work at the bench: sample records, cell moves (the matrix rules decide which move each role may make). */
export const benchWorkers: readonly Role[] = ['editor', 'tester'];
/** Book bench time against assigned cells; keep a queue on My bench. */
export const bookers: readonly Role[] = ['tester'];
/** Check a logger file from a soak. */
export const logCheckers: readonly Role[] = ['tester', 'editor'];

/** Write and revise a roundup's write-up, ask for its review, and comment on its sections. */
export const writeUpWriters: readonly Role[] = ['editor', 'writer'];
/** Sign off write-up sections, or hand them back to the writer. */
export const writeUpApprovers: readonly Role[] = ['editor'];
/** Decide the editorial verdicts, approve charts and leave matrix cells out of a roundup. */
export const editorialDeciders: readonly Role[] = ['editor'];
/** Send a roundup from Writing to In review. */
export const reviewRequesters: readonly Role[] = ['editor', 'writer'];
/** The open-data settings readers see: raw logger files offered or not, and the outlet's licence line. */
export const openDataSettingsEditors: readonly Role[] = ['editor', 'admin'];

/**
 * Runs are one tester's work: a tester reads the runs of cells assigned to them (and those they recorded, which the
 * server also knows); editors, writers and admins read every cell's runs.
 */
export function mayReadCellRuns(viewer: { id: number; role: Role }, cellTesterId: number | null): boolean {
  return viewer.role !== 'tester' || cellTesterId === viewer.id;
}

/** Whether a role is among those a rule names. */
export function may(role: Role, rule: readonly Role[]): boolean {
  return rule.includes(role);
}

/** The places in the staff app's navigation, and who may open each. */
export const placeAccess = {
  dashboard: staff,
  catalog: planningReaders,
  roundups: planningReaders,
  myBench: bookers,
  benches: planningReaders,
  users: accountManagers,
  logCheck: logCheckers,
  account: staff,
  devInbox: accountManagers,
  subscribers: planningReaders,
} as const satisfies Record<string, readonly Role[]>;

export type Place = keyof typeof placeAccess;
