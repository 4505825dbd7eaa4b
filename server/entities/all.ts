// Listed explicitly so bundled builds and the CLI see the same entity set.
import { AuditEntryEntity } from './audit-entry.entity';
import { BenchBookingCellEntity } from './bench-booking-cell.entity';
import { BenchBookingEntity } from './bench-booking.entity';
import { BenchProfileEntity } from './bench-profile.entity';
import { BenchEntity } from './bench.entity';
import { LoadConfigurationEntity } from './load-configuration.entity';
import { MatrixCellEntity } from './matrix-cell.entity';
import { PasswordGuessCounterEntity } from './password-guess-counter.entity';
import { ProductPriceEntity } from './product-price.entity';
import { ProductEntity } from './product.entity';
import { RoundupEntryEntity } from './roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from './roundup-load-configuration.entity';
import { RoundupEntity } from './roundup.entity';
import { SampleEntity } from './sample.entity';
import { SessionEntity } from './session.entity';
import { UserEntity } from './user.entity';
import { StoredFileEntity } from './stored-file.entity';
import { TestRunEntity } from './test-run.entity';
import { RunAnalysisEntity } from './run-analysis.entity';
import { ReaderSiteSettingsEntity } from './reader-site-settings.entity';
import { PhotoEntity } from './photo.entity';
import { CalendarFeedEntity } from './calendar-feed.entity';
import { BenchInstrumentEntity } from './bench-instrument.entity';
import { BenchMaintenanceEntryEntity } from './bench-maintenance-entry.entity';
import { JobEntity } from './job.entity';
import { WriteUpSectionEntity } from './write-up-section.entity';
import { WriteUpRevisionEntity } from './write-up-revision.entity';
import { WriteUpCommentEntity } from './write-up-comment.entity';
import { RelayMessageEntity } from './relay-message.entity';
import {
  AppSecretEntity,
  MailCategoryEntity,
  MailingEntity,
  MailOptOutEntity,
  MailSuppressionEntity,
  OutboxEntity,
  SubscriberCategoryEntity,
  SubscriberEntity,
} from './mail.entities';
import { EditorialVerdictEntity } from './editorial-verdict.entity';
import { RoundupChartEntity } from './roundup-chart.entity';
import { MatrixCellExclusionEntity } from './matrix-cell-exclusion.entity';
import { RoundupScheduleEntity } from './roundup-schedule.entity';
import { RoundupPublicationEntity } from './roundup-publication.entity';
import { PublishedPageEntity } from './published-page.entity';

export const entities = [
  UserEntity,
  SessionEntity,
  AuditEntryEntity,
  ProductEntity,
  ProductPriceEntity,
  BenchProfileEntity,
  LoadConfigurationEntity,
  RoundupEntity,
  RoundupLoadConfigurationEntity,
  RoundupEntryEntity,
  MatrixCellEntity,
  SampleEntity,
  BenchEntity,
  BenchBookingEntity,
  BenchBookingCellEntity,
  StoredFileEntity,
  TestRunEntity,
  RunAnalysisEntity,
  PhotoEntity,
  CalendarFeedEntity,
  PasswordGuessCounterEntity,
  BenchInstrumentEntity,
  BenchMaintenanceEntryEntity,
  JobEntity,
  WriteUpSectionEntity,
  WriteUpRevisionEntity,
  WriteUpCommentEntity,
  ReaderSiteSettingsEntity,
  RelayMessageEntity,
  AppSecretEntity,
  MailCategoryEntity,
  SubscriberEntity,
  SubscriberCategoryEntity,
  MailSuppressionEntity,
  MailingEntity,
  OutboxEntity,
  MailOptOutEntity,
  EditorialVerdictEntity,
  RoundupChartEntity,
  MatrixCellExclusionEntity,
  RoundupScheduleEntity,
  RoundupPublicationEntity,
  PublishedPageEntity,
];
