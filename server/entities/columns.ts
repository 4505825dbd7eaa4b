import { Column, type ColumnOptions } from 'typeorm';

// Decorators for the column kinds most tables repeat, so an entity states only what is particular to a column:
// its name, whether it may be empty, its default. Each expands to the options the migrations' SQL matches
// (INT UNSIGNED references, DATETIME(3) UTC instants, DATE calendar days read as 'YYYY-MM-DD' text).

type More = Pick<ColumnOptions, 'default' | 'unique' | 'select'>;

/** Another row's key (`roundup_id`), or any other whole number kept as INT UNSIGNED. */
export function IntColumn(name: string, more: More = {}) {
  return Column({ type: 'int', unsigned: true, name, ...more });
}

/** An INT UNSIGNED that may be empty: an optional reference (`tester_id`), or the user who did something. */
export function OptionalIntColumn(name: string) {
  return Column({ type: 'int', unsigned: true, name, nullable: true });
}

/** An instant, DATETIME(3) in UTC. */
export function InstantColumn(name: string, more: More = {}) {
  return Column({ type: 'datetime', precision: 3, name, ...more });
}

/** An instant that has not happened yet or may never happen (`sent_at`, `archived_at`). */
export function OptionalInstantColumn(name: string) {
  return Column({ type: 'datetime', precision: 3, name, nullable: true });
}

/** An instant the database fills in when the row is inserted without it (`DEFAULT CURRENT_TIMESTAMP(3)`). */
export function DefaultNowColumn(name: 'created_at' | 'updated_at') {
  return Column({ type: 'datetime', precision: 3, name, default: () => 'CURRENT_TIMESTAMP(3)' });
}

/** A calendar day (DATE), read as its 'YYYY-MM-DD' text. */
export function DayColumn(name: string) {
  return Column({ type: 'date', name, utc: true });
}

/** A calendar day that may be unknown or not come yet (`return_by`, `released_on`). */
export function OptionalDayColumn(name: string) {
  return Column({ type: 'date', name, nullable: true, utc: true });
}

/** Text up to `length` characters (VARCHAR); `name` where the column's name differs from the property's. */
export function VarcharColumn(
  length: number,
  more: Pick<ColumnOptions, 'name' | 'nullable' | 'default' | 'unique'> = {},
) {
  return Column({ type: 'varchar', length, ...more });
}

/** A small count or number of things (TINYINT UNSIGNED) that may be unknown. */
export function OptionalCountColumn(name: string) {
  return Column({ type: 'tinyint', unsigned: true, name, nullable: true });
}

/** A measurement DECIMAL(precision, scale): it arrives from the driver as a string. */
export function DecimalColumn(
  precision: number,
  scale: number,
  name: string,
  more: Pick<ColumnOptions, 'nullable'> = {},
) {
  return Column({ type: 'decimal', precision, scale, name, ...more });
}
