import type { DataSource } from 'typeorm';
import { PasswordGuesses, passwordGuessPolicy } from './auth/password-guesses';
import { createSessionStore } from './auth/session-store';
import { secureCookieFor, type Env } from './env';
import { AuthService } from './services/auth.service';
import { BenchProfilesService } from './services/bench-profiles.service';
import { BenchesService } from './services/benches.service';
import { CalendarFeedService } from './services/calendar-feed.service';
import { CatalogImportService } from './services/catalog-import.service';
import { CatalogService } from './services/catalog.service';
import { DashboardService } from './services/dashboard.service';
import { LoadConfigurationsService } from './services/load-configurations.service';
import { LogCheckService, pooledAnalyser } from './services/log-check.service';
import { MatrixService } from './services/matrix.service';
import { MyBenchService } from './services/my-bench.service';
import { RoundupEntriesService } from './services/roundup-entries.service';
import { RoundupsService } from './services/roundups.service';
import { SamplesService } from './services/samples.service';
import { TestRunsService } from './services/test-runs.service';
import { PhotosService } from './services/photos.service';
import { UsersService } from './services/users.service';
import { InvitationsService } from './services/invitations.service';
import { WriteUpsService } from './services/write-ups.service';
import { VerdictsService } from './services/verdicts.service';
import { ChartsService } from './services/charts.service';
import { ReadinessService } from './services/readiness.service';
import { createFileStore } from './storage/create-file-store';
import { DevInboxService } from './services/dev-inbox.service';
import { LinkSecret } from './mail/link-secret';
import { MailSender } from './mail/mail-sender';
import { chartAltText, parseFrom } from './mail/compose';
import { createMailTransport } from './mail/transport';
import { StaffMailService } from './services/staff-mail.service';
import { SubscribersService } from './services/subscribers.service';
import { signUpLimiter } from './middleware/sign-up-limit';
import { PublishedPageCache } from './publishing/published-page-cache';
import { loadPreviewSecret } from './publishing/preview-links';
import { readerSiteRenderer } from './publishing/reader-site-renderer';
import { PublishingService } from './services/publishing.service';
import { OpenDataSettingsService } from './publishing/open-data-settings';
import { enqueueGoLiveMailing } from './mail/outbox';

/**
 * The one place that builds every service, each once, handing services their collaborators. Routes (through
 * AppContext), the CLI, jobs and reader pages take what they need from here instead of building their own.
 */
