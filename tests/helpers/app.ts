/**
 * Test harness for API tests: the real app on the throw-away MariaDB that `npm test` started
 * (DATABASE_URL), with a capture SMTP server of its own. Each test makes its own organisation
 * with unique e-mails, so tests never share data and can run in parallel.
 */
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import { desc, like } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import { createApp } from '../../server/app.js';
import { configFromEnv, type ServerConfig } from '../../server/config.js';
import { openDatabase, type Database } from '../../server/db/client.js';
import { smtpMailer } from '../../server/mail/mailer.js';
import { startCaptureServer, type CaptureServer } from '../../server/mail/capture.js';
import { capturedMail } from '../../server/db/schema.js';
import { hashPassword } from '../../server/auth/passwords.js';
import { insertOrganisation, insertUser } from '../../server/auth/repository.js';
import type { AppContext } from '../../server/context.js';
import type { Express } from 'express';

export interface TestApp {
  app: Express;
  ctx: AppContext;
  database: Database;
  capture: CaptureServer;
  close(): Promise<void>;
}

/** The database and context behind each app this harness started, for helpers given only the app. */
const startedApps = new WeakMap<Express, { database: Database; ctx: AppContext; capturesMail: boolean }>();

export async function startTestApp(overrides: Partial<ServerConfig> = {}): Promise<TestApp> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the tests with `npm test`');
  const database = openDatabase(databaseUrl);
  const capture = await startCaptureServer(database.db);
  const base = configFromEnv(
    {
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'test-secret-not-for-production',
      PUBLIC_BASE_URL: 'http://waymark.test',
      // Every test signs up and invites from one address; the send limits have their own test.
      RATE_SENDS_HOUR: '100000',
    },
    {
      smtp: { host: '127.0.0.1', port: capture.port, from: 'Waymark <no-reply@waymark.test>' },
      devMail: true,
    },
  );
  // Each app counts its own rate limits in the shared store, as it did in memory; apps meant to share pass one scope.
  const rateLimitScope = `test-${randomUUID().slice(0, 8)}:`;
  const config: ServerConfig = { ...base, rateLimitScope, ...overrides, rateLimits: { ...base.rateLimits, ...(overrides.rateLimits ?? {}) } };
  const mailer = smtpMailer({ ...config.smtp, tagOrganisation: config.devMail });
  const ctx: AppContext = { config, database, db: database.db, mailer };
  const built = createApp(ctx);
  startedApps.set(built.app, { database, ctx, capturesMail: config.smtp.port === capture.port });
  return {
    app: built.app,
    ctx,
    database,
    capture,
    async close() {
      await built.close();
      mailer.close();
      await capture.close();
      await database.close();
    },
  };
}

export const uniqueEmail = (prefix = 'user') => `${prefix}-${randomUUID().slice(0, 12)}@example.test`;
export const TEST_PASSWORD = 'correct-horse-battery';

/** A supertest agent that keeps its cookie and sends the CSRF token on every write. */
export interface Client {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  get(path: string): request.Test;
  post(path: string, body?: unknown): request.Test;
  put(path: string, body?: unknown): request.Test;
  patch(path: string, body?: unknown): request.Test;
  delete(path: string): request.Test;
}

export async function client(app: Express): Promise<Client> {
  const agent = request.agent(app);
  const res = await agent.get('/api/auth/csrf').expect(200);
  const csrf = res.body.token as string;
  return {
    agent,
    csrf,
    get: (p) => agent.get(p),
    post: (p, b) =>
      agent
        .post(p)
        .set('X-CSRF-Token', csrf)
        .send(b as object),
    put: (p, b) =>
      agent
        .put(p)
        .set('X-CSRF-Token', csrf)
        .send(b as object),
    patch: (p, b) =>
      agent
        .patch(p)
        .set('X-CSRF-Token', csrf)
        .send(b as object),
    delete: (p) => agent.delete(p).set('X-CSRF-Token', csrf),
  };
}

/**
 * PUTs `body` to `path` against the revision a GET of `path` reads now, as a form opened just before saving
 * would (sites, organisation settings, sheet layouts and the print offset refuse a save without `baseRevision`).
 */
export async function putAtCurrentRevision(c: Client, path: string, body: object, status = 200): Promise<request.Response> {
  const { revision } = (await c.get(path).expect(200)).body as { revision: number };
  return c.put(path, { ...body, baseRevision: revision }).expect(status);
}

/** An owner account made straight in the database, as a used sign-up link makes it (for apps that cannot mail). */
export async function insertOwnerAccount(database: Database, email: string, organisation = 'Test Electrical', name = 'Test Owner'): Promise<number> {
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const organisationId = await insertOrganisation(database.db, organisation);
  return insertUser(database.db, { organisationId, email, name, passwordHash, role: 'owner' });
}

/** Signs up a new organisation through its e-mail link and returns its owner's signed-in client. */
export async function signupOwner(app: Express, organisation = 'Test Electrical', name = 'Test Owner'): Promise<Client & { email: string }> {
  const c = await client(app);
  const email = uniqueEmail('owner');
  const started = startedApps.get(app);
  if (!started) throw new Error('signupOwner needs an app from startTestApp (it reads the sign-up link from its captured mail)');
  if (!started.capturesMail) {
    // An app whose relay is down on purpose cannot mail the link: make the account as the link would, then sign in.
    await insertOwnerAccount(started.database, email, organisation, name);
    await c.post('/api/auth/login', { email, password: TEST_PASSWORD }).expect(200);
    return Object.assign(c, { email });
  }
  await c.post('/api/auth/signup', { organisation, name, email, password: TEST_PASSWORD }).expect(202);
  const mail = await mailText(started.database, email);
  await c.post('/api/auth/signup/confirm', { token: linkToken(mail.text, started.ctx.config.publicBaseUrl, 'signup') }).expect(201);
  return Object.assign(c, { email });
}

/** The decoded text of the newest message to an address, once at least `count` have arrived. */
export async function mailText(database: Database, address: string, count = 1, timeoutMs = 5000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const messages = await mailTo(database, address);
    if (messages.length >= count) {
      const parsed = await simpleParser(messages[0].raw);
      return { subject: parsed.subject ?? '', text: parsed.text ?? '', row: messages[0] };
    }
    if (Date.now() > deadline) throw new Error(`fewer than ${count} mail(s) to ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The token of the first `${base}/${kind}/<token>` link in a text. */
export function linkToken(text: string, base: string, kind: 'invite' | 'reset' | 'signup'): string {
  const escaped = base.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
  const m = text.match(new RegExp(`${escaped}/${kind}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${kind} link in: ${text}`);
  return m[1];
}

/** Messages the capture server stored for an address, newest first. */
export async function mailTo(database: Database, address: string) {
  return database.db
    .select()
    .from(capturedMail)
    .where(like(capturedMail.envelopeTo, `%${address}%`))
    .orderBy(desc(capturedMail.id));
}

/** Waits for a message to an address (SMTP delivery is asynchronous to the request). */
export async function waitForMail(database: Database, address: string, timeoutMs = 5000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [m] = await mailTo(database, address);
    if (m) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
}
