import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../cli/main';
import { irisContent } from './__fixtures__/iris-content';
import { bundleBuffer, rewriteZip } from './__fixtures__/zip-tools';
import { ASSIGNMENTS_PATH, CONTRIBUTIONS_PATH, MANIFEST_PATH } from './bundle-layout';

function capture() {
  const chunks: string[] = [];
  return { write: (text: string) => void chunks.push(text), text: () => chunks.join('') };
}

describe('provenote verify BUNDLE.zip', () => {
  let folder: string;
  let zip: Buffer;
  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), 'provenote-verify-'));
    zip = await bundleBuffer(irisContent());
  });
  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  it('exits 0 for an intact bundle', async () => {
    const file = join(folder, 'intact.zip');
    writeFileSync(file, zip);
    const [stdout, stderr] = [capture(), capture()];
    await expect(main(['verify', file], stdout, stderr)).resolves.toBe(0);
    expect(stdout.text()).toMatch(
      /^.*intact\.zip \(Iris species as reference groups, .*\): \d+ files intact; \d+ recomputed values match/,
    );
    expect(stderr.text()).toBe('');
  });

  it('exits 1 and names the file when a verdict was changed', async () => {
    const file = join(folder, 'tampered.zip');
    const tampered = await rewriteZip(zip, (entries) =>
      entries.map((e) =>
        e.name === ASSIGNMENTS_PATH
          ? { ...e, bytes: Buffer.from(e.bytes.toString('utf8').replace(',assigned,', ',unassigned,')) }
          : e,
      ),
    );
    writeFileSync(file, tampered);
    const [stdout, stderr] = [capture(), capture()];
    await expect(main(['verify', file], stdout, stderr)).resolves.toBe(1);
    expect(stderr.text()).toContain(`checksum: ${ASSIGNMENTS_PATH}: changed`);
    expect(stderr.text()).toMatch(
      /difference: results\/assignments\.csv: line \d+, verdict: the bundle has "unassigned", the recomputation gives "assigned"/,
    );
    expect(stderr.text()).toMatch(/verification FAILED with \d+ problems\n$/);
  });

  it('accepts a bundle made before results/contributions.csv existed, and says it skipped that comparison', async () => {
    const file = join(folder, 'older.zip');
    const older = await rewriteZip(zip, (entries) =>
      entries
        .filter((e) => e.name !== CONTRIBUTIONS_PATH)
        .map((e) => {
          if (e.name !== MANIFEST_PATH) return e;
          const manifest = JSON.parse(e.bytes.toString('utf8')) as { files: { path: string }[] };
          const files = manifest.files.filter((f) => f.path !== CONTRIBUTIONS_PATH);
          expect(files).toHaveLength(manifest.files.length - 1);
          return { ...e, bytes: Buffer.from(JSON.stringify({ ...manifest, files })) };
        }),
    );
    writeFileSync(file, older);
    const [stdout, stderr] = [capture(), capture()];
    await expect(main(['verify', file], stdout, stderr)).resolves.toBe(0);
    expect(stdout.text()).toContain(
      `skipped: ${CONTRIBUTIONS_PATH}: not compared, the manifest does not list it (the bundle predates that file)\n`,
    );
    expect(stdout.text()).toMatch(/older\.zip \(.*\): \d+ files intact/);
    expect(stderr.text()).toBe('');
  });

  it('still fails a bundle whose manifest lists results/contributions.csv when the file is gone', async () => {
    const file = join(folder, 'removed.zip');
    writeFileSync(file, await rewriteZip(zip, (entries) => entries.filter((e) => e.name !== CONTRIBUTIONS_PATH)));
    const [stdout, stderr] = [capture(), capture()];
    await expect(main(['verify', file], stdout, stderr)).resolves.toBe(1);
    expect(stderr.text()).toContain(`missing: ${CONTRIBUTIONS_PATH}: listed in the manifest but not in the archive`);
    expect(stdout.text()).not.toContain('skipped:');
  });

  it('exits 2 without exactly one bundle, and 1 for a file that cannot be read', async () => {
    const [stdout, stderr] = [capture(), capture()];
    await expect(main(['verify'], stdout, stderr)).resolves.toBe(2);
    await expect(main(['verify', join(folder, 'absent.zip')], stdout, stderr)).resolves.toBe(1);
    expect(stderr.text()).toContain('absent.zip: cannot be read (ENOENT)');
  });
});
