import { Router, type RequestHandler } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { perAddress } from '../http/limits.js';
import { forgotPasswordSchema, linkTokenSchema, loginSchema, resetPasswordSchema, signupSchema } from '../../shared/schemas/auth.js';
import type { AppContext } from '../context.js';
import { tooMany, unauthorised } from '../errors.js';
import { parse } from '../http/parse.js';
import { csrfToken } from './csrf.js';
import { requestPasswordReset, resetPassword } from './reset.js';
import { login } from './service.js';
import { confirmSignup, requestSignup } from './signup.js';
import { signIn } from './sign-in.js';

/**
 * Per-IP and per-account limits (each call makes its own counters). Sign-in uses them against
 * password guessing; password reset requests use a separate pair against mail flooding.
 */
function attemptLimiters(ctx: AppContext, what: string) {
  const windowMs = 15 * 60 * 1000;
  const handler: RequestHandler = (_req, _res, next) => next(tooMany(`Too many ${what}; wait 15 minutes and try again`, windowMs / 1000));
  const perIp = rateLimit({ windowMs, limit: ctx.config.rateLimits.loginPerIp, standardHeaders: 'draft-7', legacyHeaders: false, handler });
  // Counted per account AND address: a stranger's wrong guesses from elsewhere can never lock the real owner out,
  // while one address guessing at one account is still stopped (and the per-address limit bounds guessing across accounts).
  const perAccount = rateLimit({
    windowMs,
    limit: ctx.config.rateLimits.loginPerAccount,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) =>
      `account:${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}|${ipKeyGenerator(req.ip ?? '')}`,
    handler,
  });
  return [perIp, perAccount];
}

export function authRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ token: csrfToken(req, res, ctx.config.sessionSecret) });
  });

  r.post('/signup', perAddress(ctx.config.rateLimits.sendsPerHour, 'sign-ups'), async (req, res) => {
    const input = parse(signupSchema, req.body);
    // The same answer for a new and a registered address: the e-mail says which it was.
    requestSignup(ctx, input);
    res.status(202).json({ email: input.email });
  });

  r.post('/signup/confirm', perAddress(ctx.config.rateLimits.sendsPerHour, 'sign-ups'), async (req, res) => {
    const { token } = parse(linkTokenSchema, req.body);
    const userId = await confirmSignup(ctx.db, token);
    await signIn(req, userId);
    res.status(201).json({ id: userId });
  });

  r.post('/login', ...attemptLimiters(ctx, 'sign-in attempts'), async (req, res) => {
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

  // Always 204, known address or not: the answer must not tell who has an account.
  r.post('/forgot', ...attemptLimiters(ctx, 'password reset requests'), (req, res) => {
    const { email } = parse(forgotPasswordSchema, req.body);
    requestPasswordReset(ctx, email);
    res.status(204).end();
  });

  r.post('/reset', perAddress(ctx.config.rateLimits.sendsPerHour, 'password resets'), async (req, res) => {
    const input = parse(resetPasswordSchema, req.body);
    await resetPassword(ctx.db, input, req.sessionID);
    res.status(204).end();
  });

  return r;
}
