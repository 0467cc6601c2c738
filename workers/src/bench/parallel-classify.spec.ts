import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { packGroups } from '@provenote/shared';
import { classifyAndSummarise } from './block-summary';
import { ClassifyPool } from './parallel-classify';
import { syntheticModels, syntheticUnknowns } from './synthetic';

// Worker threads run compiled JavaScript, so this spec builds the workers package first (tsc -b is
// incremental: quick when nothing changed). tsc emits even when it reports type errors elsewhere.
const root = join(__dirname, '..', '..', '..');
const threadScript = join(root, 'workers', 'dist', 'bench', 'classify-thread.js');

beforeAll(() => {
  spawnSync(process.execPath, [require.resolve('typescript/bin/tsc'), '-b', 'workers'], { cwd: root, stdio: 'ignore' });
  expect(existsSync(threadScript)).toBe(true);
}, 180_000);

describe('ClassifyPool', () => {
  it('gives the same summary on two threads as on one core', async () => {
    const groups = packGroups(syntheticModels(3, 40, 6, 1));
    const data = syntheticUnknowns(5_001, 6, 3, 2);
    const single = classifyAndSummarise(groups, data, 0, 5_001);
    const pool = new ClassifyPool(2, threadScript);
    try {
      const parallel = await pool.classify(groups, data);
      expect(parallel.typicalChi2).toBe(single.typicalChi2);
      expect(parallel.typicalHotelling).toBe(single.typicalHotelling);
      expect(parallel.sumD2).toBeCloseTo(single.sumD2, 6);
    } finally {
      await pool.close();
    }
  });

  it('refuses data outside a SharedArrayBuffer', async () => {
    const groups = packGroups(syntheticModels(2, 20, 3, 1));
    const pool = new ClassifyPool(1, threadScript);
    try {
      await expect(pool.classify(groups, new Float64Array(30))).rejects.toThrow(/SharedArrayBuffer/);
    } finally {
      await pool.close();
    }
  });
});

describe('synthetic data', () => {
  it('repeats for a seed', () => {
    expect(Array.from(syntheticUnknowns(10, 4, 3, 9))).toEqual(Array.from(syntheticUnknowns(10, 4, 3, 9)));
  });
});
