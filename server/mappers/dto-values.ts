// The driver returns DECIMAL as strings and TINYINT(1) as numbers; DTOs send plain JSON numbers and booleans.

export function decimalToNumber(value: string | number): number {
  return typeof value === 'number' ? value : Number(value);
}

export function decimalOrNull(value: string | number | null | undefined): number | null {
  return value == null ? null : decimalToNumber(value);
}

export function booleanOrNull(value: boolean | number | null | undefined): boolean | null {
  return value == null ? null : Boolean(value);
}

export function isoOrNull(value: Date | null | undefined): string | null {
  return value ? value.toISOString() : null;
}

/** Escapes LIKE wildcards so a search for "50%" matches the text, not a pattern. */
export function likeContains(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
