import { describe, expect, it } from 'vitest';
import { InvalidInputError } from '../errors/engine-errors';
import { decideVerdict } from './verdict';

const groups = ['A', 'B', 'C'];

describe('decideVerdict', () => {
  it('assigned when exactly one group reaches α', () => {
    const v = decideVerdict(groups, [0.01, 0.2, 0.03], [9, 2, 7], 0.05);
    expect(v).toMatchObject({
      verdict: 'assigned',
      group: 'B',
      probability: 0.2,
      runnerUp: 'C',
      runnerUpProbability: 0.03,
    });
  });

  it('ambiguous when two or more reach α, naming best and runner-up', () => {
    const v = decideVerdict(groups, [0.3, 0.2, 0.05], [1, 2, 3], 0.05);
    expect(v).toMatchObject({ verdict: 'ambiguous', group: 'A', runnerUp: 'B' });
    expect(v.groupsAtOrAboveAlpha).toEqual(['A', 'B', 'C']);
  });

  it('unassigned when none does, still naming the best and runner-up', () => {
    const v = decideVerdict(groups, [0, 0, 1e-9], [900, 800, 50], 0.05);
    expect(v).toMatchObject({ verdict: 'unassigned', group: 'C', runnerUp: 'B' });
  });

  it('handles a single group and refuses a bad α', () => {
    expect(decideVerdict(['A'], [0.5], [1], 0.05)).toMatchObject({
      verdict: 'assigned',
      runnerUp: null,
      runnerUpProbability: null,
    });
    expect(() => decideVerdict(['A'], [0.5], [1], 1.5)).toThrow(InvalidInputError);
  });
});
