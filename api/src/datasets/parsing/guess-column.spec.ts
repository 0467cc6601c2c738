import { guessColumn, guessColumns } from './guess-column';

describe('guessColumn', () => {
  it.each([
    ['SiO2 (wt%)', null, 'measurement', 'Si', 'wt% oxide', 'SiO2'],
    ['Al2O3', null, 'measurement', 'Al', 'wt% oxide', 'Al2O3'],
    ['Fe2O3T', null, 'measurement', 'Fe', 'wt% oxide', 'Fe2O3'],
    ['Zr_ppm', null, 'measurement', 'Zr', 'ppm', null],
    ['La [ppb]', null, 'measurement', 'La', 'ppb', null],
    ['Sr (µg/g)', null, 'measurement', 'Sr', 'µg/g', null],
    ['Ba ug/g', null, 'measurement', 'Ba', 'µg/g', null],
    ['Ni mg/kg', null, 'measurement', 'Ni', 'mg/kg', null],
    ['Fe (wt%)', null, 'measurement', 'Fe', 'wt% element', null],
    ['Th', null, 'measurement', 'Th', 'ppm', null],
    ['MgO', 'wt%', 'measurement', 'Mg', 'wt% oxide', 'MgO'],
    ['Ce', 'ppb', 'measurement', 'Ce', 'ppb', null],
    ['Sample ID', null, 'sample_id', null, null, null],
    ['Group', null, 'group', null, null, null],
    ['Site', null, 'attribute', null, null, null],
    ['Easting', null, 'attribute', null, null, null],
  ] as const)('%j (units row %j) → %s %s %s %s', (header, unitsCell, role, element, unit, oxide) => {
    expect(guessColumn(0, header, unitsCell)).toEqual({ index: 0, header, role, element, unit, oxide });
  });

  it('takes the first column for the sample id when no header names one', () => {
    expect(guessColumns(['Code', 'Zr', 'Nb'], null).map((c) => c.role)).toEqual([
      'sample_id',
      'measurement',
      'measurement',
    ]);
  });
});
