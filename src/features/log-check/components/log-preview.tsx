import type { ReactNode } from 'react';
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

        <div className="overflow-x-auto rounded-[3px] border border-rule">
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">Columns in the file with the role and unit Benchwire guessed</caption>
            <thead>
              <tr className="border-b border-edge/70 bg-wash text-xs tracking-wide text-muted uppercase">
                <th scope="col" className="px-3 py-1.5 text-right font-semibold">
                  #
                </th>
                <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                  Column
                </th>
                <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                  Guessed role
                </th>
                <th scope="col" className="px-3 py-1.5 text-left font-semibold">
                  Unit in header
                </th>
              </tr>
            </thead>
            <tbody>
              {preview.columns.map((column) => (
                <tr key={column.index} className="border-b border-rule last:border-b-0">
                  <td className="numeric px-3 py-1.5 text-right text-muted">{column.index + 1}</td>
                  <th scope="row" className="px-3 py-1.5 text-left font-mono text-[0.8125rem] font-normal">
                    {column.name || <span className="text-muted">(no name)</span>}
                  </th>
                  <td className={cx('px-3 py-1.5', guessedRoleOf(preview, column) === 'other' && 'text-muted')}>
                    {roleLabels[guessedRoleOf(preview, column)]}
                  </td>
                  <td className="numeric px-3 py-1.5">
                    {column.guessedUnit ? unitLabel(column.guessedUnit) : <span className="text-muted">none</span>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
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
      <div
        role="region"
        aria-label="First rows of the file"
        tabIndex={0}
        className="max-h-80 overflow-auto rounded-[3px] border border-rule"
      >
        <table className="w-full border-collapse text-sm">
          <thead className="sticky top-0">
            <tr className="border-b border-edge/70 bg-wash">
              <th scope="col" className="px-3 py-1.5 text-right text-xs font-semibold text-muted">
                #
              </th>
              {preview.columns.map((column) => (
                <th
                  key={column.index}
                  scope="col"
                  className="px-3 py-1.5 text-right font-mono text-xs font-semibold whitespace-nowrap text-ink"
                >
                  {column.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((row, index) => (
              <tr key={index} className="border-b border-rule last:border-b-0">
                <td className="numeric px-3 py-1 text-right text-muted">{index + 1}</td>
                {preview.columns.map((column) => (
                  <td key={column.index} className="numeric px-3 py-1 text-right whitespace-nowrap">
                    {row[column.index] ?? ''}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}
