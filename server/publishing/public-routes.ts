import express, { type NextFunction, type Request, type Response } from 'express';
import type { PublishedPageCache } from './published-page-cache';
import type { PublishingService } from '../services/publishing.service';

const plainPage = (title: string, text: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title></head><body><main><h1>${title}</h1><p>${text}</p></main></body></html>
`;

/**
 * Published pages through Express (API tests, and any request the lean path in server/index.ts did not answer):
 * the same in-memory answer, loaded on first use.
 */
export function servePublishedPages(pages: PublishedPageCache) {
  return async (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (!pages.isLoaded) await pages.ensureLoaded();
    if (!pages.serve(req, res)) next();
  };
}

/** Signed preview links: the unpublished page, without an account, until the link expires. */
export function createPreviewRouter(publishing: PublishingService) {
  const router = express.Router();

  router.get('/preview/:token', async (req, res) => {
    const outcome = await publishing.preview(req.params.token);
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    res.type('html');
    if (outcome.ok) {
      res.status(200).send(outcome.html);
    } else if (outcome.reason === 'expired') {
      res.status(410).send(plainPage('This preview has expired', 'Ask the editor for a new preview link.'));
    } else {
      res.status(404).send(plainPage('Page not found', 'There is no page at this address.'));
    }
  });

  return router;
}

/**
 * A plain 404 for every public address nothing answered: before its embargo a roundup's pages, feeds and files do
 * not exist as far as a reader can tell (404, never 403). Mounted after every reader-site route.
 */
export function notPublishedFallback(prefixes: readonly string[]) {
  const router = express.Router();
  const notPublished = (_req: Request, res: Response) => {
    res.status(404).setHeader('Cache-Control', 'no-cache').type('html');
    res.send(plainPage('Page not found', 'There is no page at this address.'));
  };
  for (const prefix of prefixes) {
    router.all(prefix, notPublished);
    if (!/\.[a-z]+$/.test(prefix)) router.all(`${prefix}/{*rest}`, notPublished);
  }
  return router;
}
