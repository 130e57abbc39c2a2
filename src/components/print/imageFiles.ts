/**
 * Handing images to a tape printer's phone app: the images route answers one PNG or a ZIP of them;
 * a phone's share sheet takes the PNGs themselves, so the ZIP is opened here (its entries inflated
 * with the browser's own DecompressionStream) and every PNG offered as a file, in print order.
 */

/** ZIP record signatures and offsets. // PKWARE APPNOTE.TXT 4.3.7, 4.3.12, 4.3.16 */
const EOCD = 0x06054b50;
const CENTRAL = 0x02014b50;

async function inflateRaw(bytes: Uint8Array): Promise<Uint8Array> {
  const stream = new Blob([bytes as BlobPart]).stream().pipeThrough(new DecompressionStream('deflate-raw'));
  return new Uint8Array(await new Response(stream).arrayBuffer());
}

/** The PNG entries of a ZIP as files, in the order the archive lists them (the print order). */
export async function pngsInZip(zip: Blob): Promise<File[]> {
  const bytes = new Uint8Array(await zip.arrayBuffer());
  const view = new DataView(bytes.buffer);
  let eocd = bytes.length - 22;
  while (eocd >= 0 && view.getUint32(eocd, true) !== EOCD) eocd--;
  if (eocd < 0) throw new Error('The images could not be opened');
  const count = view.getUint16(eocd + 10, true);
  let at = view.getUint32(eocd + 16, true);
  const files: File[] = [];
  for (let i = 0; i < count; i++) {
    if (view.getUint32(at, true) !== CENTRAL) throw new Error('The images could not be opened');
    const method = view.getUint16(at + 10, true);
    const size = view.getUint32(at + 20, true);
    const nameLength = view.getUint16(at + 28, true);
    const skip = nameLength + view.getUint16(at + 30, true) + view.getUint16(at + 32, true);
    const local = view.getUint32(at + 42, true);
    const name = new TextDecoder().decode(bytes.subarray(at + 46, at + 46 + nameLength));
    const start = local + 30 + view.getUint16(local + 26, true) + view.getUint16(local + 28, true);
    const raw = bytes.subarray(start, start + size);
    const data = method === 8 ? await inflateRaw(raw) : raw; // 8 = deflate, 0 = stored
    if (name.endsWith('.png')) files.push(new File([data as BlobPart], name, { type: 'image/png' }));
    at += 46 + skip;
  }
  return files;
}

/** Whether this browser can share these files (the caller offers it on a phone only; a laptop downloads). */
export function canShareToApp(files: File[]): boolean {
  return typeof navigator.canShare === 'function' && navigator.canShare({ files });
}

/**
 * Offers the images to the phone's share sheet (the printer's app is one of its targets). False when
 * this browser cannot, so the caller downloads; a share the user cancels is not a failure.
 */
export async function shareToApp(files: File[], title: string): Promise<boolean> {
  if (!canShareToApp(files)) return false;
  try {
    await navigator.share({ files, title });
  } catch (err) {
    if (!(err instanceof DOMException && err.name === 'AbortError')) throw err;
  }
  return true;
}
