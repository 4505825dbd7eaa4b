import { expect, test, type Page } from '@playwright/test';
import type { Role } from '../shared/schemas/common';
import { clientRoutePatterns } from '../tests/support/client-routes';
import { demoAccounts } from './support/demo-accounts';
import { linkIn, openDevInbox } from './support/dev-inbox';
import { compareUnder, publicRoutePatterns } from './support/public-pages';
import { invitedWelcomeLink } from './support/invitations';
import { signInAs } from './support/sign-in';
import { uniqueEmail } from './support/unique';
import { seriousViolations } from './support/axe';

/**
 * Every staff page, in the light and the dark theme, has no serious or critical accessibility violation that
 * axe-core finds against WCAG 2.1 A and AA, and breaks no rule of the Content-Security-Policy. The pages are the
 * route table of src/app/router.tsx: a page added there without a line below fails this test.
 */
const pages: Record<string, { role: Role | null; url: string | ((page: Page) => Promise<string>) }> = {
  '/sign-in': { role: null, url: '/sign-in' },
  // A fresh invitation's welcome page, opened from the link in its mail.
  '/welcome/:token': {
    role: null,
    url: async (page) => (await invitedWelcomeLink(new URL(page.url()).origin, 'writer')).path,
  },
  '/': { role: 'editor', url: '/' },
  '/users': { role: 'admin', url: '/users' },
  '/account': { role: 'writer', url: '/account' },
  '/catalog': { role: 'editor', url: '/catalog' },
  '/catalog/new': { role: 'editor', url: '/catalog/new' },
  '/catalog/import': { role: 'editor', url: '/catalog/import' },
  // The demo outlet's first rows (server/seed): a board, a bench and a roundup.
  '/catalog/:productId': { role: 'tester', url: '/catalog/1' },
  '/catalog/:productId/edit': { role: 'editor', url: '/catalog/1/edit' },
  '/benches': { role: 'tester', url: '/benches' },
  '/benches/:benchId': { role: 'editor', url: '/benches/1' },
  '/log-check': { role: 'tester', url: '/log-check' },
  '/roundups': { role: 'editor', url: '/roundups' },
  '/roundups/new': { role: 'editor', url: '/roundups/new' },
  '/roundups/:id': { role: 'editor', url: '/roundups/1' },
  '/roundups/:id/cells/:cellId': { role: 'editor', url: firstCellWithRuns },
  '/roundups/:id/products/:entryId/photos': { role: 'tester', url: firstProductPhotos },
  // The demo's flagship roundup (the first seeded) has verdicts and approved charts.
  '/roundups/:id/verdicts': { role: 'editor', url: '/roundups/1/verdicts' },
  '/roundups/:id/charts': { role: 'editor', url: '/roundups/1/charts' },
  '/roundups/:id/readiness': { role: 'writer', url: '/roundups/1/readiness' },
  // The demo roundup in Writing (server/seed/demo-write-up.ts), as its writer: the editor with toolbar and blocks.
  '/roundups/:id/write-up': { role: 'writer', url: async (page) => (await demoWriteUp(page)).overview },
  '/roundups/:id/write-up/:sectionId': { role: 'writer', url: async (page) => (await demoWriteUp(page)).section },
  '/my-bench': { role: 'tester', url: '/my-bench' },
  // The dev inbox's list; a message open (its frame, its views) is swept in e2e/subscribers.spec.ts.
  '/dev-inbox': { role: 'admin', url: '/dev-inbox' },
  '/subscribers': { role: 'editor', url: '/subscribers' },
  '/*': { role: 'writer', url: '/no-such-page' },
};

/** A cell of the demo outlet that has runs (server/seed/demo-runs.ts), found through the API as the editor. */
async function firstCellWithRuns(page: Page): Promise<string> {
  const { roundups } = (await (await page.request.get('/api/roundups')).json()) as { roundups: { id: number }[] };
  for (const { id } of roundups) {
    const matrix = (await (await page.request.get(`/api/roundups/${id}/matrix`)).json()) as {
      rows: { cells: { id: number; state: string }[] }[];
    };
    const cell = matrix.rows.flatMap((row) => row.cells).find((c) => c.state === 'accepted' || c.state === 'recorded');
    if (cell) return `/roundups/${id}/cells/${cell.id}`;
  }
  throw new Error('The demo outlet has no cell with runs.');
}

