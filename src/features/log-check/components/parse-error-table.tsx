import { useMemo } from 'react';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { numericColumn, textColumn } from '../../../components/ui/data-table-columns';
import type { ParseError } from '../../../../shared/schemas/analysis';

export interface ParseErrorTableProps {
  errors: readonly ParseError[];
  /** The server's one-line summary. */
  message: string;
  /** Whether the file is being read for the first time or with the tester's mapping. */
  stage: 'reading' | 'analysing';
  /** Whether the table itself could be read, so a different mapping might help. */
  hasPreview: boolean;
}

interface NumberedError extends ParseError {
  id: number;
}

/** The 422 answer: every problem the server found, with the line of the file and the column it is in. */
export function ParseErrorTable({ errors, message, stage, hasPreview }: ParseErrorTableProps) {
  const rows = useMemo<NumberedError[]>(() => errors.map((error, id) => ({ ...error, id })), [errors]);
  const columns = useMemo<DataTableColumn<NumberedError>[]>(
    () => [
      numericColumn(
        'row',
        'Row',
        (error) => error.row,
        (row) => row ?? '—',
      ),
      textColumn('column', 'Column', (error) => error.column ?? '', {
        cell: (error) =>
          error.column ? (
            <span className="font-mono text-[0.8125rem] break-all">{error.column}</span>
          ) : (
            <span className="text-muted">—</span>
          ),
      }),
      {
        id: 'message',
        header: 'What is wrong',
        filterValue: (error) => error.message,
        cell: (error) => <span className="block min-w-64">{error.message}</span>,
      },
    ],
    [],
  );

  return (
    <div className="rounded-[3px] border border-l-4 border-rule border-l-red bg-surface px-4 py-3">
      {/* Only the summary is announced; the table is there to read at the tester's pace. */}
      <div role="alert" className="mb-3">
        <p className="font-semibold text-ink">
          {stage === 'analysing'
            ? 'The file could not be analysed with your mapping'
            : hasPreview
              ? 'The file could not be read with the guessed mapping'
              : 'The file could not be read'}
        </p>
        <p className="mt-0.5 text-sm text-ink">
          {message} {errors.length === 1 ? 'One problem' : `${errors.length} problems`} below.{' '}
          {hasPreview
            ? `Fix the file and choose it again, or change the mapping ${stage === 'analysing' ? 'above' : 'below'}; your choices stay as they are.`
            : 'Fix the file and choose it again; your choices stay as they are.'}
        </p>
      </div>
      <DataTable
        caption="Problems found in the logger file"
        rows={rows}
        columns={columns}
        filter={{ placeholder: 'Column or message', aboveRows: 8 }}
        noun={['problem', 'problems']}
      />
    </div>
  );
}
