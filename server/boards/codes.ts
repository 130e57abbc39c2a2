/**
 * The two identifiers a board shows to the world: a short code a person reads off the tag
 * (and types or scans), and the unguessable token behind the QR code.
 */
import { randomBytes, randomInt } from 'node:crypto';

/** No 0/O, 1/I/L or U/V pairs that are easily misread on a small printed tag. */
export const CODE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTWXYZ';
export const CODE_PREFIX = 'WM-';
export const CODE_LENGTH = 6;

/** A board code such as "WM-7K3QX2": 29^6 ≈ 595 million codes, unique by index (the caller retries on a clash). */
export function newBoardCode(): string {
  let out = CODE_PREFIX;
  for (let i = 0; i < CODE_LENGTH; i++) out += CODE_ALPHABET[randomInt(CODE_ALPHABET.length)];
  return out;
}

/** 192 random bits, base64url (32 characters): far above the 128 bits a link secret needs. */
export function newPublicToken(): string {
  return randomBytes(24).toString('base64url');
}
