import type { ParseError, ParseErrorCode } from '../../schemas/analysis';

/** Past this many errors a file is clearly of another shape; listing thousands of cells would not help the tester. */
export const parseErrorLimit = 50;

/** Collects parse errors up to the limit, then one 'too-many-errors' entry. */
export class ParseErrorList {
  readonly errors: ParseError[] = [];
  private overflow = 0;

  add(row: number | null, column: string | null, code: ParseErrorCode, message: string): void {
    if (this.errors.length < parseErrorLimit) this.errors.push({ row, column, code, message });
    else this.overflow++;
  }

  get isEmpty(): boolean {
    return this.errors.length === 0;
  }

  list(): ParseError[] {
    if (this.overflow === 0) return this.errors;
    return [
      ...this.errors,
      {
        row: null,
        column: null,
        code: 'too-many-errors',
        message: `${this.overflow} more error(s) not listed; fix the ones above first.`,
      },
    ];
  }
}

export function cellLabel(row: number | null, column: string | null): string {
  if (row !== null && column !== null) return `Row ${row}, column "${column}"`;
  if (row !== null) return `Row ${row}`;
  if (column !== null) return `Column "${column}"`;
  return 'The file';
}
