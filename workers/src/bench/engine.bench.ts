import { leaveOneOutCheck, packGroups, fastMcd, fitGroup } from '@provenote/shared';
import { availableParallelism } from 'node:os';
import type { BenchFigure, BenchSection } from './bench-section';
import { classifyAndSummarise } from './block-summary';
import { MemoryPeak } from './memory-peak';
import { ClassifyPool } from './parallel-classify';
import { syntheticModels, syntheticRows, syntheticUnknowns } from './synthetic';

const GROUPS = 8;
const VARIABLES = 24;
const MEMBERS = 200;
const SIZES: [string, number][] = [
  ['1e4', 1e4],
  ['1e5', 1e5],
  ['1e6', 1e6],
];

function timed<T>(work: () => T): { result: T; ms: number } {
  const started = performance.now();
  const result = work();
  return { result, ms: performance.now() - started };
}

/**
 * Classification passes are timed REPEATS times and the fastest kept, the usual way to read a kernel's
 * speed on a shared machine: a slower repeat measures the neighbours, not the code.
 */
const REPEATS = 3;

async function fastestOf<T>(work: () => T | Promise<T>): Promise<{ result: T; ms: number }> {
  let best: { result: T; ms: number } | undefined;
  for (let r = 0; r < REPEATS; r++) {
    const started = performance.now();
    const result = await work();
    const ms = performance.now() - started;
    if (!best || ms < best.ms) best = { result, ms };
  }
  return best!;
}

async function classifyFigures(memory: MemoryPeak, log: (line: string) => void): Promise<BenchFigure[]> {
  const groups = packGroups(syntheticModels(GROUPS, MEMBERS, VARIABLES, 1));
  const figures: BenchFigure[] = [];
  const pool = new ClassifyPool();
  try {
    // Warm-up so the JIT has compiled the kernel before anything is timed, on this thread and in the pool.
    const warm = syntheticUnknowns(20_000, VARIABLES, GROUPS, 2);
    classifyAndSummarise(groups, warm, 0, 20_000);
    await pool.classify(groups, warm);
    for (const [label, rows] of SIZES) {
      const data = syntheticUnknowns(rows, VARIABLES, GROUPS, 3);
      memory.checkpoint();
      const pairs = rows * GROUPS;
      const one = await fastestOf(() => classifyAndSummarise(groups, data, 0, rows));
      const { result: all, ms: allMs } = await fastestOf(() => pool.classify(groups, data));
      if (all.typicalChi2 !== one.result.typicalChi2 || all.typicalHotelling !== one.result.typicalHotelling) {
        throw new Error('the threads and the single core disagree on the classification');
      }
      memory.checkpoint();
      log(`classify ${label}: one core ${one.ms.toFixed(0)} ms, ${pool.threads} threads ${allMs.toFixed(0)} ms`);
      figures.push(
        {
          key: `engine.classify.${label}.one_core.pairs_per_s`,
          label: `classify ${label} × ${GROUPS} groups × ${VARIABLES} vars, one core (best of ${REPEATS})`,
          value: Math.round(pairs / (one.ms / 1000)),
          unit: 'pairs/s',
        },
        {
          key: `engine.classify.${label}.all_cores.pairs_per_s`,
          label: `classify ${label} × ${GROUPS} groups × ${VARIABLES} vars, ${pool.threads} threads (best of ${REPEATS})`,
          value: Math.round(pairs / (allMs / 1000)),
          unit: 'pairs/s',
        },
      );
    }
  } finally {
    await pool.close();
  }
  return figures;
}

export const engineBench: BenchSection = {
  name: 'engine',
  async run(log) {
    const memory = new MemoryPeak();
    const figures = await classifyFigures(memory, log);

    const looRows = syntheticRows(10_000, 30, 0, 4);
    const looVariables = Array.from({ length: 30 }, (_, j) => `v${j + 1}`);
    const loo = timed(() => leaveOneOutCheck([fitGroup('loo', looRows, looVariables)], [looRows], 'hotelling', 0.05));
    log(`leave-one-out 10000 × 30: ${loo.ms.toFixed(0)} ms (${loo.result.returnedToOwnGroup} members return)`);
    memory.checkpoint();

    const mcdRows = syntheticRows(5_000, 20, 0, 5);
    const mcd = timed(() =>
      fastMcd(mcdRows, { seed: 6, context: { group: 'mcd', variables: looVariables.slice(0, 20) } }),
    );
    log(`FAST-MCD 5000 × 20: ${mcd.ms.toFixed(0)} ms (seed ${mcd.result.seed})`);
    memory.checkpoint();

    figures.push(
      {
        key: 'engine.loo.10000x30.ms',
        label: 'leave-one-out, group of 10 000 × 30 (fit + all members)',
        value: Math.round(loo.ms),
        unit: 'ms',
      },
      { key: 'engine.mcd.5000x20.ms', label: 'FAST-MCD, 5 000 × 20', value: Math.round(mcd.ms), unit: 'ms' },
      {
        key: 'engine.peak_rss_mb',
        label: 'peak resident memory (whole process, all threads)',
        value: Math.round(memory.peakRssMb()),
        unit: 'MB',
      },
      {
        key: 'engine.peak_heap_mb',
        label: 'peak JavaScript heap (main thread, at checkpoints)',
        value: Math.round(memory.peakHeapMb()),
        unit: 'MB',
      },
      { key: 'engine.threads', label: 'worker threads', value: availableParallelism(), unit: '' },
    );
    return figures;
  },
};