/** The write-up of the demo roundup in Writing and its first drafted product section (photo, results, caution). */
async function demoWriteUp(page: Page): Promise<{ overview: string; section: string }> {
  const { roundups } = (await (await page.request.get('/api/roundups')).json()) as {
    roundups: { id: number; state: string }[];
  };
  for (const { id, state } of roundups) {
    if (state !== 'writing' && state !== 'in-review') continue;
    const writeUp = (await (await page.request.get(`/api/roundups/${id}/write-up`)).json()) as {
      sections: { id: number; kind: string; version: number }[];
    };
    const drafted = writeUp.sections.find((s) => s.kind === 'product' && s.version > 1) ?? writeUp.sections[0];
    if (drafted) return { overview: `/roundups/${id}/write-up`, section: `/roundups/${id}/write-up/${drafted.id}` };
  }
  throw new Error('The demo outlet has no roundup with a write-up.');
}

/** The photos page of the demo roundup's first product, with its upload form (testers add photos). */
async function firstProductPhotos(page: Page): Promise<string> {
  const roundup = (await (await page.request.get('/api/roundups/1')).json()) as { entries: { id: number }[] };
  return `/roundups/1/products/${roundup.entries[0].id}/photos`;
}

/**
 * Pages not yet in the sweep, each with its reason. A page leaves this list when it joins `pages` above; a new page in
 * neither list fails the next test.
 */
const notYetSwept: Record<string, string> = {};

test('every page of the staff app is listed here', () => {
  const missing = clientRoutePatterns().filter((pattern) => !(pattern in pages) && !(pattern in notYetSwept));
  expect(missing, 'pages of src/app/router.tsx without a line in accessibility.spec.ts').toEqual([]);
});

/** CSP refusals the browser reports on the console while the page loads and runs. */
function watchPolicy(page: Page): string[] {
  const refusals: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) refusals.push(`${page.url()}: ${message.text()}`);
  });
  return refusals;
}

for (const theme of ['light', 'dark'] as const) {
  test(`every staff page in the ${theme} theme: no serious or critical violation, nothing the CSP refuses`, async ({
    browser,
  }) => {
    test.setTimeout(300_000);
    const found: string[] = [];
    const byRole = new Map<Role | null, string[]>();
    for (const [pattern, entry] of Object.entries(pages)) {
      byRole.set(entry.role, [...(byRole.get(entry.role) ?? []), pattern]);
    }
    for (const [role, patterns] of byRole) {
      const context = await browser.newContext({ colorScheme: theme });
      const page = await context.newPage();
      const refusals = watchPolicy(page);
      if (role) await signInAs(page, role);
      for (const pattern of patterns) {
        const { url } = pages[pattern];
        const address = typeof url === 'string' ? url : await url(page);
        await page.goto(address);
        await expect(page.locator('h1').first()).toBeVisible();
        await page.waitForLoadState('networkidle');
        for (const violation of await seriousViolations(page)) found.push(`${address}: ${violation}`);
      }
      for (const refusal of refusals) found.push(`CSP as ${role ?? 'visitor'}: ${refusal}`);
      await context.close();
    }
    expect(found).toEqual([]);
  });
}

/**
 * The public side: every page a reader reaches without an account (the reader site under /read, the subscription
 * pages, the one-click unsubscribe page, a signed preview), in the light and the dark theme (the reader site follows
 * the browser's prefers-color-scheme), with the same bar: no serious or critical axe violation, nothing the CSP
 * refuses, and every chart beside a data table. The addresses are the `router.get(…)` lines of the public route
 * files (e2e/support/public-pages.ts): a page added there without a line below fails the listing test.
 *
 * Each line is a tour: it leaves the page in each state worth checking (a form with its errors, the page after the
 * button) and yields a label after each; the sweep checks the page at every yield.
 */
interface PublicTour {
  page: Page;
  waitForMail: Awaited<ReturnType<typeof openDevInbox>>['waitForMail'];
  /** The reader's subscription links, found along the tour (sign-up → confirm → manage → unsubscribe). */
  links: { confirm?: string; manage?: string; preview?: string };
  email: string;
}

