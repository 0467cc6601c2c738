import { FileRejectedError } from './import-errors';

export interface ZipLimits {
  maxEntries: number;
  maxUncompressedBytes: number;
  /** Largest uncompressed/compressed ratio allowed for an entry over 1 MB. */
  maxRatio: number;
}

export const DEFAULT_ZIP_LIMITS: ZipLimits = { maxEntries: 2000, maxUncompressedBytes: 512 * 1024 ** 2, maxRatio: 200 };

const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const CENTRAL_FILE_HEADER = 0x02014b50;

/**
 * Reads an .xlsx's zip central directory, before any decompression, and refuses archives that would
 * unpack to far more than they weigh (a zip bomb), hold too many entries, or are not zips at all.
 * ZIP64 is refused too: a workbook under the upload limit never needs it.
 */
export function assertSafeZip(bytes: Buffer, limits: ZipLimits = DEFAULT_ZIP_LIMITS): void {
  const notWorkbook = () => new FileRejectedError('not-a-workbook', 'This .xlsx file is not a readable Excel workbook');
  if (bytes.length < 22 || bytes.readUInt32LE(0) !== 0x04034b50) throw notWorkbook();
  let end = -1;
  for (let i = bytes.length - 22; i >= Math.max(0, bytes.length - 22 - 65535); i--) {
    if (bytes.readUInt32LE(i) === END_OF_CENTRAL_DIRECTORY) {
      end = i;
      break;
    }
  }
  if (end < 0) throw notWorkbook();
  const entries = bytes.readUInt16LE(end + 10);
  const directoryOffset = bytes.readUInt32LE(end + 16);
  if (entries === 0xffff || directoryOffset === 0xffffffff) throw notWorkbook();
  if (entries > limits.maxEntries) {
    throw new FileRejectedError(
      'zip-bomb',
      `The workbook holds ${entries} parts; at most ${limits.maxEntries} are read`,
    );
  }
  let offset = directoryOffset;
  let total = 0;
  for (let n = 0; n < entries; n++) {
    if (offset + 46 > bytes.length || bytes.readUInt32LE(offset) !== CENTRAL_FILE_HEADER) throw notWorkbook();
    const compressed = bytes.readUInt32LE(offset + 20);
    const uncompressed = bytes.readUInt32LE(offset + 24);
    total += uncompressed;
    const ratioTooHigh = uncompressed > 1024 ** 2 && uncompressed > limits.maxRatio * Math.max(compressed, 1);
    if (ratioTooHigh || total > limits.maxUncompressedBytes) {
      throw new FileRejectedError(
        'zip-bomb',
        'The workbook would unpack to far more data than it holds; it was not opened',
      );
    }
    offset += 46 + bytes.readUInt16LE(offset + 28) + bytes.readUInt16LE(offset + 30) + bytes.readUInt16LE(offset + 32);
  }
}
