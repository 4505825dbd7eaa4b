import { copyFile, mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { clientRoutePatterns } from '../support/client-routes';
import { registeredRoutes } from './support/registered-routes';
import { TEST_HOST, testDataSource, testEnv } from './support/test-app';

/**
 * Every HTML page the server answers — each staff-app route from src/app/router.tsx and each page route the
 * server registers outside /api — carries a strict Content-Security-Policy and the other protective headers.
 * Sources: CSP Level 3 (W3C) for the directives; OWASP Secure Headers Project for the header set.
 */

let clientDir: string;
type App = ReturnType<typeof createApp>;

beforeAll(async () => {
  // The real index.html and one built-looking asset: the headers do not depend on the client build.
  clientDir = await mkdtemp(join(tmpdir(), 'benchwire-client-'));
  await copyFile(resolve(import.meta.dirname, '..', '..', 'index.html'), join(clientDir, 'index.html'));
  await mkdir(join(clientDir, 'assets'));
  await writeFile(join(clientDir, 'assets', 'app-test.js'), 'console.log(1);');
});

afterAll(async () => {
  await rm(clientDir, { recursive: true, force: true });
});

async function appFor(overrides: Parameters<typeof testEnv>[0] = {}) {
  return createApp({ dataSource: await testDataSource(), env: testEnv(overrides), clientDir });
}

/** GET routes the server registers outside /api (server-rendered pages, feeds), with parameters filled in. */
function serverPages(app: App): string[] {
  return registeredRoutes(app)
    .filter((route) => route.method === 'GET' && !route.path.startsWith('/api') && !route.path.includes('*'))
    .map((route) => route.path);
}

const concrete = (pattern: string) =>
  pattern
    .replace(/:(\w+)/g, '1')
    .replace(/\{[^}]*\}/g, '')
    .replace(/\*$/, 'no-such-page');

/** The CSP as directive → sources. */
function parseCsp(header: string | undefined): Record<string, string[]> {
  const directives: Record<string, string[]> = {};
  for (const part of (header ?? '').split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) directives[name] = sources;
  }
  return directives;
}

function expectProtectiveHeaders(response: request.Response, label: string) {
  const csp = parseCsp(response.headers['content-security-policy']);
  expect(Object.keys(csp).length, `${label}: Content-Security-Policy`).toBeGreaterThan(0);
  // CSP Level 3: without 'unsafe-inline' (or a nonce/hash source), inline <script>, on* attributes and
  // javascript: URLs do not run; object-src 'none' stops plugins; frame-ancestors 'none' stops framing.
  for (const directive of ['script-src', 'style-src']) {
    expect(csp[directive], `${label}: ${directive}`).toBeDefined();
    expect(csp[directive], `${label}: ${directive}`).not.toContain("'unsafe-inline'");
    expect(csp[directive], `${label}: ${directive}`).not.toContain("'unsafe-eval'");
    expect(csp[directive], `${label}: ${directive}`).not.toContain('*');
  }
  expect(csp['default-src'], label).toEqual(["'self'"]);
  expect(csp['object-src'], label).toEqual(["'none'"]);
  expect(csp['base-uri'], label).toEqual(["'self'"]);
  expect(csp['frame-ancestors'], label).toEqual(["'none'"]);
  expect(csp['form-action'], label).toEqual(["'self'"]);
  expect(response.headers['x-content-type-options'], label).toBe('nosniff');
  expect(response.headers['x-frame-options'], label).toBe('DENY');
  expect(response.headers['referrer-policy'], label).toBe('same-origin');
  expect(response.headers['x-powered-by'], label).toBeUndefined();
}

describe('security headers', () => {
  it('the route table lists the staff pages (a broken reader would pass vacuously)', () => {
    const patterns = clientRoutePatterns();
    expect(patterns).toEqual(expect.arrayContaining(['/', '/sign-in', '/catalog', '/roundups/:id']));
  });

  it('every HTML page of the staff app and of the server carries the strict policy', async () => {
    const app = await appFor();
    const pages = [...clientRoutePatterns(), ...serverPages(app)].map(concrete);
    let html = 0;
    for (const path of pages) {
      const response = await request(app).get(path).set('Host', TEST_HOST);
      expect(response.status, path).toBeLessThan(500);
      if (!/text\/html/.test(response.headers['content-type'] ?? '')) continue;
      expectProtectiveHeaders(response, path);
      html += 1;
    }
    expect(html).toBeGreaterThanOrEqual(clientRoutePatterns().length);
  });

  it('the served index.html has no inline script or style the policy would block', async () => {
    const response = await request(await appFor())
      .get('/')
      .set('Host', TEST_HOST);
    expect(response.text).not.toMatch(/<script(?![^>]*\bsrc=)[^>]*>/i);
    expect(response.text).not.toMatch(/<style\b|\sstyle=|\son[a-z]+=/i);
  });

  it('API answers, assets and errors carry them too (a JSON answer opened as a page stays inert)', async () => {
    const app = await appFor();
    for (const path of ['/api/health', '/api/no-such-route', '/api/auth/session', '/assets/app-test.js']) {
      expectProtectiveHeaders(await request(app).get(path).set('Host', TEST_HOST), path);
    }
  });

  it('on HTTPS (production), HSTS is sent and plain-HTTP subresources are upgraded; on plain HTTP neither', async () => {
    const secure = await request(await appFor({ NODE_ENV: 'production', COOKIE_SECURE: 'auto' }))
      .get('/')
      .set('Host', TEST_HOST);
    expect(secure.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(parseCsp(secure.headers['content-security-policy'])).toHaveProperty(['upgrade-insecure-requests']);
    const plain = await request(await appFor())
      .get('/')
      .set('Host', TEST_HOST);
    expect(plain.headers['strict-transport-security']).toBeUndefined();
    expect(parseCsp(plain.headers['content-security-policy'])).not.toHaveProperty(['upgrade-insecure-requests']);
  });
});