const publicPages: Record<string, (tour: PublicTour) => AsyncGenerator<string>> = {
  '/read': async function* ({ page }) {
    await page.goto('/read');
    yield '/read';
  },
  // Every published roundup the home page and the Atom feed link to (the demo outlet publishes two).
  '/read/roundups/:slug': async function* ({ page }) {
    for (const address of await feedAndHomeRoundups(page)) {
      await page.goto(address);
      const charts = await chartsWithoutTables(page);
      expect(charts.count, `${address} draws its results as charts`).toBeGreaterThan(0);
      expect(charts.problems, `${address}: every chart has its data table`).toEqual([]);
      yield address;
    }
  },
  '/read/products/:slug': async function* ({ page }) {
    const [roundup] = await feedAndHomeRoundups(page);
    await page.goto(roundup);
    const product = await page.locator('main a[href^="/read/products/"]').first().getAttribute('href');
    expect(product, 'the roundup page links to its boards').toBeTruthy();
    const path = (product as string).split('?')[0];
    await page.goto(path);
    yield path;
    // The estimate form answered, then refused with its messages (GET form, as a reader submits it).
    await page.goto(`${path}?power=230&room=22`);
    await expect(page.locator('.estimate-result')).toBeVisible();
    yield `${path} with an estimate`;
    await page.goto(`${path}?power=5&room=`);
    yield `${path} with the estimate form's errors`;
  },
  '/read/compare': async function* ({ page }) {
    await page.goto('/read/compare');
    yield '/read/compare';
    // One board only: the form says what is missing.
    const form = page.locator('form.reader-form');
    await page.getByLabel('Korvath KV Ridgeline B50').check();
    await form.getByRole('button', { name: 'Compare' }).click();
    await expect(page.getByText('Choose at least two boards.')).toBeVisible();
    yield '/read/compare with its errors';
    // Two boards of the demo outlet under one load (as e2e/reader-site.spec.ts compares them).
    await page.getByLabel('Tarnwell Wend B50').check();
    await compareUnder(page, 'HX-16 stock, all-core load', form);
    await expect(page.getByRole('table', { name: /hottest VRM reading over the room/ })).toBeVisible();
    const charts = await chartsWithoutTables(page);
    expect(charts.count, 'the comparison is drawn as a chart').toBeGreaterThan(0);
    expect(charts.problems, 'every chart of the comparison has its data table').toEqual([]);
    yield '/read/compare with two boards';
  },
  '/read/{*rest}': async function* ({ page }) {
    await page.goto('/read/no-such-page');
    yield '/read/no-such-page (not found)';
  },
  '/subscribe': async function* ({ page, email }) {
    await page.goto('/subscribe');
    yield '/subscribe';
    await page.getByRole('button', { name: 'Subscribe' }).click();
    await expect(page.getByRole('alert')).toBeVisible();
    yield '/subscribe with its errors';
    await page.getByLabel('E-mail address').fill(email);
    await page.getByRole('checkbox').first().check();
    await page.getByRole('button', { name: 'Subscribe' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Check your inbox' })).toBeVisible();
    yield '/subscribe answered';
  },
  '/subscribe/confirm/:token': async function* ({ page, waitForMail, links, email }) {
    links.confirm = linkIn(await waitForMail(email, /^Confirm your subscription/), '/subscribe/confirm/');
    await page.goto(links.confirm);
    yield '/subscribe/confirm/…';
    await page.getByRole('button', { name: 'Confirm my subscription' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'You are subscribed' })).toBeVisible();
    yield '/subscribe/confirm/… confirmed';
    links.manage = (await page.getByRole('link', { name: 'Your subscription' }).getAttribute('href')) ?? undefined;
  },
  '/subscribe/manage/:token': async function* ({ page, links }) {
    expect(links.manage, 'the confirmed page links to the subscription page').toBeTruthy();
    await page.goto(links.manage as string);
    yield '/subscribe/manage/…';
    await page.getByRole('checkbox', { checked: true }).first().uncheck();
    await page.getByRole('button', { name: 'Save subjects' }).click();
    yield '/subscribe/manage/… with its error';
  },
  '/unsubscribe/:token': async function* ({ page, links }) {
    const token = (links.manage as string).split('/').pop() as string;
    await page.goto(`/unsubscribe/${token}`);
    yield '/unsubscribe/…';
    await page.getByRole('button', { name: 'Unsubscribe' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'You are unsubscribed' })).toBeVisible();
    yield '/unsubscribe/… done';
  },
  // A signed preview of an unpublished roundup: what a reviewer outside the outlet opens without an account.
  '/preview/:token': async function* ({ page, links }) {
    await page.goto(links.preview as string);
    await expect(page.locator('h1').first()).toBeVisible();
    yield '/preview/…';
  },
};

/** Public addresses that answer files, not pages: nothing for axe to read. */
const notPages: Record<string, string> = {
  '/read/roundups/:slug/results.csv': 'open data (CSV)',
  '/read/roundups/:slug/analysis.json': 'open data (JSON)',
  '/read/roundups/:slug/raw/:file': 'a raw logger file',
  '/read/photos/:photoId/:size': 'a photo',
  '/read/roundups/:slug/charts/:image': 'a chart image frozen at publication (its data table is on the roundup page)',
  '/read/feed.atom': 'the Atom feed: every page it links to is swept with /read/roundups/:slug',
  '/sitemap.xml': 'for crawlers',
  '/robots.txt': 'for crawlers',
  '/subscribe/manage/:token/export.json': "the reader's data export (JSON)",
};

