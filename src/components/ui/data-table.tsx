import { useMemo, useState, type ReactNode } from 'react';
import { cx } from '../../lib/class-names';
import { useColumnChoice } from '../../lib/use-column-choice';
import { ColumnChooser } from './column-chooser';
import { ScrollingTable } from './scrolling-table';
import { SearchField } from './search-field';

export type SortDirection = 'ascending' | 'descending';
export interface SortState {
  columnId: string;
  direction: SortDirection;
}

export interface DataTableColumn<Row> {
  id: string;
  header: string;
  cell: (row: Row) => ReactNode;
  /** Makes the column sortable; null values sort last in either direction. */
  sortValue?: (row: Row) => string | number | null;
  /** Text the filter box searches in this column; string sort values are searched when this is absent. */
  filterValue?: (row: Row) => string;
  /** Right-aligned in the mono face with tabular figures: counts, temperatures, times. */
  numeric?: boolean;
  /** The cell that names the row, read out as the row's header; it stays in view while the table scrolls sideways. */
  rowHeader?: boolean;
  /** Stays at the right edge while the table scrolls sideways (from the sm breakpoint up), e.g. the row's actions. */
  pinEnd?: boolean;
  /** With a column chooser: the name in the chooser (the header may be shorter). */
  label?: string;
  /** With a column chooser: shown until the user chooses otherwise (default true). */
  defaultVisible?: boolean;
  /** With a column chooser: always shown. The row header and pinned columns always are. */
  fixed?: boolean;
  /** Hidden below this breakpoint (keeps phones readable); never hide the row header. */
  hideBelow?: 'sm' | 'md' | 'lg';
  /** The header is read out only: the cells speak for themselves (a badge, the row's buttons). */
  headerHidden?: boolean;
  /** The header as written, in the mono face: names read from a file, which capitals would misquote. */
  verbatimHeader?: boolean;
  /** The content fills the cell to its edges and carries its own padding (a link or a coloured block). */
  flush?: boolean;
  className?: string;
}

/** A table's columns; left-out ones (false, null or undefined) are skipped, e.g. `canEdit && actionsColumn(…)`. */
export type DataTableColumns<Row> = readonly (DataTableColumn<Row> | false | null | undefined)[];

type RowKey<Row> = (row: Row) => string | number;

export interface DataTableFilter {
  /** Default: "Filter" and the plural noun, e.g. "Filter samples". */
  label?: string;
  placeholder?: string;
  /** Shown only while the table has more rows than this: a short table is read at a glance. */
  aboveRows?: number;
}

interface DataTableOwnProps<Row> {
  /** Names the table for screen readers (shown when `showCaption`). */
  caption: string;
  showCaption?: boolean;
  rows: readonly Row[];
  columns: DataTableColumns<Row>;
  /** The sort the table opens with; a column id sorts that column ascending. */
  initialSort?: SortState | string;
  /** A filter box above the table (a string is its placeholder); none when left out (or false). */
  filter?: DataTableFilter | string | false;
  /** Singular and plural noun for the count line, e.g. ['user', 'users']. */
  noun?: [string, string];
  /** Extra controls next to the filter box. */
  toolbar?: ReactNode;
  /** A line under the table, e.g. which time zone the times are in. */
  footnote?: ReactNode;
  /** Shown instead of the table when there are no rows at all. */
  empty?: ReactNode;
  rowClassName?: (row: Row) => string | undefined;
  /** A "Columns" chooser in the toolbar; the choice is remembered on this device under `storageKey`. */
  columnChoice?: { storageKey: string };
}

/** Rows with an `id` are keyed by it unless `rowKey` says otherwise; other rows need a `rowKey`. */
export type DataTableProps<Row> = DataTableOwnProps<Row> &
  (Row extends { id: string | number } ? { rowKey?: RowKey<Row> } : { rowKey: RowKey<Row> });

const keyById = (row: unknown) => (row as { id: string | number }).id;

