import { describe, expect, it } from 'vitest';
import { pChiSquare, pHotelling } from '../distances/membership';
import { squaredDistance } from '../linalg/cholesky';
import { mulberry32 } from '../random/mulberry32';
import { fitGroup } from '../stats/group-model';
import { allocateKernelOutput, classifyBlock, classifyInBlocks } from './classify-kernel';
import { packGroups } from './packed-groups';

function syntheticGroups(p: number, g: number, seed: number) {
  const random = mulberry32(seed);
  const variables = Array.from({ length: p }, (_, j) => `v${j}`);
  const models = Array.from({ length: g }, (_, k) => {
    const rows = Array.from({ length: 2 * p + 7 * k }, () => {
      const common = random.normal();
      return variables.map((_, j) => k + (1 + j / 5) * random.normal() + 0.5 * common);
    });
    return fitGroup(`g${k}`, rows, variables);
  });
  const unknowns = Array.from({ length: 23 }, () => variables.map(() => 3 * random.normal()));
  return { models, unknowns };
}

describe('classification kernel', () => {
  // The kernel's blocked, four-row substitution and fast tails against the one-at-a-time reference path.
  it.each([
    [6, 3],
    [5, 4],
    [24, 8],
  ])('p = %i, G = %i agrees with the reference functions to 1e-11', (p, g) => {
    const { models, unknowns } = syntheticGroups(p, g, p * 100 + g);
    const packed = packGroups(models);
    const out = allocateKernelOutput(unknowns.length, g);
    classifyBlock(packed, Float64Array.from(unknowns.flat()), 0, unknowns.length, out);
    unknowns.forEach((x, i) =>
      models.forEach((model, k) => {
        const d2 = squaredDistance(model.cholesky.lower, x, model.mean);
        const e = i * g + k;
        expect(Math.abs(out.d2[e] - d2) / d2).toBeLessThan(1e-12);
        expect(Math.abs(out.pChi2[e] - pChiSquare(d2, p)) / pChiSquare(d2, p)).toBeLessThan(1e-11);
        const hot = pHotelling(d2, model.n, p);
        expect(Math.abs(out.pHotelling[e] - hot) / hot).toBeLessThan(1e-11);
      }),
    );
  });

  it('gives the same numbers whatever the block size', () => {
    const { models, unknowns } = syntheticGroups(6, 3, 9);
    const packed = packGroups(models);
    const data = Float64Array.from(unknowns.flat());
    const collect = (blockRows: number) => {
      const d2: number[] = [];
      classifyInBlocks(packed, data, (_, rows, out) => d2.push(...out.d2.subarray(0, rows * 3)), blockRows);
      return d2;
    };
    expect(collect(5)).toEqual(collect(4096));
    expect(collect(1)).toEqual(collect(4096));
  });
});
