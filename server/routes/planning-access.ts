import type { Access } from '../api-registry';

// Who may do what in roundup planning (issue 4). Admins manage accounts and are not part of planning; they
// see the overview dashboard only.

/** Read the catalog, roundups, plans and matrices. */
export const planningReaders: Access = ['editor', 'writer', 'tester'];
/** Edit catalog products and prices, and import. */
export const catalogEditors: Access = ['editor', 'tester'];
/** Plan roundups: create, edit, add products, assign, accept, manage benches and test plans. */
export const planEditors: Access = ['editor'];
/** Work at the bench: sample records, cell moves (the service decides which move each role may make). */
export const benchWorkers: Access = ['editor', 'tester'];
/** Book bench time against assigned cells. */
export const bookers: Access = ['tester'];
