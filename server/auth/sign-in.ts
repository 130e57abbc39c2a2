/** Turning a checked identity into a signed-in session: shared by sign-up, sign-in and accepting an invitation. */
import type { Request } from 'express';

/** Starts a fresh session for the user (a new id stops session fixation). The CSRF token lives in its own cookie and stays valid. */
export async function signIn(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await saveSession(req);
}

/** Writes the session to the store before the answer goes out, so the next request finds it. */
export function saveSession(req: Request): Promise<void> {
  return new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}
