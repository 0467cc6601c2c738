import { PassThrough } from 'node:stream';
import { EngineError, type BundleManifest } from '@provenote/shared';
import type { BundleContent } from '../bundles/bundle-content';
import { buildBundle } from '../bundles/build-bundle';
import { verifyBundle } from '../bundles/verify-bundle';
import type { RunProcessor } from '../queue/run-worker';
import { bundleContentFromSources } from './bundle-assembly';
import type { BundleSource } from './bundle-source';

/** A built bundle that its own verifier rejects: the stored results disagree with their inputs. */
export class BundleSelfCheckError extends EngineError {}

const LISTED_PROBLEMS = 5;

async function zipOf(content: BundleContent): Promise<{ zip: Buffer; manifest: BundleManifest }> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (chunk: Buffer) => chunks.push(chunk));
  const manifest = await buildBundle(content, out);
  return { zip: Buffer.concat(chunks), manifest };
}

/**
 * The bundle job: gathers a signed-off study's stored inputs and results, writes the zip, and checks it
 * with the same verifier anyone will run on it, so a bundle that would not verify is never offered.
 */
export function createBundleProcessor(source: BundleSource): RunProcessor {
  return async ({ run, checkpoint }) => {
    await checkpoint(0, 'reading the study');
    const sources = await source.load(run.id);
    await checkpoint(0.2, 'laying out files');
    const content = bundleContentFromSources(sources);
    await checkpoint(0.4, 'writing the zip');
    const { zip, manifest } = await zipOf(content);
    await checkpoint(0.6, 'verifying the bundle');
    const verification = await verifyBundle(zip);
    if (!verification.ok) {
      const listed = verification.problems.slice(0, LISTED_PROBLEMS).map((p) => `${p.path ?? 'archive'}: ${p.message}`);
      throw new BundleSelfCheckError(
        `the built bundle does not verify (${verification.problems.length} problems): ${listed.join('; ')}`,
      );
    }
    await checkpoint(0.9, 'saving the bundle');
    return source.save(run.id, zip, manifest);
  };
}
