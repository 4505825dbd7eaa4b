/**
 * CSV for download (RFC 4180: CRLF line ends; fields with a comma, quote or line break in double quotes, quotes
 * doubled), safe to open in a spreadsheet: a text cell that starts with =, +, -, @, tab or carriage return, or has
 * such a character right after a ; or tab inside it, gets a leading or inserted apostrophe so it is never run as a
 * formula (OWASP "CSV Injection"). Numbers are written as numbers: a negative reading stays a number.
 */
export type CsvCell = string | number | boolean | null | undefined;

const formulaStart = /^[=+\-@\t\r]/;

export function safeCsvText(text: string): string {
  const guarded = text.replace(/([;\t])([=+\-@])/g, "$1'$2");
  return formulaStart.test(guarded) ? `'${guarded}` : guarded;
}

function field(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  const text =
    typeof cell === 'number'
      ? Number.isFinite(cell)
        ? String(cell)
        : ''
      : typeof cell === 'boolean'
        ? cell
          ? 'yes'
          : 'no'
        : safeCsvText(cell);
  return /[",\r\n]/.test(text) || text.startsWith("'") ? `"${text.replace(/"/g, '""')}"` : text;
}

export function formatCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return (
    [header.map((h) => field(h)), ...rows.map((row) => row.map(field))].map((r) => r.join(',')).join('\r\n') + '\r\n'
  );
}
