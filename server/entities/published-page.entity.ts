import { Column, Entity, PrimaryColumn } from 'typeorm';
import { OptionalIntColumn, InstantColumn, VarcharColumn } from './columns';

/** A public URL's rendered body with its pre-compressed forms; the reader site serves these from memory. */
@Entity({ name: 'published_pages' })
export class PublishedPageEntity {
  @PrimaryColumn({ type: 'varchar', length: 400 })
  path: string;

  /** '' for the page every reader gets; otherwise a variant chosen from the request (e.g. the temperature unit). */
  @PrimaryColumn({ type: 'varchar', length: 32 })
  variant: string;

  @OptionalIntColumn('roundup_id')
  roundupId: number | null;

  @VarcharColumn(100, { name: 'content_type' })
  contentType: string;

  @VarcharColumn(64)
  etag: string;

  @Column({ type: 'mediumblob' })
  body: Buffer;

  @Column({ type: 'mediumblob', name: 'body_gzip' })
  bodyGzip: Buffer;

  @Column({ type: 'mediumblob', name: 'body_brotli' })
  bodyBrotli: Buffer;

  @InstantColumn('updated_at')
  updatedAt: Date;
}
