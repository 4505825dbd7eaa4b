import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** An uploaded file kept byte for byte in the file store, with its SHA-256. Never edited. */
@Entity({ name: 'stored_files' })
export class StoredFileEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @Index('uq_stored_files_key', { unique: true })
  @Column({ type: 'varchar', length: 512, name: 'storage_key' })
  storageKey: string;

  @Index('ix_stored_files_sha256')
  @Column({ type: 'char', length: 64 })
  sha256: string;

  /** BIGINT arrives from the driver as a string. */
  @Column({ type: 'bigint', unsigned: true, name: 'byte_size' })
  byteSize: string;

  @Column({ type: 'varchar', length: 100, name: 'content_type' })
  contentType: string;

  @Column({ type: 'varchar', length: 255, name: 'original_name' })
  originalName: string;

  @Column({ type: 'int', unsigned: true, name: 'uploaded_by' })
  uploadedBy: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;
}
