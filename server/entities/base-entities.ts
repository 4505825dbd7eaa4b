import { CreateDateColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { OptionalIntColumn, OptionalInstantColumn } from './columns';

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
