/**
 * Builds the Express app; `index.ts` listens. Tests import this to drive the app with supertest.
 */
import express, { type Express } from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import type { AppContext } from './context.js';
import { sessionMiddleware } from './auth/session.js';
import { loadUser } from './auth/guard.js';
import { requireCsrf } from './auth/csrf.js';
import { apiRoutes } from './routes.js';
import { errorHandler, notFound } from './errors.js';
import { dynamicCompression } from './http/compression.js';
import { clientShellHtml, serveClient } from './http/static.js';
import { boardPageDocumentRoutes } from './public/page-route.js';
import './http/context.js';

export interface BuiltApp {
  app: Express;
  close(): Promise<void>;
}

export function createApp(ctx: AppContext): BuiltApp {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', ctx.config.trustProxy);
  const documentHeaders = helmet({
    contentSecurityPolicy: {
      directives: {
        'img-src': ["'self'", 'data:', 'blob:'],
        'frame-src': ["'self'", 'blob:'],
        'object-src': ["'self'", 'blob:'],
        'upgrade-insecure-requests': null,
      },
    },
  });
  // A built script, stylesheet or font is never a document: the policy headers only a page (or a frame) obeys
  // are left off, ~600 bytes on each of the dozen files a first visit on a weak signal fetches. What still
  // applies to a sub-resource stays: no type sniffing, same-origin only, no referrer from a stylesheet's fonts.
  const assetHeaders = helmet({
    contentSecurityPolicy: false,
    crossOriginOpenerPolicy: false,
    originAgentCluster: false,
    strictTransportSecurity: false,
    xDnsPrefetchControl: false,
    xDownloadOptions: false,
    xFrameOptions: false,
    xPermittedCrossDomainPolicies: false,
    xXssProtection: false,
  });
  app.use((req, res, next) => (req.path.startsWith('/assets/') ? assetHeaders(req, res, next) : documentHeaders(req, res, next)));
  app.use(express.json({ limit: '5mb' }));
  const sessions = sessionMiddleware(ctx.database.pool, ctx.config.sessionSecret);
  // Reading a board page needs no session: skipping it there roughly doubles what the busiest
  // public route can serve. Every other API request, and every write, goes through the session.
  const withSession: express.RequestHandler = (req, res, next) =>
    req.method === 'GET' && req.path.startsWith('/public/') ? next() : sessions.middleware(req, res, next);
  app.use('/api', dynamicCompression(), cookieParser(), withSession, loadUser(ctx.db), requireCsrf(ctx.config.sessionSecret), apiRoutes(ctx));
  app.use('/api', (_req, _res, next) => next(notFound('No such API route')));

  const shell = clientShellHtml(ctx.config.clientDir);
  if (shell) app.use(boardPageDocumentRoutes(ctx, shell));
  serveClient(app, ctx.config.clientDir);
  app.use(errorHandler);
  return { app, close: () => sessions.close() };
}
