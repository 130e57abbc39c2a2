import { Router, type Request } from 'express';
import rateLimit from 'express-rate-limit';
import { loginSchema, signupSchema } from '../../shared/schemas/auth.js';
import type { AppContext } from '../context.js';
import { tooMany, unauthorised } from '../errors.js';
import { parse } from '../http/parse.js';
import { csrfToken } from './csrf.js';
import { login, signup } from './service.js';

/** Starts a fresh session for the user (a new id stops session fixation) and keeps the CSRF token. */
async function signIn(req: Request, userId: number): Promise<void> {
  const token = req.session.csrfToken;
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  if (token) req.session.csrfToken = token;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

function loginLimiters(ctx: AppContext) {
  const windowMs = 15 * 60 * 1000;
  const handler = (_req: Request, _res: unknown, next: (e: unknown) => void) =>
    next(tooMany('Too many sign-in attempts; wait 15 minutes and try again', windowMs / 1000));
  const perIp = rateLimit({ windowMs, limit: ctx.config.rateLimits.loginPerIp, standardHeaders: 'draft-7', legacyHeaders: false, handler: handler as any });
  const perAccount = rateLimit({
    windowMs, limit: ctx.config.rateLimits.loginPerAccount, standardHeaders: 'draft-7', legacyHeaders: false,
    keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: handler as any,
  });
  return [perIp, perAccount];
}

export function authRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/csrf', (req, res) => {
    res.json({ token: csrfToken(req) });
  });

  r.post('/signup', async (req, res) => {
    const input = parse(signupSchema, req.body);
    const userId = await signup(ctx.db, input);
    await signIn(req, userId);
    res.status(201).json({ id: userId });
  });

  r.post('/login', ...loginLimiters(ctx), async (req, res) => {
    const input = parse(loginSchema, req.body);
    const userId = await login(ctx.db, input);
    await signIn(req, userId);
    res.json({ id: userId });
  });

  r.post('/logout', async (req, res) => {
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('waymark.sid');
    res.status(204).end();
  });

  r.get('/me', (req, res) => {
    if (!req.user) throw unauthorised();
    const { id, email, name, role, organisationId, organisationName } = req.user;
    res.json({ user: { id, email, name, role }, organisation: { id: organisationId, name: organisationName } });
  });

  return r;
}
