import { CreateDateColumn, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { OptionalIntColumn, OptionalInstantColumn, VarcharColumn } from './columns';

// The columns most tables share, declared once; an entity extends the one that fits. Column names and types match
// the migrations (INT UNSIGNED AUTO_INCREMENT keys, DATETIME(3) UTC times).

/** A row with its own key and the instant it was written. */
export abstract class RecordedEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;
}

/** A row that is edited after it is written: it also keeps the instant of the last change. */
export abstract class EditedEntity extends RecordedEntity {
  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}

/** A reusable record staff create and later archive instead of deleting (products, bench profiles, loads). */
export abstract class ArchivableEntity extends EditedEntity {
  @OptionalInstantColumn('archived_at')
  archivedAt: Date | null;

  @OptionalIntColumn('created_by')
  createdBy: number | null;
}

/** An archivable record known by a name no other of its kind has (bench profiles, load configurations). */
export abstract class NamedArchivableEntity extends ArchivableEntity {
  @VarcharColumn(120, { unique: true })
  name: string;
}

/**
 * A row that links two others, keyed by both references (INT UNSIGNED, e.g. `booking_id` + `matrix_cell_id`): the
 * base of a link table, given each reference as [property, column].
 */
export function KeyedByPair<A extends string, B extends string>(
  first: readonly [A, string],
  second: readonly [B, string],
) {
  abstract class PairKeyedEntity {}
  for (const [property, name] of [first, second]) {
    PrimaryColumn({ type: 'int', unsigned: true, name })(PairKeyedEntity.prototype, property);
  }
  return PairKeyedEntity as abstract new () => Record<A | B, number>;
}
