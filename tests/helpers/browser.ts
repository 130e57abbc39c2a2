/**
 * Harness for real-browser tests: the real server (API and the built client from `dist/`)
 * on a free port of the throw-away MariaDB that `npm test` started, a capture SMTP server so
 * invitation and reset mail can be read, and Debian's Chromium driven by playwright-core.
 * It adds no data of its own: each test signs up its own organisation. Build the client first:
 * `WAYMARK_BUILD=1 npm test -- tests/e2e/x.test.ts`.
 */
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { configFromEnv, type ServerConfig } from '../../server/config.js';
import { openDatabase, type Database } from '../../server/db/client.js';
import { linkToken, mailText } from './app.js';
import { startCaptureServer, type CaptureServer } from '../../server/mail/capture.js';
import { startServer, type RunningServer } from '../../server/server.js';

const root = join(import.meta.dirname, '..', '..');
const clientDir = join(root, 'dist');

/** Flags for Chromium in a container: no sandbox, no GPU, and nothing that phones home. */
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface PageOptions {
  viewport?: { width: number; height: number };
  /** False for a visitor whose browser runs no script (or whose script never arrived). */
  javaScriptEnabled?: boolean;
}

export interface BrowserApp {
  /** `http://127.0.0.1:<port>`, also the server's public base URL (links in mail point here). */
  baseUrl: string;
  server: RunningServer;
  /** A pool of its own on the test database, for reading captured mail (see `waitForMail`). */
  database: Database;
  capture: CaptureServer;
  browser: Browser;
  /** Requests the pages tried to make to any other origin; they are blocked and listed here. */
  outsideRequests: string[];
  /** Uncaught errors thrown in any page's scripts. */
  pageErrors: Error[];
  /** A fresh page in its own browser context (own cookies), 1280×800 unless told otherwise. */
  newPage(options?: PageOptions): Promise<Page>;
  close(): Promise<void>;
}

/** A port free right now: the server gets it up front so its public base URL is known before it starts. */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

async function serverConfig(databaseUrl: string, smtpPort: number, overrides: Partial<ServerConfig>): Promise<ServerConfig> {
  const port = await freePort();
  const base = configFromEnv(
    {
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'browser-test-secret-not-for-production',
      PORT: String(port),
      PUBLIC_BASE_URL: `http://127.0.0.1:${port}`,
      RATE_SENDS_HOUR: '100000',
    },
    { clientDir, devMail: true, smtp: { host: '127.0.0.1', port: smtpPort, from: 'Waymark <no-reply@waymark.test>' } },
  );
  // Each app counts its own rate limits in the shared store (other suites sign in from the same address).
  const rateLimitScope = `browser-${randomUUID().slice(0, 8)}:`;
  return { ...base, rateLimitScope, ...overrides, rateLimits: { ...base.rateLimits, ...(overrides.rateLimits ?? {}) } };
}

/** Starts server, mail capture and browser; `close()` stops all three (call it in `afterAll`). */
export async function startBrowserApp(overrides: Partial<ServerConfig> = {}): Promise<BrowserApp> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the tests with `npm test`');
  if (!existsSync(join(clientDir, 'index.html'))) throw new Error('No built client in dist/: run with WAYMARK_BUILD=1 npm test -- <file>');
  const database = openDatabase(databaseUrl, { connectionLimit: 4 });
  const capture = await startCaptureServer(database.db);
  const server = await startServer(await serverConfig(databaseUrl, capture.port, overrides));
  const baseUrl = server.ctx.config.publicBaseUrl;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
  const contexts: BrowserContext[] = [];
  const outsideRequests: string[] = [];
  const pageErrors: Error[] = [];

  async function newPage(options: PageOptions = {}): Promise<Page> {
    const context = await browser.newContext({
      baseURL: baseUrl,
      viewport: options.viewport ?? { width: 1280, height: 800 },
      locale: 'en-GB',
      javaScriptEnabled: options.javaScriptEnabled ?? true,
    });
    contexts.push(context);
    // Generous waits: the tests share two cores with builds and other suites.
    context.setDefaultTimeout(60_000);
    await context.route('**/*', (route) => {
      const url = route.request().url();
      if (url.startsWith(baseUrl) || url.startsWith('data:') || url.startsWith('blob:')) return route.continue();
      outsideRequests.push(url);
      return route.abort('blockedbyclient');
    });
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err));
    return page;
  }

  return {
    baseUrl,
    server,
    database,
    capture,
    browser,
    outsideRequests,
    pageErrors,
    newPage,
    async close() {
      for (const context of contexts) await context.close().catch(() => {});
      await browser.close().catch(() => {});
      await server.stop();
      await capture.close();
      await database.close();
    },
  };
}

export interface SignedInPage {
  page: Page;
  email: string;
  password: string;
  organisation: string;
}

/**
 * A new page already signed in as the owner of a fresh organisation, signed up through the
 * API in that page's context (so its cookie is the page's). For tests that start past sign-in.
 */
export async function signedInOwnerPage(app: BrowserApp, organisation = 'Test Electrical', options?: PageOptions): Promise<SignedInPage> {
  const page = await app.newPage(options);
  const email = `owner-${crypto.randomUUID().slice(0, 12)}@example.test`;
  const password = 'correct-horse-battery';
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.post('/api/auth/signup', {
    headers: { 'X-CSRF-Token': token },
    data: { organisation, name: 'Test Owner', email, password },
  });
  if (res.status() !== 202) throw new Error(`sign-up failed: ${res.status()} ${await res.text()}`);
  const mail = await mailText(app.database, email);
  const confirm = await page.request.post('/api/auth/signup/confirm', {
    headers: { 'X-CSRF-Token': token },
    data: { token: linkToken(mail.text, app.baseUrl, 'signup') },
  });
  if (confirm.status() !== 201) throw new Error(`sign-up link failed: ${confirm.status()} ${await confirm.text()}`);
  return { page, email, password, organisation };
}
