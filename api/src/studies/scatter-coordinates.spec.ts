import { BadRequestException } from '@nestjs/common';
import { cellFlags, type StepParameters } from '@provenote/shared';
import type { DatasetVersion } from '../datasets/dataset-version.entity';
import { measuredCoordinates, preparedCoordinates, type StoredRow } from './scatter-coordinates';

const MEASURED = cellFlags.indexOf('measured');
const BELOW = cellFlags.indexOf('below_dl');
const version = { columns: [{ element: 'Zr' }, { element: 'Nb' }, { element: 'La' }] } as unknown as DatasetVersion;
const rows: StoredRow[] = [
  { sample_id: 'A', ppm: [200, 20, 40], flags: [MEASURED, MEASURED, MEASURED] },
  { sample_id: 'B', ppm: [100, 4, 50], flags: [MEASURED, BELOW, MEASURED] },
  { sample_id: 'C', ppm: [100, null, 50], flags: [MEASURED, MEASURED, MEASURED] },
];
const prepare = (transform: 'clr' | 'ilr' | 'log10'): NonNullable<StepParameters['prepare']> => ({
  elements: ['Zr', 'Nb', 'La'],
  transform,
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 1,
});

describe('scatter coordinates', () => {
  it('gives clr by its definition, ln xⱼ − mean ln x (Aitchison 1986, The Statistical Analysis of Compositional Data)', () => {
    const clr = preparedCoordinates(version, rows, prepare('clr'), 'reference');
    expect(clr.variables).toEqual(['clr(Zr)', 'clr(Nb)', 'clr(La)']);
    expect(clr.rows.map((r) => r.sampleId)).toEqual(['A', 'B']);
    const meanLn = (Math.log(200) + Math.log(20) + Math.log(40)) / 3;
    expect(clr.rows[0].values[0]).toBeCloseTo(Math.log(200) - meanLn, 12);
    // B's Nb is a detection limit of 4 replaced by half of it; every clr coordinate depends on it.
    const meanLnB = (Math.log(100) + Math.log(2) + Math.log(50)) / 3;
    expect(clr.rows[1].values[1]).toBeCloseTo(Math.log(2) - meanLnB, 12);
    expect(clr.rows[1].belowDetection).toEqual([true, true, true]);
    expect(clr.rows[0].belowDetection).toEqual([false, false, false]);
  });

  it('names the ilr pivot coordinates, one fewer than the parts', () => {
    expect(preparedCoordinates(version, rows, prepare('ilr'), 'reference').variables).toEqual([
      'pivot(Zr)',
      'pivot(Nb)',
    ]);
  });

  it('marks only the replaced element under log10, and keeps missing ppm as missing when measured', () => {
    const log10 = preparedCoordinates(version, rows, prepare('log10'), 'reference');
    expect(log10.rows[1].belowDetection).toEqual([false, true, false]);
    expect(log10.rows[1].values[2]).toBeCloseTo(Math.log10(50), 12);
    const measured = measuredCoordinates(version, rows, ['Zr', 'Nb'], 'reference');
    expect(measured.rows[2].values).toEqual([100, null]);
  });

  it('names a chosen element the data lack', () => {
    const other = { columns: [{ element: 'Zr' }] } as unknown as DatasetVersion;
    expect(() => preparedCoordinates(other, [], prepare('clr'), 'unknowns')).toThrow(
      new BadRequestException('The unknowns data have no "Nb" column'),
    );
  });
});
