import { createHash } from 'node:crypto';
import { finished } from 'node:stream/promises';
import type { Writable } from 'node:stream';
import { ZipArchive } from 'archiver';
import {
  BUNDLE_FORMAT,
  BUNDLE_FORMAT_VERSION,
  bundleManifestSchema,
  type BundleFile,
  type BundleManifest,
} from '@provenote/shared';
import type { BundleContent } from './bundle-content';
import { layOutData, MANIFEST_PATH, README_PATH, REPORT_PATH, type BundleEntry } from './bundle-layout';
import { readmeText } from './readme-text';
import { renderReport } from './report/render-report';

export const sha256Hex = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Every file of the bundle, manifest last, with the manifest that lists the others' checksums. */
export function bundleEntries(content: BundleContent): { entries: BundleEntry[]; manifest: BundleManifest } {
  const { entries, groups } = layOutData(content);
  const encoder = new TextEncoder();
  entries.push({ path: README_PATH, bytes: encoder.encode(readmeText(content)) });
  entries.push({ path: REPORT_PATH, bytes: encoder.encode(renderReport(content)) });
  const files: BundleFile[] = entries.map((entry) => ({
    path: entry.path,
    bytes: entry.bytes.byteLength,
    sha256: sha256Hex(entry.bytes),
  }));
  const manifest = bundleManifestSchema.parse({
    format: BUNDLE_FORMAT,
    formatVersion: BUNDLE_FORMAT_VERSION,
    provenoteVersion: content.provenoteVersion,
    engineVersion: content.engineVersion,
    createdAt: content.createdAt,
    createdBy: content.createdBy,
    lab: content.lab,
    study: content.study,
    runId: content.runId,
    ...(content.signOff ? { signOff: content.signOff } : {}),
    parameters: content.parameters,
    seed: content.seed,
    groups,
    files,
  });
  entries.push({ path: MANIFEST_PATH, bytes: encoder.encode(JSON.stringify(manifest, null, 2) + '\n') });
  return { entries, manifest };
}

/**
 * Writes the bundle as a zip to `out` and resolves with its manifest once `out` has finished. Entry
 * times are the bundle's creation time, so the same content always gives the same archive bytes.
 */
export async function buildBundle(content: BundleContent, out: Writable): Promise<BundleManifest> {
  const { entries, manifest } = bundleEntries(content);
  // zlib's default level: level 9 costs much more time for a few per cent smaller CSV files.
  const archive = new ZipArchive({ zlib: { level: 6 } });
  const failure = new Promise<never>((_, reject) => {
    archive.on('error', reject);
    out.on('error', reject);
  });
  archive.pipe(out);
  const date = new Date(content.createdAt);
  for (const entry of entries) archive.append(Buffer.from(entry.bytes), { name: entry.path, date });
  await Promise.race([Promise.all([archive.finalize(), finished(out)]), failure]);
  return manifest;
}
