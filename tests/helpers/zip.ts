/**
 * A small ZIP reader written from the format's published description (PKWARE APPNOTE.TXT 4.3):
 * find the end-of-central-directory record, walk the central directory in its order, and inflate
 * each entry from its local header. Independent of the archiver that wrote the file.
 */
import { inflateRawSync } from 'node:zlib';

export interface ZipFile {
  name: string;
  data: Buffer;
}

/** The entries in the order the central directory lists them (the order they were written). */
export function readZipEntries(zip: Buffer): ZipFile[] {
  const eocd = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06])); // APPNOTE 4.3.16 signature 0x06054b50
  if (eocd < 0) throw new Error('not a ZIP: no end of central directory');
  const count = zip.readUInt16LE(eocd + 10);
  let at = zip.readUInt32LE(eocd + 16);
  const files: ZipFile[] = [];
  for (let i = 0; i < count; i++) {
    if (zip.readUInt32LE(at) !== 0x02014b50) throw new Error('bad central directory entry'); // APPNOTE 4.3.12
    const method = zip.readUInt16LE(at + 10);
    const compressed = zip.readUInt32LE(at + 20);
    const size = zip.readUInt32LE(at + 24);
    const nameLength = zip.readUInt16LE(at + 28);
    const extraLength = zip.readUInt16LE(at + 30);
    const commentLength = zip.readUInt16LE(at + 32);
    const local = zip.readUInt32LE(at + 42);
    const name = zip.subarray(at + 46, at + 46 + nameLength).toString('utf8');
    if (zip.readUInt32LE(local) !== 0x04034b50) throw new Error('bad local header'); // APPNOTE 4.3.7
    const start = local + 30 + zip.readUInt16LE(local + 26) + zip.readUInt16LE(local + 28);
    const raw = zip.subarray(start, start + compressed);
    const data = method === 8 ? inflateRawSync(raw) : method === 0 ? Buffer.from(raw) : null; // 8 = deflate, 0 = stored
    if (!data || data.length !== size) throw new Error(`cannot read ${name}`);
    files.push({ name, data });
    at += 46 + nameLength + extraLength + commentLength;
  }
  return files;
}
