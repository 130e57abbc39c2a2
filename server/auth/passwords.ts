import bcrypt from 'bcryptjs';
import { createHash, randomBytes } from 'node:crypto';

/** bcrypt cost: 10 is the floor we accept; raise it as machines get faster. */
export const BCRYPT_COST = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_COST);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/** A single-use token for a link: the raw value goes in the e-mail, only its hash is stored. */
export function newLinkToken(): { raw: string; hash: string } {
  const raw = randomBytes(32).toString('base64url');
  return { raw, hash: hashToken(raw) };
}

export function hashToken(raw: string): string {
  return createHash('sha256').update(raw).digest('hex');
}

/** A hash to compare against when the account does not exist, so timing does not reveal it. */
export const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_COST);
