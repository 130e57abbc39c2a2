/**
 * Pixel size of a PNG or JPEG read from its header, so a logo keeps its proportions in the layout
 * without decoding the image (layout stays pure and cheap).
 */

/** Width and height in pixels, or null when the bytes are not a PNG/JPEG we can read. */
export function imageSize(bytes: Uint8Array, mime: 'image/png' | 'image/jpeg'): { w: number; h: number } | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (mime === 'image/png') {
    if (bytes.length < 24 || view.getUint32(0) !== 0x89504e47) return null;
    return { w: view.getUint32(16), h: view.getUint32(20) };
  }
  let i = 2;
  while (i + 9 < bytes.length) {
    if (bytes[i] !== 0xff) return null;
    const marker = bytes[i + 1];
    const length = view.getUint16(i + 2);
    // Start-of-frame markers C0–CF carry the size, except DHT (C4), JPG (C8) and DAC (CC).
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return { w: view.getUint16(i + 7), h: view.getUint16(i + 5) };
    }
    i += 2 + length;
  }
  return null;
}
