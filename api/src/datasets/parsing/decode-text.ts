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

/**
 * Decodes a text file in the given encoding, or, without one, in the encoding detected: a BOM or valid
 * UTF-8 means UTF-8, anything else is read as Windows Latin-1. The BOM is dropped so it never sticks to the
 * first header. A detected UTF-8 file is decoded once, by the same pass that checks it.
 */
export function decodeText(bytes: Uint8Array, encoding: TextEncoding | null): { text: string; encoding: TextEncoding } {
  if (bytes.length === 0) throw new FileRejectedError('empty-file', 'The file is empty');
  if (looksBinary(bytes)) {
    throw new FileRejectedError('binary-file', 'This is not a text table (CSV or TSV) or an .xlsx workbook');
  }
  const bom = hasUtf8Bom(bytes);
  if (encoding === null) {
    try {
      return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes), encoding: 'utf-8' };
    } catch {
      if (bom) return { text: new TextDecoder('utf-8').decode(bytes), encoding: 'utf-8' };
      return { text: new TextDecoder('windows-1252').decode(bytes), encoding: 'windows-1252' };
    }
  }
  const body = encoding === 'utf-8' && bom ? bytes.subarray(3) : bytes;
  return { text: new TextDecoder(encoding).decode(body), encoding };
}
