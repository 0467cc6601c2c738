import { PassThrough } from 'node:stream';
import { ZipArchive } from 'archiver';
import { buildBundle } from '../build-bundle';
import type { BundleContent } from '../bundle-content';
import { readZipEntries, type ZipEntryBytes } from '../zip-reader';

async function collect(write: (out: PassThrough) => Promise<unknown>): Promise<Buffer> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (chunk: Buffer) => chunks.push(chunk));
  await write(out);
  return Buffer.concat(chunks);
}

export const bundleBuffer = (content: BundleContent) => collect((out) => buildBundle(content, out));

/** Rewrites a zip with its entries changed by `edit`, as someone tampering with a bundle would. */
export async function rewriteZip(zip: Buffer, edit: (entries: ZipEntryBytes[]) => ZipEntryBytes[]): Promise<Buffer> {
  const entries = edit(await readZipEntries(zip));
  return collect(async (out) => {
    const archive = new ZipArchive({ zlib: { level: 9 } });
    archive.pipe(out);
    for (const entry of entries) archive.append(entry.bytes, { name: entry.name });
    await archive.finalize();
  });
}

/**
 * Renames an entry in place in the raw bytes (local header and central directory). The zip writer
 * cleans names such as ../x, so an unsafe name can only be planted this way; the names must have the
 * same length.
 */
export function renameEntryBytes(zip: Buffer, from: string, to: string): Buffer {
  if (from.length !== to.length) throw new Error('the names must have the same length');
  const copy = Buffer.from(zip);
  const needle = Buffer.from(from, 'utf8');
  let found = 0;
  for (let at = copy.indexOf(needle); at >= 0; at = copy.indexOf(needle, at + 1)) {
    copy.write(to, at, 'utf8');
    found++;
  }
  if (found !== 2)
    throw new Error(`expected "${from}" twice (local header and central directory), found it ${found} times`);
  return copy;
}
