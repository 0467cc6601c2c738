import { FileRejectedError } from './import-errors';

export type TextEncoding = 'utf-8' | 'windows-1252';

const UTF8_BOM = [0xef, 0xbb, 0xbf];

function hasUtf8Bom(bytes: Uint8Array): boolean {
  return bytes.length >= 3 && UTF8_BOM.every((byte, i) => bytes[i] === byte);
}

/**
 * Text files from instruments are mostly plain bytes: a NUL or many control characters near the start
 * mean a binary file (an instrument's native format, an image, an .xls) that must not be read as numbers.
 */
function looksBinary(bytes: Uint8Array): boolean {
  const sample = bytes.subarray(0, 65536);
  let control = 0;
  for (const byte of sample) {
    if (byte === 0) return true;
    if (byte < 0x09 || (byte > 0x0d && byte < 0x20)) control++;
  }
  return control > sample.length / 100;
}

/** The file's encoding as detected: a BOM or valid UTF-8 means UTF-8, anything else is read as Windows Latin-1. */
export function detectEncoding(bytes: Uint8Array): TextEncoding {
  if (hasUtf8Bom(bytes)) return 'utf-8';
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return 'utf-8';
  } catch {
    return 'windows-1252';
  }
}

/** Decodes a text file; the BOM is dropped so it never sticks to the first header. */
export function decodeText(bytes: Uint8Array, encoding: TextEncoding): string {
  if (bytes.length === 0) throw new FileRejectedError('empty-file', 'The file is empty');
  if (looksBinary(bytes)) {
    throw new FileRejectedError('binary-file', 'This is not a text table (CSV or TSV) or an .xlsx workbook');
  }
  const body = encoding === 'utf-8' && hasUtf8Bom(bytes) ? bytes.subarray(3) : bytes;
  return new TextDecoder(encoding).decode(body);
}
