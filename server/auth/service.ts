import type { Db } from '../db/client.js';
import type { LoginInput, SignupInput } from '../../shared/schemas/auth.js';
import { conflict, unauthorised } from '../errors.js';
import { checkPassword, DUMMY_HASH, hashPassword } from './passwords.js';
import { findUserByEmail, insertOrganisation, insertUser } from './repository.js';

/** Sign up: a new organisation with the signer as its owner. Returns the new user's id. */
export async function signup(db: Db, input: SignupInput): Promise<number> {
  if (await findUserByEmail(db, input.email)) {
    throw conflict('An account with this e-mail already exists', { email: 'Already registered: sign in or reset the password' });
  }
  const passwordHash = await hashPassword(input.password);
  try {
    return await db.transaction(async (tx) => {
      const organisationId = await insertOrganisation(tx as unknown as Db, input.organisation);
      return insertUser(tx as unknown as Db, { organisationId, email: input.email, name: input.name, passwordHash, role: 'owner' });
    });
  } catch (err: any) {
    if (err?.cause?.code === 'ER_DUP_ENTRY' || err?.code === 'ER_DUP_ENTRY') {
      throw conflict('An account with this e-mail already exists', { email: 'Already registered' });
    }
    throw err;
  }
}

/** Checks a password; the same message whether the e-mail is unknown, the password wrong or the account disabled. */
export async function login(db: Db, input: LoginInput): Promise<number> {
  const user = await findUserByEmail(db, input.email);
  const ok = await checkPassword(input.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok || user.disabled) throw unauthorised('E-mail or password is not right');
  return user.id;
}
