/**
 * Typed calls for signing up, in and out, invitations and password reset. Responses are
 * parsed with the shared schemas, so a contract drift fails here, not inside a view.
 */
import { invitationInfoSchema, type AcceptInvitationInput, type InvitationInfo } from '../../shared/schemas/members.js';
import { meSchema, type LoginInput, type Me, type ResetPasswordInput, type SignupInput } from '../../shared/schemas/auth.js';
import { ApiError, forgetCsrfToken, json, send } from './http.js';

/** The signed-in member and their organisation, or null when nobody is signed in (401). */
export async function fetchMe(): Promise<Me | null> {
  try {
    return await json(meSchema, 'GET', '/api/auth/me');
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export async function signIn(input: LoginInput): Promise<void> {
  await send('POST', '/api/auth/login', { body: input });
}

/** Asks for a sign-up link by e-mail (the same answer whether or not the address has an account). */
export async function signUp(input: SignupInput): Promise<void> {
  await send('POST', '/api/auth/signup', { body: input });
}

/** Opens the account from the e-mailed link: a new organisation with the signer as its owner, signed in. */
export async function confirmSignUp(token: string): Promise<void> {
  await send('POST', '/api/auth/signup/confirm', { body: { token } });
}

export async function signOut(): Promise<void> {
  try {
    await send('POST', '/api/auth/logout');
  } finally {
    // The session (and the CSRF token kept in it) is gone either way.
    forgetCsrfToken();
  }
}

/** Always succeeds for a well-formed address: the server never says whether an account exists. */
export async function requestPasswordReset(email: string): Promise<void> {
  await send('POST', '/api/auth/forgot', { body: { email } });
}

export async function resetPassword(input: ResetPasswordInput): Promise<void> {
  await send('POST', '/api/auth/reset', { body: input });
}

/** What an invitation link offers; a used, revoked or expired link answers 404. */
export async function fetchInvitation(token: string): Promise<InvitationInfo> {
  return json(invitationInfoSchema, 'GET', `/api/invitations/${encodeURIComponent(token)}`);
}

/** Creates the member from the invitation and signs them in. */
export async function acceptInvitation(input: AcceptInvitationInput): Promise<void> {
  await send('POST', '/api/invitations/accept', { body: input });
}
