/**
 * Builds the print pack's ZIP in memory. A board's PDFs are small (tens of kB), and building
 * the whole archive before answering lets a failure become a clean error response instead of
 * a truncated download.
 */
import { ZipArchive } from 'archiver';

export interface ZipEntry {
  name: string;
  data: Uint8Array | string;
}

export async function zipEntries(entries: ZipEntry[], date = new Date()): Promise<Buffer> {
  const archive = new ZipArchive({ zlib: { level: 6 } });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    archive.on('data', (chunk: Buffer) => chunks.push(chunk));
    archive.on('error', reject);
    archive.on('warning', reject);
    archive.on('end', () => resolve(Buffer.concat(chunks)));
  });
  for (const e of entries) archive.append(typeof e.data === 'string' ? e.data : Buffer.from(e.data), { name: e.name, date });
  await archive.finalize();
  return done;
}
