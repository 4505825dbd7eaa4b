export type FieldChanges = Record<string, { from: unknown; to: unknown }>;

/** The fields a change sets to a new value, each with its value before and after, for the audit log. */
export function fieldChanges<T extends object>(before: T, after: Partial<T>, keys: readonly (keyof T & string)[]) {
  const changes: FieldChanges = {};
  for (const key of keys) {
    const value = after[key];
    if (value !== undefined && value !== before[key]) changes[key] = { from: before[key], to: value };
  }
  return changes;
}
