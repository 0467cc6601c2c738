import type { ColumnMapping, DatasetMapping } from '@provenote/shared';
import type { Layout } from './layout';
import { resolveMapping } from './resolve-columns';

const options = { delimiter: ',', decimalSeparator: '.', encoding: 'utf-8', unitsRow: false, sheet: null } as const;
const oxide = (index: number, formula: string, element: string): ColumnMapping => ({
  index,
  header: `${formula} (wt%)`,
  role: 'measurement',
  element,
  unit: 'wt% oxide',
  oxide: formula,
});

// Oxide → element factors from IUPAC/CIAAW 2021 standard atomic weights, as tabled in METHODS.md §7.
const METHODS_TABLE: [string, string, number][] = [
  ['SiO2', 'Si', 0.4674],
  ['TiO2', 'Ti', 0.5993],
  ['Al2O3', 'Al', 0.5293],
  ['Fe2O3', 'Fe', 0.6994],
  ['FeO', 'Fe', 0.7773],
  ['MnO', 'Mn', 0.7745],
  ['MgO', 'Mg', 0.603],
  ['CaO', 'Ca', 0.7147],
  ['Na2O', 'Na', 0.7419],
  ['K2O', 'K', 0.8302],
  ['P2O5', 'P', 0.4364],
];

function layoutOf(width: number): Layout {
  const headers = Array.from({ length: width }, (_, i) => `c${i}`);
  return {
    headers,
    duplicateHeaders: [],
    unitsRow: null,
    firstDataRow: 2,
    width,
    decimalSeparator: '.',
    fingerprint: '',
    notes: [],
  };
}

const sample: ColumnMapping = { index: 0, header: 'Sample', role: 'sample_id', element: null, unit: null, oxide: null };

describe('resolveMapping', () => {
  it.each(METHODS_TABLE)('%s wt%% → %s ppm uses the factor %d × 10⁴ (METHODS.md §7)', (formula, element, factor) => {
    const mapping: DatasetMapping = { options, columns: [sample, oxide(1, formula, element)] };
    const [column] = resolveMapping(mapping, layoutOf(2), null).measurements;
    expect(column.factorToPpm / 1e4).toBeCloseTo(factor, 4);
  });

  it('gives plain units their factor to ppm', () => {
    const units = ['ppm', 'mg/kg', 'µg/g', 'ppb', 'wt% element'] as const;
    const columns: ColumnMapping[] = units.map((unit, i) => ({
      index: i + 1,
      header: unit,
      role: 'measurement',
      element: ['Zr', 'Nb', 'Rb', 'La', 'Fe'][i],
      unit,
      oxide: null,
    }));
    const resolved = resolveMapping({ options, columns: [sample, ...columns] }, layoutOf(6), null);
    expect(resolved.measurements.map((c) => c.factorToPpm)).toEqual([1, 1, 1, 1e-3, 1e4]);
  });

  it('lists everything that does not fit the file or the kind of dataset', () => {
    const mapping: DatasetMapping = {
      options,
      columns: [{ ...sample, index: 5 }, oxide(1, 'SiO2', 'Al'), oxide(2, 'ZrO2', 'Zr')],
    };
    expect(() => resolveMapping(mapping, layoutOf(3), 'reference')).toThrow(
      'The mapping does not fit the file: column 6 ("Sample") is not in the file; reference data need a group column; ' +
        '"SiO2 (wt%)": SiO2 is not an oxide of Al; "ZrO2 (wt%)": "ZrO2" is not an oxide formula of a known element',
    );
  });
});
