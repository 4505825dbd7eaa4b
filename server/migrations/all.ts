// Every migration, in order. A new schema change adds its class here.
import { CreateUsersSessionsAudit1764600000000 } from './1764600000000-create-users-sessions-audit';
import { CreateProducts1765100001000 } from './1765100001000-create-products';
import { CreateProductPrices1765100002000 } from './1765100002000-create-product-prices';
import { CreateBenchProfiles1765100003000 } from './1765100003000-create-bench-profiles';
import { CreateLoadConfigurations1765100004000 } from './1765100004000-create-load-configurations';
import { CreateRoundups1765100005000 } from './1765100005000-create-roundups';
import { CreateRoundupLoadConfigurations1765100006000 } from './1765100006000-create-roundup-load-configurations';
import { CreateRoundupEntries1765100007000 } from './1765100007000-create-roundup-entries';
import { CreateMatrixCells1765100008000 } from './1765100008000-create-matrix-cells';
import { CreateSamples1765100009000 } from './1765100009000-create-samples';
import { CreateBenches1765100010000 } from './1765100010000-create-benches';
import { CreateBenchBookings1765100011000 } from './1765100011000-create-bench-bookings';
import { CreateBenchBookingCells1765100012000 } from './1765100012000-create-bench-booking-cells';
import { CreateStoredFiles1765200001000 } from './1765200001000-create-stored-files';
import { CreateTestRuns1765200002000 } from './1765200002000-create-test-runs';
import { CreateRunAnalyses1765200003000 } from './1765200003000-create-run-analyses';
import { CreatePhotos1765200004000 } from './1765200004000-create-photos';
import { CaptureSettings1765200005000 } from './1765200005000-capture-settings';
import { AddBookingOverrideReason1765200031000 } from './1765200031000-add-booking-override-reason';
import { CreateCalendarFeeds1765200032000 } from './1765200032000-create-calendar-feeds';
import { CreatePasswordGuessCounters1765300001000 } from './1765300001000-create-password-guess-counters';
import { CreateBenchInstrumentsAndMaintenance1765400033000 } from './1765400033000-create-bench-instruments-and-maintenance';
import { CreateJobs1765700001000 } from './1765700001000-create-jobs';
import { CreateWriteUps1765600001000 } from './1765600001000-create-write-ups';
import { CreatePublishing1765700002000 } from './1765700002000-create-publishing';
import { ReaderSiteSettings1765710001000 } from './1765710001000-reader-site-settings';
import { CreateRelayMessages1765800001000 } from './1765800001000-create-relay-messages';
import { CreateSubscribersAndOutbox1765800002000 } from './1765800002000-create-subscribers-and-outbox';
import { AddStaffInvitations1765900001000 } from './1765900001000-add-staff-invitations';
import { CreateVerdictsChartsExclusions1765610001000 } from './1765610001000-create-verdicts-charts-exclusions';

export const migrations = [
  CreateUsersSessionsAudit1764600000000,
  CreateProducts1765100001000,
  CreateProductPrices1765100002000,
  CreateBenchProfiles1765100003000,
  CreateLoadConfigurations1765100004000,
  CreateRoundups1765100005000,
  CreateRoundupLoadConfigurations1765100006000,
  CreateRoundupEntries1765100007000,
  CreateMatrixCells1765100008000,
  CreateSamples1765100009000,
  CreateBenches1765100010000,
  CreateBenchBookings1765100011000,
  CreateBenchBookingCells1765100012000,
  CreateStoredFiles1765200001000,
  CreateTestRuns1765200002000,
  CreateRunAnalyses1765200003000,
  CreatePhotos1765200004000,
  CaptureSettings1765200005000,
  AddBookingOverrideReason1765200031000,
  CreateCalendarFeeds1765200032000,
  CreatePasswordGuessCounters1765300001000,
  CreateBenchInstrumentsAndMaintenance1765400033000,
  CreateJobs1765700001000,
  CreateWriteUps1765600001000,
  CreatePublishing1765700002000,
  ReaderSiteSettings1765710001000,
  CreateRelayMessages1765800001000,
  CreateSubscribersAndOutbox1765800002000,
  CreateVerdictsChartsExclusions1765610001000,
  AddStaffInvitations1765900001000,
];