// Sticky cells need their own background so the scrolled columns pass underneath; the line shows the edge.
const stickyStart = 'sticky left-0 shadow-[inset_-1px_0_0_var(--color-rule)]';
const stickyEnd = 'sm:sticky sm:right-0 sm:shadow-[inset_1px_0_0_var(--color-rule)]';

function isAlwaysShown(column: { rowHeader?: boolean; pinEnd?: boolean; fixed?: boolean }): boolean {
  return Boolean(column.rowHeader || column.pinEnd || column.fixed);
}

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
const hidden = { sm: 'hidden sm:table-cell', md: 'hidden md:table-cell', lg: 'hidden lg:table-cell' };

function compare(a: string | number | null, b: string | number | null): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return collator.compare(String(a), String(b));
}

/** A dense, sortable, filterable table: headers are buttons, the sorted one carries aria-sort. */
export function DataTable<Row>(props: DataTableProps<Row>) {
  const {
    caption,
    showCaption = false,
    rows,
    rowKey = keyById,
    initialSort,
    filter: filterOption,
    noun = ['row', 'rows'],
    toolbar,
    footnote,
    empty,
    rowClassName,
    columnChoice,
    columns: givenColumns,
  } = props as DataTableOwnProps<Row> & { rowKey?: RowKey<Row> };
  const [sort, setSort] = useState<SortState | undefined>(() =>
    typeof initialSort === 'string' ? { columnId: initialSort, direction: 'ascending' } : initialSort,
  );
  const allColumns = useMemo(
    () => givenColumns.filter((column): column is DataTableColumn<Row> => Boolean(column)),
    [givenColumns],
  );
  const [singular, plural] = noun;
  const filterSettings = typeof filterOption === 'string' ? { placeholder: filterOption } : filterOption;
  const filter =
    filterSettings && rows.length > (filterSettings.aboveRows ?? -1)
      ? { label: `Filter ${plural}`, ...filterSettings }
      : undefined;
  const choice = useColumnChoice(columnChoice?.storageKey);
  const choosable = useMemo(
    () =>
      columnChoice
        ? allColumns
            .filter((column) => !isAlwaysShown(column))
            .map((column) => ({
              id: column.id,
              label: column.label ?? column.header,
              defaultVisible: column.defaultVisible ?? true,
            }))
        : [],
    [allColumns, columnChoice],
  );
  const columns = useMemo(
    () =>
      columnChoice
        ? allColumns.filter(
            (column) => isAlwaysShown(column) || choice.isVisible(column.id, column.defaultVisible ?? true),
          )
        : allColumns,
    [allColumns, columnChoice, choice],
  );
  const [query, setQuery] = useState('');

  // What was typed applies only while the box is shown: a table that shrank below `aboveRows` hides no rows.
  const activeQuery = filter ? query : '';
  const visibleRows = useMemo(() => {
    const needle = activeQuery.trim().toLocaleLowerCase();
    let result = [...rows];
    if (needle) {
      result = result.filter((row) =>
        columns.some((column) => {
          const text = column.filterValue?.(row) ?? column.sortValue?.(row);
          return typeof text === 'string' && text.toLocaleLowerCase().includes(needle);
        }),
      );
    }
    const column = sort && columns.find((candidate) => candidate.id === sort.columnId);
    if (sort && column?.sortValue) {
      const value = column.sortValue;
      const factor = sort.direction === 'ascending' ? 1 : -1;
      result.sort((a, b) => {
        const left = value(a);
        const right = value(b);
        if (left === null || right === null) return left === right ? 0 : left === null ? 1 : -1;
        return compare(left, right) * factor;
      });
    }
    return result;
  }, [rows, columns, activeQuery, sort]);

  if (rows.length === 0 && empty) return <>{empty}</>;

  const toggleSort = (columnId: string) =>
    setSort((current) =>
      current?.columnId === columnId
        ? { columnId, direction: current.direction === 'ascending' ? 'descending' : 'ascending' }
        : { columnId, direction: 'ascending' },
    );

  const countText =
    visibleRows.length === rows.length
      ? `${rows.length} ${rows.length === 1 ? singular : plural}`
      : `${visibleRows.length} of ${rows.length} ${plural} match`;

  return (
    <div>
      {(filter || toolbar || columnChoice) && (
        <div className="mb-2.5 flex flex-wrap items-end gap-3">
          {filter && (
            <SearchField
              label={filter.label}
              value={query}
              onChange={(event) => setQuery(event.target.value)}
              placeholder={filter.placeholder}
              className="w-full sm:w-72"
            />
          )}
          {toolbar}
          {columnChoice && <ColumnChooser columns={choosable} {...choice} />}
          <p aria-live="polite" className="numeric ml-auto pb-1.5 text-muted">
            {countText}
          </p>
        </div>
      )}
      <ScrollingTable
        caption={caption}
        captionClassName={showCaption ? 'px-3 py-2 text-left font-semibold' : 'sr-only'}
      >
        <thead>
          <tr>
            {columns.map((column) => {
              const sorted = sort?.columnId === column.id ? sort.direction : undefined;
              return (
                <th
                  key={column.id}
                  scope="col"
                  aria-sort={column.sortValue ? (sorted ?? 'none') : undefined}
                  className={cx(
                    'sticky top-0 z-10 border-b border-edge/70 bg-wash px-3 py-1.5 text-xs font-semibold whitespace-nowrap text-muted',
                    column.verbatimHeader ? 'font-mono' : 'tracking-wide uppercase',
                    column.numeric ? 'text-right' : 'text-left',
                    column.hideBelow && hidden[column.hideBelow],
                    column.rowHeader && stickyStart,
                    column.pinEnd && stickyEnd,
                    (column.rowHeader || column.pinEnd) && 'z-20',
                  )}
                >
                  {column.headerHidden ? (
                    <span className="sr-only">{column.header}</span>
                  ) : column.sortValue ? (
                    <button
                      type="button"
                      onClick={() => toggleSort(column.id)}
                      className={cx(
                        'inline-flex items-center gap-1 rounded-[2px] hover:text-ink',
                        !column.verbatimHeader && 'uppercase',
                        sorted && 'text-ink',
                        column.numeric && 'flex-row-reverse',
                      )}
                    >
                      {column.header}
                      <SortMark direction={sorted} />
                    </button>
                  ) : (
                    column.header
                  )}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {visibleRows.map((row) => (
            <tr key={rowKey(row)} className={cx('group hover:bg-wash/60', rowClassName?.(row))}>
              {columns.map((column) => {
                const Cell = column.rowHeader ? 'th' : 'td';
                return (
                  <Cell
                    key={column.id}
                    scope={column.rowHeader ? 'row' : undefined}
                    className={cx(
                      'border-b border-rule group-last:border-b-0',
                      column.flush ? 'p-0 align-top' : 'px-3 py-1.5 align-middle',
                      column.rowHeader && 'text-left font-medium',
                      column.rowHeader && stickyStart,
                      column.pinEnd && stickyEnd,
                      (column.rowHeader || column.pinEnd) && 'z-[1] bg-surface group-hover:bg-wash',
                      column.numeric && 'numeric text-right whitespace-nowrap',
                      column.hideBelow && hidden[column.hideBelow],
                      column.className,
                    )}
                  >
                    {column.cell(row)}
                  </Cell>
                );
              })}
            </tr>
          ))}
          {visibleRows.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="px-3 py-6 text-center text-muted">
                Nothing matches “{query.trim()}”. Clear the filter to see all {plural}.
              </td>
            </tr>
          )}
        </tbody>
      </ScrollingTable>
      {footnote && <p className="mt-2 text-[0.8125rem] text-muted">{footnote}</p>}
    </div>
  );
}

function SortMark({ direction }: { direction?: SortDirection }) {
  const glyph = direction === 'ascending' ? '▲' : direction === 'descending' ? '▼' : '↕';
  return (
    <span aria-hidden="true" className={cx('font-mono text-[0.625rem]', !direction && 'opacity-50')}>
      {glyph}
    </span>
  );
}
