import { resolve } from 'node:path';

/** Everything the server reads from its environment, read once and passed down. */
export interface ServerConfig {
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  publicBaseUrl: string;
  /** Express `trust proxy` setting: behind TLS-terminating proxies, cookies become Secure. */
  trustProxy: boolean | number | string;
  smtp: { host: string; port: number; from: string };
  /** Serves the captured-mail page and endpoint; never on in production. */
  devMail: boolean;
  /** Directory holding the built client (vite build), or null to serve the API only. */
  clientDir: string | null;
  /** Rate limits can be raised for benchmarks; tests lower them to exercise 429. */
  rateLimits: { loginPerAccount: number; loginPerIp: number; publicPerMinute: number; reportsPerHour: number; sendsPerHour: number };
  /**
   * Put before every rate-limit counter's name in the shared store: processes of one deployment share it
   * (the default, empty); another deployment on the same database, or each test app, takes its own.
   */
  rateLimitScope: string;
  /** Most one print may take, waiting for a render thread included, before it is stopped with 503. */
  printTimeLimitMs: number;
  /** Render worker threads; null: one fewer than the cores (at least one). */
  printThreads: number | null;
}

export function parseTrustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined || value === '' || value === 'false') return false;
  if (value === 'true') return true;
  const n = Number(value);
  return Number.isInteger(n) ? n : value;
}

/** True when the environment says this is a real deployment (`NODE_ENV=production`). */
export const isProduction = (env: NodeJS.ProcessEnv) => env.NODE_ENV === 'production';

/**
 * Refuses a production start that would capture real users' mail: without a relay (`SMTP_HOST`)
 * the local capture server would keep every reset link and invitation where owners can read them.
 */
export function checkProductionMail(env: NodeJS.ProcessEnv): void {
  if (isProduction(env) && !env.SMTP_HOST) {
    throw new Error('NODE_ENV=production needs a mail relay: set SMTP_HOST (and SMTP_PORT, MAIL_FROM). ' + 'Waymark does not capture mail in production.');
  }
}

/** The demo (with its published password) is seeded by default, except in production, where only WAYMARK_DEMO=on asks for it. */
export function demoWanted(env: NodeJS.ProcessEnv): boolean {
  return isProduction(env) ? env.WAYMARK_DEMO === 'on' : env.WAYMARK_DEMO !== 'off';
}

export function configFromEnv(env: NodeJS.ProcessEnv, defaults: Partial<ServerConfig> = {}): ServerConfig {
  checkProductionMail(env);
  const port = Number(env.PORT ?? defaults.port ?? 3000);
  const databaseUrl = env.DATABASE_URL ?? defaults.databaseUrl;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set');
  const sessionSecret = env.SESSION_SECRET ?? defaults.sessionSecret;
  if (!sessionSecret) throw new Error('SESSION_SECRET is not set');
  return {
    port,
    databaseUrl,
    sessionSecret,
    publicBaseUrl: (env.PUBLIC_BASE_URL ?? defaults.publicBaseUrl ?? `http://localhost:${port}`).replace(/\/+$/, ''),
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    smtp: {
      host: env.SMTP_HOST ?? defaults.smtp?.host ?? '127.0.0.1',
      port: Number(env.SMTP_PORT ?? defaults.smtp?.port ?? 2525),
      from: env.MAIL_FROM ?? defaults.smtp?.from ?? 'Waymark <no-reply@waymark.invalid>',
    },
    // Never in production, whatever else is set.
    devMail: !isProduction(env) && (env.WAYMARK_DEV_MAIL ?? (defaults.devMail ? 'on' : 'off')) === 'on',
    clientDir: env.WAYMARK_CLIENT_DIR ? resolve(env.WAYMARK_CLIENT_DIR) : (defaults.clientDir ?? null),
    rateLimits: {
      loginPerAccount: Number(env.RATE_LOGIN_ACCOUNT ?? defaults.rateLimits?.loginPerAccount ?? 10),
      loginPerIp: Number(env.RATE_LOGIN_IP ?? defaults.rateLimits?.loginPerIp ?? 50),
      publicPerMinute: Number(env.RATE_PUBLIC_MINUTE ?? defaults.rateLimits?.publicPerMinute ?? 120),
      reportsPerHour: Number(env.RATE_REPORTS_HOUR ?? defaults.rateLimits?.reportsPerHour ?? 10),
      /** Sign-ups, resets, invitation accepts, invitations and handovers an hour, per address (and per organisation for members). */
      sendsPerHour: Number(env.RATE_SENDS_HOUR ?? defaults.rateLimits?.sendsPerHour ?? 30),
    },
    rateLimitScope: env.RATE_LIMIT_SCOPE ?? defaults.rateLimitScope ?? '',
    printTimeLimitMs: Number(env.PRINT_TIME_LIMIT_MS ?? defaults.printTimeLimitMs ?? 30_000),
    printThreads: env.PRINT_THREADS ? Number(env.PRINT_THREADS) : (defaults.printThreads ?? null),
  };
}
