import { Column, Entity, Index } from 'typeorm';
import { IntColumn, VarcharColumn } from './columns';
import { RecordedEntity } from './base-entities';

/** An uploaded file kept byte for byte in the file store, with its SHA-256. Never edited. */
@Entity({ name: 'stored_files' })
export class StoredFileEntity extends RecordedEntity {
  @Index('uq_stored_files_key', { unique: true })
  @VarcharColumn(512, { name: 'storage_key' })
  storageKey: string;

  @Index('ix_stored_files_sha256')
  @Column({ type: 'char', length: 64 })
  sha256: string;

  /** BIGINT arrives from the driver as a string. */
  @Column({ type: 'bigint', unsigned: true, name: 'byte_size' })
  byteSize: string;

  @VarcharColumn(100, { name: 'content_type' })
  contentType: string;

  @VarcharColumn(255, { name: 'original_name' })
  originalName: string;

  @IntColumn('uploaded_by')
  uploadedBy: number;
}
