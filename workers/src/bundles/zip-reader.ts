import yauzl from 'yauzl';

export interface ZipEntryBytes {
  /** The name exactly as stored, decoded but not cleaned, so an unsafe name can be reported as it is. */
  readonly name: string;
  readonly bytes: Buffer;
}

/** No single file of a bundle comes near this; a larger entry is refused rather than inflated in memory. */
export const MAX_ENTRY_BYTES = 1024 ** 3;

const UTF8_NAME_FLAG = 0x800;

function openZip(buffer: Buffer): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) =>
    // decodeStrings off: yauzl would otherwise stop at the first unsafe name; the verifier names them all.
    yauzl.fromBuffer(buffer, { lazyEntries: true, decodeStrings: false, validateEntrySizes: true }, (error, zip) =>
      error ? reject(error) : resolve(zip),
    ),
  );
}

function readEntry(zip: yauzl.ZipFile, entry: yauzl.Entry): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    zip.openReadStream(entry, (error, stream) => {
      if (error) return reject(error);
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', reject);
      stream.on('end', () => resolve(Buffer.concat(chunks)));
    }),
  );
}

export class BundleArchiveError extends Error {
  override readonly name = 'BundleArchiveError';
}

/** Every file entry of a zip with its bytes; directory entries (names ending in "/") are left out. */
export async function readZipEntries(buffer: Buffer): Promise<ZipEntryBytes[]> {
  let zip: yauzl.ZipFile;
  try {
    zip = await openZip(buffer);
  } catch (error) {
    throw new BundleArchiveError(`not a readable zip archive: ${(error as Error).message}`);
  }
  const entries: ZipEntryBytes[] = [];
  return new Promise((resolve, reject) => {
    const fail = (error: Error) => {
      zip.close();
      reject(new BundleArchiveError(`the zip archive is damaged: ${error.message}`));
    };
    zip.on('error', fail);
    zip.on('end', () => resolve(entries));
    zip.on('entry', (entry: yauzl.Entry) => {
      const name = entry.fileNameRaw.toString((entry.generalPurposeBitFlag & UTF8_NAME_FLAG) !== 0 ? 'utf8' : 'latin1');
      if (name.endsWith('/')) return zip.readEntry();
      if (entry.uncompressedSize > MAX_ENTRY_BYTES) {
        return fail(new Error(`entry "${name}" would inflate to ${entry.uncompressedSize} bytes`));
      }
      readEntry(zip, entry).then((bytes) => {
        entries.push({ name, bytes });
        zip.readEntry();
      }, fail);
    });
    zip.readEntry();
  });
}
