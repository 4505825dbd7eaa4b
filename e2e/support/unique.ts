import { randomBytes } from 'node:crypto';

/** A suffix no other test run uses, so specs never depend on each other's data. */
export function uniqueSuffix() {
  return `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;
}

export function uniqueEmail(label: string) {
  return `e2e-${label}-${uniqueSuffix()}@soaksheet.example`;
}
