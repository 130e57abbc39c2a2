import { Router } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { perAddress, sharedLimit } from '../http/limits.js';
import { forgotPasswordSchema, linkTokenSchema, loginSchema, resetPasswordSchema, signupSchema } from '../../shared/schemas/auth.js';
import type { AppContext } from '../context.js';
import { unauthorised } from '../errors.js';
import { parse } from '../http/parse.js';
import { csrfToken } from './csrf.js';
import { requestPasswordReset, resetPassword } from './reset.js';
import { login } from './service.js';
import { confirmSignup, requestSignup } from './signup.js';
import { signIn } from './sign-in.js';

/**
 * Per-address and per-account limits, each pair under its own counter names (`name`). Sign-in uses
 * them against password guessing; password reset requests use a separate pair against mail flooding.
 */
function attemptLimiters(ctx: AppContext, name: string, what: string) {
  const windowMs = 15 * 60 * 1000;
  const message = `Too many ${what}; wait 15 minutes and try again`;
  const perIp = sharedLimit(ctx, {
    name: `${name}-address`,
    windowMs,
    limit: ctx.config.rateLimits.loginPerIp,
    message,
    key: (req) => ipKeyGenerator(req.ip ?? ''),
  });
  // Counted per account AND address: a stranger's wrong guesses from elsewhere can never lock the real owner out,
  // while one address guessing at one account is still stopped (and the per-address limit bounds guessing across accounts).
  const perAccount = sharedLimit(ctx, {
    name: `${name}-account`,
    windowMs,
    limit: ctx.config.rateLimits.loginPerAccount,
    message,
    key: (req) =>
      `${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}|${ipKeyGenerator(req.ip ?? '')}`,
  });
  return [perIp, perAccount];
}

export function authRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ token: csrfToken(req, res, ctx.config.sessionSecret) });
  });

  r.post('/signup', perAddress(ctx, 'signup', ctx.config.rateLimits.sendsPerHour, 'sign-ups'), async (req, res) => {
    const input = parse(signupSchema, req.body);
    // The same answer for a new and a registered address: the e-mail says which it was.
    requestSignup(ctx, input);
    res.status(202).json({ email: input.email });
  });

  r.post('/signup/confirm', perAddress(ctx, 'signup-confirm', ctx.config.rateLimits.sendsPerHour, 'sign-ups'), async (req, res) => {
    const { token } = parse(linkTokenSchema, req.body);
    const userId = await confirmSignup(ctx.db, token);
    await signIn(req, userId);
    res.status(201).json({ id: userId });
  });

  r.post('/login', ...attemptLimiters(ctx, 'login', 'sign-in attempts'), async (req, res) => {
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
  r.post('/forgot', ...attemptLimiters(ctx, 'forgot', 'password reset requests'), (req, res) => {
    const { email } = parse(forgotPasswordSchema, req.body);
    requestPasswordReset(ctx, email);
    res.status(204).end();
  });

  r.post('/reset', perAddress(ctx, 'reset', ctx.config.rateLimits.sendsPerHour, 'password resets'), async (req, res) => {
    const input = parse(resetPasswordSchema, req.body);
    await resetPassword(ctx.db, input, req.sessionID);
    res.status(204).end();
  });

  return r;
}
