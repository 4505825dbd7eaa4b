import { Column, Entity, Index } from 'typeorm';
import { IntColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';

export const photoKinds = ['overview', 'power-delivery', 'heatsinks', 'thermal-image', 'other'] as const;

export interface PhotoDerivativeRecord {
  width: number;
  height: number;
  format: 'webp' | 'jpeg';
  key: string;
  bytes: number;
}

/** A photo of a product within a roundup. Only the web sizes are kept; the upload itself is not stored. */
@Entity({ name: 'photos' })
@Index('ix_photos_entry', ['entryId', 'position'])
export class PhotoEntity extends EditedEntity {
  @Index('ix_photos_roundup')
  @IntColumn('roundup_id')
  roundupId: number;

  @IntColumn('roundup_entry_id')
  entryId: number;

  @Column({ type: 'enum', enum: photoKinds })
  kind: (typeof photoKinds)[number];

  @VarcharColumn(300, { default: '' })
  caption: string;

  @VarcharColumn(300, { name: 'alt_text' })
  altText: string;

  @Column({ type: 'int', unsigned: true })
  position: number;

  @Column({ type: 'int', unsigned: true })
  width: number;

  @Column({ type: 'int', unsigned: true })
  height: number;

  @Column({ type: 'char', length: 64, name: 'source_sha256' })
  sourceSha256: string;

  @Column({ type: 'json' })
  derivatives: PhotoDerivativeRecord[];

  @IntColumn('uploaded_by')
  uploadedBy: number;
}
