'use strict';
/** Writes rows the way laboratory files look: detection limits as "<DL", "n.d." where not determined. */
const { COLUMNS } = require('./scenario.cjs');

const NOT_DETERMINED = 'n.d.';

function formatNumber(value, decimals, decimalSeparator) {
  const text = value.toFixed(decimals);
  return decimalSeparator === '.' ? text : text.replace('.', decimalSeparator);
}

/** A measured value, "<DL" below the column's detection limit, or "n.d." when the element was not determined. */
function formatCell(value, column, notDetermined, decimalSeparator) {
  if (notDetermined) return NOT_DETERMINED;
  if (!Number.isFinite(value) || value < 0) throw new Error(`${column.name}: cannot write ${value}`);
  if (column.detectionLimit !== null && value < column.detectionLimit) {
    return `<${formatNumber(column.detectionLimit, decimalPlaces(column.detectionLimit), decimalSeparator)}`;
  }
  return formatNumber(value, column.decimals, decimalSeparator);
}

function decimalPlaces(value) {
  const text = String(value);
  return text.includes('.') ? text.length - text.indexOf('.') - 1 : 0;
}

function elementCells(row, decimalSeparator) {
  return COLUMNS.map((column, j) => formatCell(row.values[j], column, row.notDetermined === j, decimalSeparator));
}

/** Comma-separated, decimal point, units in the header ("SiO2 (wt%)"), LF line ends. */
function standardCsv(leading, rows) {
  const header = [...leading.map((field) => field.header), ...COLUMNS.map((c) => `${c.name} (${c.unit})`)];
  const lines = rows.map((row) => [...leading.map((field) => field.cell(row, '.')), ...elementCells(row, '.')]);
  return [header, ...lines].map((cells) => cells.join(',')).join('\n') + '\n';
}

/**
 * The European-convention export of a spreadsheet: semicolons, decimal commas, bare element names with a
 * units row under them, CRLF line ends.
 */
function europeanCsv(leading, rows) {
  const header = [...leading.map((field) => field.euHeader), ...COLUMNS.map((c) => c.name)];
  const units = [...leading.map((field) => field.euUnit), ...COLUMNS.map((c) => c.unit)];
  const lines = rows.map((row) => [...leading.map((field) => field.cell(row, ',')), ...elementCells(row, ',')]);
  return [header, units, ...lines].map((cells) => cells.join(';')).join('\r\n') + '\r\n';
}

module.exports = { standardCsv, europeanCsv, formatNumber, NOT_DETERMINED };
