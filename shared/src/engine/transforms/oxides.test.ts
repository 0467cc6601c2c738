import { describe, expect, it } from 'vitest';
import { InvalidInputError } from '../errors/engine-errors';
import { oxideToElementFactor, oxideToOxideFactor, oxideWtPercentToElementPpm, parseOxide } from './oxides';

describe('oxide factors from atomic weights', () => {
  // Source: the oxide → element factor table of METHODS.md §7, from the IUPAC/CIAAW 2021 standard
  // atomic weights, four decimals.
  it.each([
    ['SiO2', 0.4674],
    ['TiO2', 0.5993],
    ['Al2O3', 0.5293],
    ['Fe2O3', 0.6994],
    ['FeO', 0.7773],
    ['MnO', 0.7745],
    ['MgO', 0.603],
    ['CaO', 0.7147],
    ['Na2O', 0.7419],
    ['K2O', 0.8302],
    ['P2O5', 0.4364],
  ])('%s', (oxide, factor) => {
    expect(oxideToElementFactor(oxide)).toBeCloseTo(factor, 4);
  });

  it('FeO → Fe2O3 is 1.1113 (METHODS.md §7)', () => {
    expect(oxideToOxideFactor('FeO', 'Fe2O3')).toBeCloseTo(1.1113, 4);
  });

  it('converts wt % to ppm', () => {
    expect(oxideWtPercentToElementPpm(1, 'SiO2')).toBeCloseTo(oxideToElementFactor('SiO2') * 1e4, 9);
  });

  it('parses formulas and refuses unknown ones', () => {
    expect(parseOxide('Al2O3')).toEqual({ element: 'Al', elementAtoms: 2, oxygenAtoms: 3 });
    expect(() => parseOxide('Xx2O3')).toThrow(InvalidInputError);
    expect(() => oxideToOxideFactor('FeO', 'MnO')).toThrow(InvalidInputError);
  });
});
