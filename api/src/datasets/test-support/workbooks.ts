import { deflateRawSync } from 'node:zlib';
import ExcelJS from 'exceljs';

/** A workbook as a lab's spreadsheet holds one: numbers, texts, a formula with and one without a stored result. */
export async function workbookWithFormulas(): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet('Results');
  workbook.addWorksheet('Notes').addRow(['Instrument log']);
  sheet.addRow(['Sample', 'Group', 'Zr (ppm)', 'Nb (ppm)', 'Zr/Nb']);
  sheet.addRow(['W-1', 'A', 180, 9, { formula: 'C2/D2', result: 20 }]);
  sheet.addRow(['W-2', 'A', 175.5, '<0.5', { formula: 'C3/D3' }]);
  sheet.addRow(['W-3', 'B', { formula: '100+90', result: 190 }, 'n.d.', null]);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

/**
 * A zip whose one entry is 20 MB of zeros compressed to a few kilobytes: far beyond the ratio any
 * workbook part reaches, so the guard must refuse it before decompressing anything.
 */
export function zipBomb(): Buffer {
  const name = Buffer.from('xl/worksheets/sheet1.xml');
  const size = 20 * 1024 * 1024;
  const data = deflateRawSync(Buffer.alloc(size), { level: 9 });
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt16LE(8, 8);
  local.writeUInt32LE(data.length, 18);
  local.writeUInt32LE(size, 22);
  local.writeUInt16LE(name.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(20, 4);
  central.writeUInt16LE(20, 6);
  central.writeUInt16LE(8, 10);
  central.writeUInt32LE(data.length, 20);
  central.writeUInt32LE(size, 24);
  central.writeUInt16LE(name.length, 28);
  const centralOffset = local.length + name.length + data.length;
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(central.length + name.length, 12);
  end.writeUInt32LE(centralOffset, 16);
  return Buffer.concat([local, name, data, central, name, end]);
}
