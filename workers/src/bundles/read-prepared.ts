import { CsvValueError, parseCsv, parseNumberCell } from './csv';
import { PREPARED_COLUMNS, PREPARED_PATH } from './bundle-layout';
import type { SampleRole } from './bundle-content';
import type { PreparedSamples } from './recompute';

/** Where each tidy row's transformed value sits, to compare it with the recomputed one. */
export interface TransformedCell {
  readonly sample: number;
  readonly element: number;
  /** The CSV line (1 = header). */
  readonly line: number;
  readonly value: number | null;
}

/**
 * inputs/prepared.csv back into one row per sample (order of first appearance), values in the order
 * of the manifest's elements. A sample missing an element, or holding one twice, is refused by name.
 */
export function readPrepared(
  text: string,
  elements: readonly string[],
): { prepared: PreparedSamples; cells: TransformedCell[] } {
  const table = parseCsv(text, PREPARED_PATH, PREPARED_COLUMNS);
  const elementIndex = new Map(elements.map((element, j) => [element, j]));
  const order = new Map<string, number>();
  const samples: { sampleId: string; role: SampleRole; group: string | null; values: (number | undefined)[] }[] = [];
  const cells: TransformedCell[] = [];
  table.rows.forEach(([sampleId, role, group, element, valuePpm, transformedValue], r) => {
    const line = r + 2;
    const where = `${PREPARED_PATH} line ${line}`;
    if (role !== 'reference' && role !== 'unknown')
      throw new CsvValueError(`${where}: role "${role}" is neither reference nor unknown`);
    if (role === 'reference' && group === '')
      throw new CsvValueError(`${where}: reference sample "${sampleId}" has no group`);
    const j = elementIndex.get(element);
    if (j === undefined) throw new CsvValueError(`${where}: element "${element}" is not one of the run's elements`);
    let index = order.get(sampleId);
    if (index === undefined) {
      index = samples.length;
      order.set(sampleId, index);
      samples.push({ sampleId, role, group: role === 'reference' ? group : null, values: new Array(elements.length) });
    }
    const sample = samples[index];
    if (sample.role !== role || (sample.group ?? '') !== (role === 'reference' ? group : '')) {
      throw new CsvValueError(`${where}: sample "${sampleId}" changes its role or group`);
    }
    if (sample.values[j] !== undefined)
      throw new CsvValueError(`${where}: sample "${sampleId}" has "${element}" twice`);
    sample.values[j] = parseNumberCell(valuePpm, `${where}, value_ppm`);
    const value = transformedValue === '' ? null : parseNumberCell(transformedValue, `${where}, transformed_value`);
    cells.push({ sample: index, element: j, line, value });
  });
  const complete = samples.map((sample) => {
    const missing = elements.filter((_, j) => sample.values[j] === undefined);
    if (missing.length > 0)
      throw new CsvValueError(`${PREPARED_PATH}: sample "${sample.sampleId}" has no ${missing.join(', ')}`);
    return { ...sample, values: sample.values as number[] };
  });
  return { prepared: { elements, samples: complete }, cells };
}