test('every public page is listed here', () => {
  const declared = publicRoutePatterns();
  expect(declared.length).toBeGreaterThan(10);
  const missing = declared.filter((pattern) => !(pattern in publicPages) && !(pattern in notPages));
  expect(missing, 'public pages without a line in accessibility.spec.ts').toEqual([]);
});

/** The published roundup pages the home page and the Atom feed link to, as site paths. */
async function feedAndHomeRoundups(page: Page): Promise<string[]> {
  const feed = await (await page.request.get('/read/feed.atom')).text();
  const fromFeed = [...feed.matchAll(/<link[^>]*href="([^"]+)"/g)]
    .map((m) => new URL(m[1]).pathname)
    .filter((path) => path.startsWith('/read/roundups/'));
  await page.goto('/read');
  const fromHome = await page
    .locator('main a[href^="/read/roundups/"]')
    .evaluateAll((links) => links.map((a) => (a as HTMLAnchorElement).pathname));
  const all = [...new Set([...fromFeed, ...fromHome])].filter((path) => !/\.(csv|json)$/.test(path));
  expect(fromFeed.length, 'the feed links to published roundups').toBeGreaterThan(0);
  return all;
}

/**
 * Every chart on the page (a canvas, an SVG drawing wider than an icon, or an element marked `data-chart`) and the
 * ones without a data table: the table must sit in the chart's figure, carry a caption and hold a row per bar.
 */
async function chartsWithoutTables(page: Page): Promise<{ count: number; problems: string[] }> {
  return page.evaluate(() => {
    const charts = new Set<Element>();
    for (const element of document.querySelectorAll('[data-chart], canvas, svg')) {
      if (
        element instanceof SVGElement &&
        element.getBoundingClientRect().width <= 64 &&
        !element.closest('[data-chart]')
      )
        continue;
      charts.add(element.closest('[data-chart]') ?? element);
    }
    const problems: string[] = [];
    for (const chart of charts) {
      const name = chart.id || chart.getAttribute('aria-labelledby') || chart.tagName;
      const figure = chart.closest('figure') ?? chart;
      const table = figure.querySelector('table');
      if (!table) problems.push(`${name}: no data table in its figure`);
      else if (!table.querySelector('caption')?.textContent?.trim()) problems.push(`${name}: the table has no caption`);
      else {
        const bars = figure.querySelectorAll('svg.static-chart rect.bar').length;
        const rows = table.querySelectorAll('tbody tr').length;
        if (rows === 0 || rows < bars) problems.push(`${name}: ${bars} bars but ${rows} table rows`);
      }
    }
    return { count: charts.size, problems };
  });
}

for (const theme of ['light', 'dark'] as const) {
  test(`every public page in the ${theme} theme: no serious or critical violation, nothing the CSP refuses, a table for every chart`, async ({
    browser,
    playwright,
    baseURL,
  }) => {
    test.setTimeout(300_000);
    const { api, waitForMail } = await openDevInbox(playwright, baseURL as string);
    // A signed preview of the demo flagship roundup, made as the editor.
    const editor = await playwright.request.newContext({
      baseURL,
      extraHTTPHeaders: { Origin: baseURL as string },
    });
    const { email, password } = demoAccounts.editor;
    expect((await editor.post('/api/auth/sign-in', { data: { email, password } })).status()).toBe(200);
    const preview = await editor.post('/api/roundups/1/preview-links', { data: { hours: 1 } });
    expect(preview.status(), await preview.text()).toBe(201);
    const previewPath = ((await preview.json()) as { path: string }).path;
    await editor.dispose();

    const context = await browser.newContext({ colorScheme: theme });
    const page = await context.newPage();
    const refusals = watchPolicy(page);
    const tour: PublicTour = {
      page,
      waitForMail,
      links: { preview: previewPath },
      email: uniqueEmail(`reader-${theme}`),
    };
    const found: string[] = [];
    for (const [pattern, visit] of Object.entries(publicPages)) {
      for await (const label of visit(tour)) {
        await expect(page.locator('h1').first(), `${pattern}: ${label}`).toBeVisible();
        await page.waitForLoadState('networkidle');
        for (const violation of await seriousViolations(page)) found.push(`${label}: ${violation}`);
      }
    }
    for (const refusal of refusals) found.push(`CSP on the public pages: ${refusal}`);
    await context.close();
    await api.dispose();
    expect(found).toEqual([]);
  });
}