export function createServices(dataSource: DataSource, env: Env) {
  const sessions = createSessionStore(dataSource, {
    secureCookie: secureCookieFor(env),
    sessionDays: env.SESSION_DAYS,
  });
  const files = createFileStore(env);
  const passwordGuesses = new PasswordGuesses(dataSource, passwordGuessPolicy(env));

  const auth = new AuthService(dataSource, sessions);
  const catalog = new CatalogService(dataSource);
  const catalogImport = new CatalogImportService(dataSource);
  const benchProfiles = new BenchProfilesService(dataSource);
  const loadConfigurations = new LoadConfigurationsService(dataSource);
  const roundups = new RoundupsService(dataSource);
  const roundupEntries = new RoundupEntriesService(dataSource);
  const matrix = new MatrixService(dataSource);
  const samples = new SamplesService(dataSource);
  const benches = new BenchesService(dataSource);
  const myBench = new MyBenchService(dataSource, benches);
  const dashboard = new DashboardService(dataSource, myBench);
  const calendarFeeds = new CalendarFeedService(dataSource, benches);
  // One analyser for every logger file the server reads, log check and test runs alike: worker threads, so no file
  // holds the event loop.
  const logFileAnalyser = pooledAnalyser();
  const logCheck = new LogCheckService(logFileAnalyser);
  const testRuns = new TestRunsService(dataSource, files, logFileAnalyser);
  const photos = new PhotosService(dataSource, files);
  const writeUps = new WriteUpsService(dataSource, testRuns);
  const devInbox = new DevInboxService(dataSource, env.LOCAL_MAIL_RELAY && Boolean(env.SMTP_URL));
  // Mail: links in mail point at the public site; the outbox sender uses one pooled SMTP transport per process.
  const siteUrl = (env.PUBLIC_SITE_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/$/, '');
  const outletName = parseFrom(env.MAIL_FROM).name || 'Benchwire';
  const linkSecret = new LinkSecret(dataSource, env.MAIL_LINK_SECRET);
  const subscribers = new SubscribersService(dataSource, linkSecret, {
    siteUrl,
    outletName,
    sending: Boolean(env.SMTP_URL),
  });
  const staffMail = new StaffMailService(dataSource, siteUrl);
  const invitations = new InvitationsService(dataSource, { siteUrl, outletName });
  const users = new UsersService(dataSource, invitations);
  const mailSender = new MailSender({
    dataSource,
    transport: createMailTransport(env.SMTP_URL),
    from: env.MAIL_FROM,
    siteUrl,
    secret: linkSecret,
    content: {
      siteUrl,
      outletName,
      // The first approved chart that still shows today's data goes inline in the mail as its image.
      chartPng: async (_manager, roundupId) => {
        const image = (await charts.approvedChartImages(roundupId)).find((i) => !i.stale);
        const png = image ? await files.get(image.storageKey) : null;
        return image && png ? { png, alt: chartAltText(image.title) } : null;
      },
    },
    batchSize: env.MAIL_BATCH_SIZE,
    leaseMs: env.MAIL_LEASE_SECONDS * 1000,
    retryBaseMs: env.MAIL_RETRY_BASE_SECONDS * 1000,
  });
  // Published pages live in memory; publishing freezes and renders them with the reader site's model and pages.
  const publishedPages = new PublishedPageCache(dataSource);
  let previewSecret: Promise<Buffer> | null = null;
  const publishing = new PublishingService(dataSource, {
    renderer: readerSiteRenderer(dataSource, {
      baseUrl: env.PUBLIC_SITE_URL ?? `http://${env.HOST}:${env.PORT}`,
      // Frozen with the data: the signed-off write-up and the approved chart images.
      writeUps,
      chartImages: (roundupId) => charts.approvedChartImages(roundupId),
    }),
    pages: publishedPages,
    previewSecret: () => (previewSecret ??= loadPreviewSecret(dataSource, env.PREVIEW_LINK_SECRET)),
  });
  // Open-data switches (raw logger files, licence line): settings the published pages follow at once.
  const openDataSettings = new OpenDataSettingsService(dataSource, publishing);
  // Going live queues the go-live mail in the publish transaction: the mail is queued if and only if the publish
  // commits. Updates and corrections are mailed only when an editor chooses to.
  publishing.onPublication(async (manager, event) => {
    if (event.kind === 'publication') await enqueueGoLiveMailing(manager, event.roundupId);
  });
  const verdicts = new VerdictsService(dataSource);
  const charts = new ChartsService(dataSource, files);
  // readiness.readiness(roundupId): "ready to schedule" and what still blocks it; the write-ups plug in their sections.
  const readiness = new ReadinessService(dataSource, charts, roundups);
  // Each section's blocker opens that section; "not started" opens the write-up overview, where it is started.
  readiness.useSectionsBlocking(async (roundupId) =>
    (await writeUps.sectionBlockers(roundupId)).map(({ label, sectionId }) => ({
      kind: 'section',
      label,
      link: sectionId === null ? `/roundups/${roundupId}/write-up` : `/roundups/${roundupId}/write-up/${sectionId}`,
    })),
  );
  // Scheduling and the publish job ask readiness: a roundup with blockers is neither scheduled nor published. The
  // state itself is publishing's own check (In review or Scheduled), so readiness's state line is left out here.
  publishing.addReadinessCheck(async (_manager, roundup) =>
    (await readiness.readiness(roundup.id)).blocking
      .filter((blocker) => blocker.kind !== 'state')
      .map((blocker) => ({ message: blocker.label, link: blocker.link })),
  );

  return {
    sessions,
    passwordGuesses,
    files,
    auth,
    users,
    invitations,
    catalog,
    catalogImport,
    benchProfiles,
    loadConfigurations,
    roundups,
    roundupEntries,
    matrix,
    samples,
    benches,
    myBench,
    dashboard,
    logFileAnalyser,
    logCheck,
    calendarFeeds,
    testRuns,
    photos,
    writeUps,
    devInbox,
    linkSecret,
    subscribers,
    staffMail,
    mailSender,
    signUpLimiter: signUpLimiter(env),
    verdicts,
    charts,
    readiness,
    publishedPages,
    publishing,
    openDataSettings,
  };
}

export type Services = ReturnType<typeof createServices>;
