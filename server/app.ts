import express from 'express';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import { ApiRegistry } from './api-registry';
import type { AppContext } from './app-context';
import { createServices, type Services } from './compose-services';
import { parseTrustProxy, secureCookieFor, type Env } from './env';
import { authenticate } from './middleware/authenticate';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { securityHeaders } from './middleware/security-headers';
import { verifyOrigin } from './middleware/verify-origin';
import { registerFeatureRoutes } from './routes/all';
import { createReaderRouter } from './public-site/reader-routes';
import { SnapshotPublishedRoundups } from './public-site/published-roundup-source';
import type { PublishedRoundup } from './public-site/published-roundup';
import { readerAssetsFrom } from './public-site/reader-assets';
import { createSubscriberPages } from './mail/subscriber-pages';
import { installHumanMessages } from '../shared/schemas/human-messages';
import { createPreviewRouter, notPublishedFallback, servePublishedPages } from './publishing/public-routes';

export interface CreateAppOptions {
  dataSource: DataSource;
  env: Env;
  /** Serve the built client from this folder (production); omitted in API tests and in development. */
  clientDir?: string;
  /** The clock sessions are timed by (tests move it); the system clock when omitted. */
  now?: () => number;
  /** The services built once by the caller (server start-up shares them with jobs); built here when omitted. */
  services?: Services;
}

/** Builds the Express app (no listen): API, then the built client. Tests import this. */
export function createApp({
  dataSource,
  env,
  clientDir,
  now,
  services = createServices(dataSource, env),
}: CreateAppOptions) {
  // Field errors in API answers read as words a person can act on, the same as the forms'.
  installHumanMessages();
  const secureCookie = secureCookieFor(env);
  const context: AppContext = { dataSource, env, services };

  const app = express();
  app.disable('x-powered-by');
  // Published reader pages first, from memory with their own fixed headers: no middleware in their way.
  app.use(servePublishedPages(services.publishedPages));
  app.set('trust proxy', parseTrustProxy(env.TRUST_PROXY));
  app.use(securityHeaders(secureCookie));

  const api = new ApiRegistry();
  registerFeatureRoutes(api, context);
  app.locals.api = api;

  app.use(
    '/api',
    express.json({ limit: '1mb' }),
    verifyOrigin,
    authenticate(services.sessions, { absoluteMs: env.SESSION_ABSOLUTE_DAYS * 86_400_000, now }),
  );
  app.use(api.router);
  app.use('/api', apiNotFound);

  // The reader site: server-rendered pages under /read (see server/public-site/public-paths.ts for the URL map).
  app.use(
    createReaderRouter({
      dataSource,
      files: services.files,
      // Every reader page reads published roundups as frozen at their latest publication.
      source: new SnapshotPublishedRoundups(
        dataSource,
        async () => (await services.publishing.publishedModels()) as PublishedRoundup[],
      ),
      assets: readerAssetsFrom(clientDir),
      publicSiteUrl: env.PUBLIC_SITE_URL,
      photoFile: (photoId, size) => services.photos.file(photoId, size),
    }),
  );
  app.use(createPreviewRouter(services.publishing));

  // After every reader-site route: public addresses with nothing published answer 404.
  app.use(notPublishedFallback(services.publishing.publicPrefixes));

  // Readers' subscription pages: sign-up, confirmation, self-service and one-click unsubscribe (server-rendered).
  app.use(
    createSubscriberPages({
      subscribers: services.subscribers,
      outletName: services.subscribers.outletName,
      signUpLimiter: services.signUpLimiter,
    }),
  );

  if (clientDir && existsSync(resolve(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h', setHeaders: immutableAssets }));
    app.get('/{*splat}', (_req, res) =>
      res.sendFile(resolve(clientDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } }),
    );
  }
  app.use(errorHandler);
  return app;
}

function immutableAssets(res: express.Response, path: string) {
  if (path.includes('/assets/')) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
}
