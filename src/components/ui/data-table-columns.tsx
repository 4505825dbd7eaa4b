import type { ReactNode } from 'react';
import { Button, type ButtonVariant } from './button';
import type { DataTableColumn } from './data-table';
import { DateTime } from './date-time';
import { formatCalendarDate } from '../../lib/format-time';

type ColumnExtras<Row> = Partial<DataTableColumn<Row>>;

/** A column sorted by the text it shows; a `cell` among the extras dresses the text up (a link, a note under it). */
export function textColumn<Row>(
  id: string,
  header: string,
  text: (row: Row) => string | null,
  extras: ColumnExtras<Row> = {},
): DataTableColumn<Row> {
  return { id, header, sortValue: text, cell: text, ...extras };
}

/** A right-aligned figure (count, temperature, date) sorted by its value and shown through `format`. */
export function numericColumn<Row, Value extends string | number | null | undefined>(
  id: string,
  header: string,
  value: (row: Row) => Value,
  format: (value: Value) => ReactNode,
  extras: ColumnExtras<Row> = {},
): DataTableColumn<Row> {
  return {
    id,
    header,
    numeric: true,
    sortValue: (row) => value(row) ?? null,
    cell: (row) => format(value(row)),
    ...extras,
  };
}

/**
 * A date sorted in time: a calendar day (YYYY-MM-DD), or with `instant` an instant from the API shown in the user's
 * time zone; `empty` stands for none. Days sort as written, so the filter box finds them too.
 */
export function dateColumn<Row>(
  id: string,
  header: string,
  date: (row: Row) => string | null,
  { instant = false, empty = '—', ...extras }: ColumnExtras<Row> & { instant?: boolean; empty?: string } = {},
): DataTableColumn<Row> {
  const moment = (row: Row) => {
    const value = date(row);
    return value ? Date.parse(value) : null;
  };
  const day = (row: Row) => {
    const value = date(row);
    return value ? formatCalendarDate(value) : <span className="text-muted">{empty}</span>;
  };
  return {
    id,
    header,
    numeric: true,
    sortValue: instant ? moment : date,
    cell: instant ? (row) => <DateTime value={date(row)} fallback={empty} /> : day,
    ...extras,
  };
}

/** The row's own controls, in the last column. */
export function actionsColumn<Row>(
  cell: (row: Row) => ReactNode,
  extras: ColumnExtras<Row> = {},
): DataTableColumn<Row> {
  return { id: 'actions', header: 'Actions', cell, ...extras };
}

export interface RowButton<Row> {
  label: string;
  /** The button's accessible name, which says which row it acts on, e.g. "Edit Bench 2". */
  name: (row: Row) => string;
  onClick: (row: Row) => void;
  variant?: ButtonVariant;
}

/** An actions column holding one small button per row. */
export function buttonColumn<Row>(
  { label, name, onClick, variant }: RowButton<Row>,
  extras: ColumnExtras<Row> = {},
): DataTableColumn<Row> {
  return actionsColumn(
    (row) => (
      <Button size="sm" variant={variant} onClick={() => onClick(row)} aria-label={name(row)}>
        {label}
      </Button>
    ),
    extras,
  );
}
