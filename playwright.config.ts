import { defineConfig } from '@playwright/test';

// `npm test` sets DATABASE_URL to a throwaway, seeded database and E2E_PORT to a free port.
const port = Number(process.env.E2E_PORT ?? 3100);

export default defineConfig({
  testDir: 'e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.CI ? 'line' : 'list',
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    // Dates and times follow the browser's locale; the specs read them as a British English user sees them.
    locale: 'en-GB',
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
        '--disable-quic',
      ],
    },
  },
  projects: [{ name: 'desktop', use: { viewport: { width: 1280, height: 800 } } }],
  webServer: {
    // The built server, as `npm start` runs it (`npm test -- e2e` builds it first when its sources changed).
    command: 'node --enable-source-maps dist/server/index.js',
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: {
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      COOKIE_SECURE: 'false',
      DATABASE_URL: process.env.DATABASE_URL ?? '',
      // The local relay npm test started (its dev inbox is where e2e specs read mail).
      SMTP_URL: process.env.SMTP_URL ?? '',
      LOCAL_MAIL_RELAY: process.env.LOCAL_MAIL_RELAY ?? '',
      // The e2e suite signs in many times from one address.
      SIGN_IN_LIMIT_PER_IP: '1000',
      SIGN_IN_LIMIT_PER_ACCOUNT: '1000',
    },
  },
});
