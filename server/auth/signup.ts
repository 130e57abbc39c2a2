/**
 * Sign-up by e-mail link. The answer to a sign-up is the same whether or not the address already
 * has an account, and comes before any lookup: a new address gets a link that opens the account,
 * a registered one gets a note saying so (with the way to reset its password). Nothing of the
 * account exists until the link is used, so a stranger cannot open an account on someone else's address.
 */
import { inTransaction } from '../db/client.js';
import type { AppContext } from '../context.js';
import type { Db } from '../db/client.js';
import type { SignupInput } from '../../shared/schemas/auth.js';
import { AppError, invalid } from '../errors.js';
import { deliver } from '../mail/mailer.js';
import { alreadyRegisteredMessage, signupLinkMessage } from '../mail/messages.js';
import { hashPassword, hashToken, newLinkToken } from './passwords.js';
import { findUserByEmail, insertOrganisation, insertUser } from './repository.js';
import { insertSignupRequest, lockSignupRequest, markSignupRequestUsed } from './signup-repository.js';

/** One day: long enough to find the mail on site, short enough that a forgotten link lapses. */
export const SIGNUP_LIFETIME_MS = 24 * 60 * 60 * 1000;

async function sendSignupMail(ctx: AppContext, input: SignupInput, now: Date): Promise<void> {
  // Hashed in both cases, so the work done does not depend on whether the address is known.
  const passwordHash = await hashPassword(input.password);
  const existing = await findUserByEmail(ctx.db, input.email);
  if (existing) {
    const link = `${ctx.config.publicBaseUrl}/forgot`;
    await deliver(
      ctx.mailer,
      existing.email,
      existing.organisationId,
      alreadyRegisteredMessage({ name: existing.name, email: existing.email, link, because: 'signup' }),
    );
    return;
  }
  const token = newLinkToken();
  const expiresAt = new Date(now.getTime() + SIGNUP_LIFETIME_MS);
  await insertSignupRequest(ctx.db, {
    email: input.email,
    name: input.name,
    organisationName: input.organisation,
    passwordHash,
    tokenHash: token.hash,
    expiresAt,
  });
  const link = `${ctx.config.publicBaseUrl}/signup/${token.raw}`;
  // Mail for no organisation yet: the capture page shows it to nobody, so with no relay the link goes to the server's log.
  if (ctx.config.devMail) console.log(`No mail relay: the sign-up link for ${input.email} is ${link}`);
  await deliver(ctx.mailer, input.email, null, signupLinkMessage({ name: input.name, organisationName: input.organisation, link, expiresAt }));
}

/** Starts a sign-up and returns at once: the response time says nothing about the address. Failures are logged. */
export function requestSignup(ctx: AppContext, input: SignupInput, now = new Date()): void {
  sendSignupMail(ctx, input, now).catch((err) => {
    if (!(err instanceof AppError)) console.error('Sign-up for a requested address failed:', err);
  });
}

const linkNotValid = () => invalid('This sign-up link is not valid any more: sign up again', { token: 'Unknown, already used or expired' });

/** Opens the account from a link: a new organisation with the signer as its owner. Returns the user's id. */
export async function confirmSignup(db: Db, rawToken: string, now = new Date()): Promise<number> {
  const tokenHash = hashToken(rawToken);
  return inTransaction(db, async (tx) => {
    const request = await lockSignupRequest(tx, tokenHash);
    if (!request || request.usedAt || request.expiresAt.getTime() <= now.getTime()) throw linkNotValid();
    // Registered meanwhile (an invitation, or a second link used first): this link cannot open another account.
    if (await findUserByEmail(tx, request.email)) throw linkNotValid();
    await markSignupRequestUsed(tx, request.id, now);
    const organisationId = await insertOrganisation(tx, request.organisationName);
    return insertUser(tx, { organisationId, email: request.email, name: request.name, passwordHash: request.passwordHash, role: 'owner' });
  });
}
