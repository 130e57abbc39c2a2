import type { Db } from '../db/client.js';
import type { LoginInput } from '../../shared/schemas/auth.js';
import { unauthorised } from '../errors.js';
import { checkPassword, DUMMY_HASH } from './passwords.js';
import { findUserByEmail } from './repository.js';

/** Checks a password; the same message whether the e-mail is unknown, the password wrong or the account disabled. */
export async function login(db: Db, input: LoginInput): Promise<number> {
  const user = await findUserByEmail(db, input.email);
  const ok = await checkPassword(input.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok || user.disabled) throw unauthorised('E-mail or password is not right');
  return user.id;
}
