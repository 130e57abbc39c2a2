/**
 * Decides what an uploaded file is from its first bytes, never from its name or the type the
 * browser declared: a renamed PNG is still a PNG, and a text file called logo.png is refused.
 */

export type ImageMime = 'image/png' | 'image/jpeg';

// Kept by hand rather than a file-type package: only two types are taken, and a PNG must also carry
// its IHDR chunk where the specification puts it, which signature-only detection does not check.

// PNG signature and the IHDR chunk that must follow it (ISO/IEC 15948 / PNG spec 5.2, 11.2.2).
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const PNG_IHDR = [0x49, 0x48, 0x44, 0x52];

function startsWith(bytes: Uint8Array, expected: number[], at = 0): boolean {
  if (bytes.length < at + expected.length) return false;
  return expected.every((b, i) => bytes[at + i] === b);
}

/** The image type of the bytes, or null when they are neither PNG nor JPEG. */
export function sniffImage(bytes: Uint8Array): ImageMime | null {
  if (startsWith(bytes, PNG_SIGNATURE) && startsWith(bytes, PNG_IHDR, 12)) return 'image/png';
  // JPEG: the SOI marker FF D8, then the first segment's marker prefix FF (ITU-T T.81 B.1.1.3, B.2.1).
  if (bytes.length >= 4 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  return null;
}
