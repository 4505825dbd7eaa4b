import type { ReactNode } from 'react';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { Panel } from '../../../components/ui/panel';
import { cx } from '../../../lib/class-names';
import type { LogPreview } from '../../../../shared/schemas/analysis';
import { formatCount, unitLabel } from './format-figures';
import { guessedRoleOf, roleLabels } from './mapping-draft';

const delimiterNames: Record<LogPreview['delimiter'], string> = {
  ',': 'comma ( , )',
  ';': 'semicolon ( ; )',
  '\t': 'tab',
};
const decimalNames: Record<LogPreview['decimalSeparator'], string> = {
  '.': 'point ( 45.2 )',
  ',': 'comma ( 45,2 )',
};
const timeFormatNames: Record<NonNullable<LogPreview['timeFormat']>, string> = {
  seconds: 'elapsed seconds',
  milliseconds: 'elapsed milliseconds',
  minutes: 'elapsed minutes',
  clock: 'clock time (mm:ss or hh:mm:ss)',
  'date-time': 'date and time stamps',
};

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-wrap justify-between gap-x-4 border-b border-rule py-1.5 last:border-b-0">
      <dt className="text-sm text-muted">{term}</dt>
      <dd className="text-sm text-ink">{children}</dd>
    </div>
  );
}

type FileColumn = LogPreview['columns'][number];
/** A data line of the file as written, numbered from 1. */
interface FileRow {
  line: number;
  values: LogPreview['rows'][number];
}

function fileColumns(preview: LogPreview): DataTableColumn<FileColumn>[] {
  return [
    { id: 'index', header: '#', numeric: true, className: 'text-muted', cell: (column) => column.index + 1 },
    {
      id: 'name',
      header: 'Column',
      rowHeader: true,
      className: 'font-mono text-[0.8125rem]',
      cell: (column) => column.name || <span className="text-muted">(no name)</span>,
    },
    {
      id: 'role',
      header: 'Guessed role',
      cell: (column) => (
        <span className={cx(guessedRoleOf(preview, column) === 'other' && 'text-muted')}>
          {roleLabels[guessedRoleOf(preview, column)]}
        </span>
      ),
    },
    {
      id: 'unit',
      header: 'Unit in header',
      className: 'numeric',
      cell: (column) => (column.guessedUnit ? unitLabel(column.guessedUnit) : <span className="text-muted">none</span>),
    },
  ];
}

function firstRowColumns(preview: LogPreview): DataTableColumn<FileRow>[] {
  return [
    { id: 'line', header: '#', numeric: true, className: 'text-muted', cell: (row) => row.line },
    ...preview.columns.map((column): DataTableColumn<FileRow> => ({
      id: String(column.index),
      header: column.name,
      verbatimHeader: true,
      numeric: true,
      cell: (row) => row.values[column.index] ?? '',
    })),
  ];
}

export interface LogPreviewPanelProps {
  preview: LogPreview;
  fileName: string;
}

/** How Benchwire read the file before any analysis: format, header, columns and the first rows as written. */
export function LogPreviewPanel({ preview, fileName }: LogPreviewPanelProps) {
  const shownRows = preview.rows.length;
  return (
    <Panel
      title="How Benchwire read the file"
      description={
        <>
          <span className="font-mono text-[0.8125rem] break-all">{fileName}</span>: check these before the mapping.
        </>
      }
    >
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <dl>
          <Fact term="Delimiter">{delimiterNames[preview.delimiter]}</Fact>
          <Fact term="Decimal separator">{decimalNames[preview.decimalSeparator]}</Fact>
          <Fact term="Header row">
            <span className="numeric">row {preview.headerRow}</span>
          </Fact>
          <Fact term="Lines before the header">
            <span className="numeric">{preview.preambleLines.length}</span>
          </Fact>
          <Fact term="Lines after the header">
            <span className="numeric">{formatCount(preview.dataRowCount)}</span>
          </Fact>
          <Fact term="Time column">
            {preview.timeColumn ? (
              <>
                <span className="font-mono text-[0.8125rem]">{preview.timeColumn}</span>
                {preview.timeFormat && <span className="text-muted"> · {timeFormatNames[preview.timeFormat]}</span>}
              </>
            ) : (
              <span className="text-red">none found</span>
            )}
          </Fact>
          {preview.timeNote && (
            <Fact term="Time stamps">
              <span className="text-ink">{preview.timeNote}</span>
            </Fact>
          )}
        </dl>

        <DataTable
          caption="Columns in the file with the role and unit Benchwire guessed"
          rows={preview.columns}
          columns={fileColumns(preview)}
          rowKey={(column) => column.index}
        />
      </div>

      {preview.preambleLines.length > 0 && (
        <details className="mt-4 text-sm">
          <summary className="cursor-pointer font-semibold text-ink">
            Lines before the header ({preview.preambleLines.length})
          </summary>
          <pre className="mt-2 max-h-40 overflow-auto rounded-[3px] border border-rule bg-wash px-3 py-2 font-mono text-xs">
            {preview.preambleLines.join('\n')}
          </pre>
        </details>
      )}

      <h3 className="mt-5 mb-2 text-sm font-semibold text-ink">
        First rows as written{' '}
        <span className="font-normal text-muted">
          ({shownRows} of {formatCount(preview.dataRowCount)})
        </span>
      </h3>
      <DataTable
        caption="First rows of the file"
        rows={preview.rows.map((values, index) => ({ line: index + 1, values }))}
        columns={firstRowColumns(preview)}
        rowKey={(row) => row.line}
      />
    </Panel>
  );
}
