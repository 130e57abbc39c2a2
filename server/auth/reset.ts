/**
 * Password reset by e-mail. Asking never reveals whether an account exists: the answer is
 * the same and comes before any lookup. The link is single use, lasts an hour, and using it
 * ends the account's other sessions (someone who knew the old password is signed out).
 */
import { inTransaction } from '../db/client.js';
import type { AppContext } from '../context.js';
import type { Db } from '../db/client.js';
import type { ResetPasswordInput } from '../../shared/schemas/auth.js';
import { AppError, invalid } from '../errors.js';
import { deliver } from '../mail/mailer.js';
import { passwordResetMessage } from '../mail/messages.js';
import { hashPassword, hashToken, newLinkToken } from './passwords.js';
import { deleteSessionsOfUser, findUserByEmail, insertPasswordReset, lockPasswordReset, retirePasswordResets, setPasswordHash } from './repository.js';

/** One hour, as the reset e-mail says. */
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

/** Creates the link and sends it, if the address belongs to an active account. */
async function sendResetLink(ctx: AppContext, email: string, now: Date): Promise<void> {
  const user = await findUserByEmail(ctx.db, email);
  if (!user || user.disabled) return;
  const token = newLinkToken();
  const expiresAt = new Date(now.getTime() + RESET_LIFETIME_MS);
  await insertPasswordReset(ctx.db, { userId: user.id, tokenHash: token.hash, expiresAt });
  const link = `${ctx.config.publicBaseUrl}/reset/${token.raw}`;
  await deliver(ctx.mailer, user.email, user.organisationId, passwordResetMessage({ name: user.name, email: user.email, link, expiresAt }));
}

/**
 * Starts a reset and returns at once, without waiting for the lookup or the mail, so the
 * response time says nothing about whether the account exists. Failures are logged.
 */
export function requestPasswordReset(ctx: AppContext, email: string, now = new Date()): void {
  sendResetLink(ctx, email, now).catch((err) => {
    // A mail failure is logged where it happens; log only what else went wrong.
    if (!(err instanceof AppError)) console.error('Password reset for a requested address failed:', err);
  });
}

const linkNotValid = () =>
  invalid('This reset link is not valid any more: ask for a new one', {
    token: 'Unknown, already used or expired',
  });

/** Sets the new password from a link; the session making the request (if any) stays signed in. */
export async function resetPassword(db: Db, input: ResetPasswordInput, currentSessionId: string, now = new Date()): Promise<void> {
  // The token is checked before the password is hashed, so a made-up token costs no hashing CPU;
  // the transaction below checks it again under its lock.
  const found = await lockPasswordReset(db, hashToken(input.token));
  if (!found || found.usedAt || found.expiresAt.getTime() <= now.getTime() || found.userDisabled) throw linkNotValid();
  const passwordHash = await hashPassword(input.password);
  const userId = await inTransaction(db, async (tx) => {
    const reset = await lockPasswordReset(tx, hashToken(input.token));
    if (!reset || reset.usedAt || reset.expiresAt.getTime() <= now.getTime() || reset.userDisabled) throw linkNotValid();
    await setPasswordHash(tx, reset.userId, passwordHash);
    await retirePasswordResets(tx, reset.userId, now);
    return reset.userId;
  });
  // After the commit: any session made from now on was made with the new password.
  await deleteSessionsOfUser(db, userId, currentSessionId);
}
