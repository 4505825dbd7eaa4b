import type { Access } from '../api-registry';

// Who may do what in roundup planning (issue 4). Admins manage accounts; in planning they read everything and
// change nothing.

/** Read the catalog, roundups, plans, matrices, benches and their calendars. */
export const planningReaders: Access = ['admin', 'editor', 'writer', 'tester'];
/** Edit catalog products and prices, and import. */
export const catalogEditors: Access = ['editor', 'tester'];
/** Plan roundups: create, edit, add products, assign, accept, manage benches and test plans. */
export const planEditors: Access = ['editor'];
/** Work at the bench: sample records, cell moves (the service decides which move each role may make). */
export const benchWorkers: Access = ['editor', 'tester'];
/** Book bench time against assigned cells. */
export const bookers: Access = ['tester'];
