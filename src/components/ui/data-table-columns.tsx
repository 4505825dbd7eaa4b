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

/** A calendar day (YYYY-MM-DD), sorted in time; `empty` stands for none. */
export function calendarDateColumn<Row>(
  id: string,
  header: string,
  date: (row: Row) => string | null,
  extras: ColumnExtras<Row> & { empty?: string } = {},
): DataTableColumn<Row> {
  const { empty = '—', ...rest } = extras;
  const show = (day: string | null) => (day ? formatCalendarDate(day) : <span className="text-muted">{empty}</span>);
  return numericColumn(id, header, date, show, rest);
}

/** An instant from the API in the user's time zone, sorted in time; `fallback` stands for none. */
export function instantColumn<Row>(
  id: string,
  header: string,
  instant: (row: Row) => string | null,
  extras: ColumnExtras<Row> & { fallback?: string } = {},
): DataTableColumn<Row> {
  const { fallback, ...rest } = extras;
  return {
    id,
    header,
    numeric: true,
    sortValue: (row) => {
      const value = instant(row);
      return value ? Date.parse(value) : null;
    },
    cell: (row) => <DateTime value={instant(row)} fallback={fallback} />,
    ...rest,
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
