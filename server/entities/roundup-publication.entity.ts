import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { IntColumn, OptionalIntColumn, InstantColumn } from './columns';

export const publicationKinds = ['publication', 'update', 'correction'] as const;
export type PublicationKind = (typeof publicationKinds)[number];

/**
 * One version of a roundup as readers saw it: the first publication, then each dated update or correction with its
 * note. `model` is the frozen published data the public pages were rendered from.
 */
@Entity({ name: 'roundup_publications' })
export class RoundupPublicationEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

  @IntColumn('roundup_id')
  roundupId: number;

  @Column({ type: 'int', unsigned: true })
  version: number;

  @Column({ type: 'enum', enum: publicationKinds })
  kind: PublicationKind;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @InstantColumn('published_at')
  publishedAt: Date;

  @OptionalIntColumn('published_by')
  publishedBy: number | null;

  @Column({ type: 'json' })
  model: unknown;
}
