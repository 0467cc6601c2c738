import { PassThrough } from 'node:stream';
import { ENGINE_VERSION, type AssignmentParameters } from '@provenote/shared';
import { buildBundle } from '../bundles/build-bundle';
import type { BundleContent, PreparedValue } from '../bundles/bundle-content';
import { recomputeRun, type PreparedSamples } from '../bundles/recompute';
import { verifyBundle } from '../bundles/verify-bundle';
import type { BenchFigure, BenchSection } from './bench-section';
import { syntheticRows } from './synthetic';

const GROUPS = 8;
const MEMBERS = 150;
const UNKNOWNS = 100_000;
const P = 24;

/** A bundle the size of the end-to-end run: 8 groups × 150 members and 100,000 unknowns on 24 elements (synthetic). */
function benchContent(): BundleContent {
  const elements = Array.from({ length: P }, (_, j) => `el${j + 1}`);
  const reference = Array.from({ length: GROUPS }, (_, k) =>
    syntheticRows(MEMBERS, P, 0.4 * k, 11 + k).map((values, i) => ({
      sampleId: `g${k + 1}-${i + 1}`,
      role: 'reference' as const,
      group: `group-${k + 1}`,
      values,
    })),
  ).flat();
  const unknowns = syntheticRows(UNKNOWNS, P, 0.6, 97).map((values, i) => ({
    sampleId: `u-${i + 1}`,
    role: 'unknown' as const,
    group: null,
    values,
  }));
  const prepared: PreparedSamples = { elements, samples: [...reference, ...unknowns] };
  const parameters: AssignmentParameters = {
    elements,
    transform: 'none',
    belowDetection: 'dl-half',
    covariance: 'classic',
    probability: 'hotelling',
    alpha: 0.05,
  };
  const run = recomputeRun(prepared, parameters, 1);
  const preparedValues: PreparedValue[] = prepared.samples.flatMap((s, i) =>
    elements.map((element, j) => ({
      ...s,
      element,
      valuePpm: s.values[j],
      transformedValue: run.transformed[i][j],
      flag: 'measured' as const,
    })),
  );
  return {
    provenoteVersion: '0.1.0',
    engineVersion: ENGINE_VERSION,
    createdAt: new Date(0).toISOString(),
    createdBy: { id: null, name: 'benchmark' },
    lab: { id: null, name: 'benchmark (synthetic)' },
    study: { id: null, title: 'Synthetic benchmark study', description: 'Synthetic data; only speed is measured.' },
    runId: null,
    signOff: null,
    parameters,
    seed: 1,
    inputs: [{ name: 'synthetic.csv', bytes: new Uint8Array(1024 * 1024) }],
    prepared: preparedValues,
    groups: run.groups.map((g) => ({ ...g, version: 1 })),
    results: {
      distances: run.distances,
      assignments: run.assignments.map((a) => ({
        ...a,
        finalVerdict: a.verdict,
        finalGroup: a.verdict === 'assigned' ? a.group : null,
        overrideReason: null,
        overriddenBy: null,
        overriddenAt: null,
      })),
      contributions: run.contributions,
      members: run.members,
      separation: run.separation,
    },
  };
}

export const bundleBench: BenchSection = {
  name: 'bundle',
  async run(log) {
    const content = benchContent();
    const chunks: Buffer[] = [];
    const out = new PassThrough();
    out.on('data', (chunk: Buffer) => chunks.push(chunk));
    let start = performance.now();
    await buildBundle(content, out);
    const buildMs = performance.now() - start;
    const zip = Buffer.concat(chunks);
    start = performance.now();
    const verification = await verifyBundle(zip);
    const verifyMs = performance.now() - start;
    if (!verification.ok)
      throw new Error(`the benchmark bundle failed its own verification: ${verification.problems[0]?.message}`);
    log(
      `${UNKNOWNS} unknowns × ${GROUPS} groups × ${P} elements; ${verification.valuesCompared} values recomputed and compared`,
    );
    const round = (ms: number) => Math.round(ms);
    const figures: BenchFigure[] = [
      {
        key: 'bundle.build_ms',
        label: `bundle build (${UNKNOWNS.toLocaleString('en-US')} unknowns)`,
        value: round(buildMs),
        unit: 'ms',
      },
      { key: 'bundle.verify_ms', label: 'bundle verify with recomputation', value: round(verifyMs), unit: 'ms' },
      { key: 'bundle.zip_bytes', label: 'bundle size', value: zip.byteLength, unit: 'bytes' },
    ];
    return figures;
  },
};
