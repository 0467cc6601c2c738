import {
  type DatasetKind,
  type DatasetMapping,
  type StoredColumn,
  oxideToElementFactor,
  parseOxide,
} from '@provenote/shared';
import { MappingError } from './import-errors';
import type { Layout } from './layout';

const PPM_PER_UNIT = { ppm: 1, 'mg/kg': 1, 'µg/g': 1, ppb: 1e-3, 'wt% element': 1e4 } as const;

export interface ResolvedMapping {
  sampleIdIndex: number;
  groupIndex: number | null;
  measurements: StoredColumn[];
  /** Every measurement is in ppm already (factor 1): a row's original values are its ppm values. */
  allInPpm: boolean;
  /** Note columns, keyed by header (by header and position where a header repeats). */
  attributes: { index: number; key: string }[];
}

/**
 * Checks a confirmed mapping against the file and works out each measurement's factor to ppm. Oxide
 * factors come from the engine (standard atomic weights), never from a table here.
 */
export function resolveMapping(mapping: DatasetMapping, layout: Layout, kind: DatasetKind | null): ResolvedMapping {
  const problems: string[] = [];
  const seen = new Set<number>();
  for (const column of mapping.columns) {
    if (column.index >= layout.width)
      problems.push(`column ${column.index + 1} ("${column.header}") is not in the file`);
    if (seen.has(column.index)) problems.push(`column ${column.index + 1} is mapped twice`);
    seen.add(column.index);
  }
  const byRole = (role: string) => mapping.columns.filter((column) => column.role === role);
  const sampleIds = byRole('sample_id');
  if (sampleIds.length !== 1) problems.push(`choose exactly one sample id column (${sampleIds.length} chosen)`);
  const groups = byRole('group');
  if (groups.length > 1) problems.push('choose at most one group column');
  if (kind === 'reference' && groups.length === 0) problems.push('reference data need a group column');
  if (kind === 'unknowns' && groups.length > 0)
    problems.push('unknowns have no group column; map it as a note instead');

  const measurements: StoredColumn[] = [];
  const elements = new Map<string, string>();
  for (const column of byRole('measurement')) {
    const element = column.element ?? '';
    const unit = column.unit ?? 'ppm';
    let factorToPpm: number;
    let oxide: string | null = null;
    if (unit === 'wt% oxide') {
      try {
        const parsed = parseOxide(column.oxide ?? '');
        if (parsed.element !== element)
          problems.push(`"${column.header}": ${column.oxide} is not an oxide of ${element}`);
        oxide = column.oxide;
        factorToPpm = oxideToElementFactor(column.oxide ?? '') * 1e4;
      } catch (error) {
        problems.push(`"${column.header}": ${error instanceof Error ? error.message : String(error)}`);
        continue;
      }
    } else {
      factorToPpm = PPM_PER_UNIT[unit];
    }
    const clash = elements.get(element);
    if (clash !== undefined) problems.push(`"${clash}" and "${column.header}" both measure ${element}; leave one out`);
    elements.set(element, column.header);
    measurements.push({ index: column.index, header: column.header, element, unit, oxide, factorToPpm });
  }
  if (measurements.length === 0 && problems.length === 0) problems.push('choose at least one measurement column');
  if (problems.length > 0) throw new MappingError(problems);
  return {
    sampleIdIndex: sampleIds[0].index,
    groupIndex: groups[0]?.index ?? null,
    measurements,
    allInPpm: measurements.every((column) => column.factorToPpm === 1),
    attributes: byRole('attribute').map(({ index, header }) => ({
      index,
      key: layout.duplicateHeaders.includes(header) ? `${header} (column ${index + 1})` : header,
    })),
  };
}
