import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import type { Role } from '../shared/schemas/common';
import { clientRoutePatterns } from '../tests/support/client-routes';
import { signInAs } from './support/sign-in';

/**
 * Every staff page, in the light and the dark theme, has no serious or critical accessibility violation that
 * axe-core finds against WCAG 2.1 A and AA, and breaks no rule of the Content-Security-Policy. The pages are the
 * route table of src/app/router.tsx: a page added there without a line below fails this test.
 */
const pages: Record<string, { role: Role | null; url: string | ((page: Page) => Promise<string>) }> = {
  '/sign-in': { role: null, url: '/sign-in' },
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
    if (/Content Security Policy/i.test(message.text())) refusals.push(message.text());
  });
  return refusals;
}

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map(
      (violation) =>
        `${violation.id} (${violation.impact}): ${violation.help} — ${violation.nodes
          .slice(0, 3)
          .map((node) => node.target.join(' '))
          .join(' | ')}`,
    );
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
