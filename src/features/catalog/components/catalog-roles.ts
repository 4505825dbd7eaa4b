import type { Role } from '../../../../shared/schemas/common';

// Mirrors server/routes/planning-access.ts; the server checks again on every request.

/** Add and edit products and prices, archive, import: editors and bench testers. */
export function canEditCatalog(role: Role): boolean {
  return role === 'editor' || role === 'tester';
}

/** Delete products and price entries: editors. */
export function canDeleteFromCatalog(role: Role): boolean {
  return role === 'editor';
}
