import { irisContent } from '../__fixtures__/iris-content';
import { bundleBuffer, rewriteZip } from '../__fixtures__/zip-tools';
import { MANIFEST_PATH, README_PATH, REPORT_PATH } from '../bundle-layout';
import { verifyBundle } from '../verify-bundle';
import { readZipEntries, type ZipEntryBytes } from '../zip-reader';
import { formatNumber } from './html';
import { renderReport } from './render-report';

const text = (entries: ZipEntryBytes[], name: string) => entries.find((e) => e.name === name)!.bytes.toString('utf8');
const references = (html: string) => /<h2>References<\/h2><ul>(.*?)<\/ul>/s.exec(html)![1];

describe('bundle sign-off', () => {
  it('records who signed off, when and the statement in manifest.json, README.txt and the report, and verifies', async () => {
    const content = irisContent();
    const zip = await bundleBuffer(content);
    const entries = await readZipEntries(zip);
    const manifest = JSON.parse(text(entries, MANIFEST_PATH));
    expect(manifest.signOff).toEqual({
      by: { id: null, name: 'Test PI' },
      at: '2026-01-15T10:00:00.000Z',
      statement: 'I have reviewed the groups, the check and every override.',
    });
    expect(text(entries, README_PATH)).toContain('Signed off by Test PI on 2026-01-15T10:00:00.000Z');
    const report = text(entries, REPORT_PATH);
    expect(report).toContain(
      '<strong>Signed off</strong> by Test PI on 2026-01-15T10:00:00.000Z; no result of the study can change after sign-off. Sign-off statement: “I have reviewed the groups, the check and every override.”',
    );
    expect(report).not.toMatch(/waiting for|to review and sign/i);
    const result = await verifyBundle(zip);
    expect(result.problems).toEqual([]);
    expect(result.ok).toBe(true);
  });

  it('names report.html when the sign-off in it is changed', async () => {
    const zip = await bundleBuffer(irisContent());
    const forged = await rewriteZip(zip, (entries) =>
      entries.map((e) =>
        e.name === REPORT_PATH
          ? { name: e.name, bytes: Buffer.from(e.bytes.toString('utf8').replace('Test PI', 'Someone Else')) }
          : e,
      ),
    );
    const result = await verifyBundle(forged);
    expect(result.ok).toBe(false);
    expect(result.problems).toEqual(
      expect.arrayContaining([expect.objectContaining({ kind: 'checksum', path: REPORT_PATH })]),
    );
  });

  it('says plainly when a bundle was built outside a signed-off study', () => {
    const html = renderReport({ ...irisContent(), signOff: null });
    expect(html).toContain('<strong>Not signed off.</strong>');
    expect(html).not.toContain('<strong>Signed off</strong>');
  });
});

describe('report overrides', () => {
  it('shows who overrode a verdict and when, beside the reason', () => {
    const content = irisContent();
    const overridden = content.results.assignments[1];
    const html = renderReport(content);
    expect(html).toContain(
      `unassigned: flower damaged; measurement doubtful (overridden by Test Analyst, 2026-01-14T16:45:00.000Z)</span>`,
    );
    expect(overridden.sampleId).toBe('iris-20');
  });

  it('refuses an override that does not say who made it', () => {
    const content = irisContent();
    const assignments = content.results.assignments.map((a, k) => (k === 1 ? { ...a, overriddenBy: null } : a));
    expect(() => renderReport({ ...content, results: { ...content.results, assignments } })).toThrow(
      'the override of iris-20 does not say who made it and when',
    );
  });
});

describe('report references', () => {
  it('cites no log-ratio, zero-replacement or robust paper for natural logs with the classical covariance', () => {
    const html = renderReport(irisContent({ parameters: { transform: 'ln', covariance: 'classic' } }));
    const cited = references(html);
    expect(cited).toContain('Mahalanobis, P. C. (1936)');
    expect(cited).toContain('Hotelling, H. (1931)');
    expect(cited).toContain('NIST/SEMATECH e-Handbook');
    for (const absent of ['Aitchison', 'Egozcue', 'Hornung', 'Martín-Fernández', 'Rousseeuw']) {
      expect(cited).not.toContain(absent);
    }
  });

  it('cites the log-ratio and robust-covariance papers when the run used them', () => {
    const cited = references(renderReport(irisContent({ parameters: { transform: 'ilr', covariance: 'mcd' } })));
    expect(cited).toContain('Aitchison, J. (1986)');
    expect(cited).toContain('Egozcue, J. J.');
    expect(cited).toContain('Rousseeuw, P. J. &amp; Van Driessen, K. (1999)');
    // Iris has no value below a detection limit, so no replacement rule is cited.
    expect(cited).not.toContain('Hornung');
  });
});

describe('report tables and numbers', () => {
  it('writes every number with three significant digits, in exponent form below 0.001', () => {
    expect(formatNumber(0.00015612)).toBe('1.56e-4');
    expect(formatNumber(6.3912e-5)).toBe('6.39e-5');
    expect(formatNumber(0.0015612)).toBe('0.00156');
    expect(formatNumber(0.5)).toBe('0.500');
    expect(formatNumber(1)).toBe('1.00');
    expect(formatNumber(0)).toBe('0.00');
    expect(formatNumber(123.456)).toBe('123');
    expect(formatNumber(12345.6)).toBe('12300');
    expect(formatNumber(null)).toBe('');
    expect(() => formatNumber(Number.NaN)).toThrow('the report cannot show NaN as a number');
  });

  it('keeps sample ids and numbers on one line and shows probabilities only in that format', () => {
    const html = renderReport(irisContent());
    expect(html).toContain('td.num,td.id{white-space:nowrap}');
    const rows = [...html.matchAll(/<tr><td class="id">([^<]+)<\/td>(.*?)<\/tr>/g)];
    expect(rows).toHaveLength(15);
    const numbers = rows.flatMap((row) => [...row[2].matchAll(/<td class="num">([^<]*)<\/td>/g)].map((m) => m[1]));
    expect(numbers.length).toBeGreaterThanOrEqual(15);
    for (const shown of numbers.filter((n) => n !== '')) {
      expect(shown).toMatch(/^(\d\.\d\de-\d+|0\.0*[1-9]\d\d|[1-9]\.\d\d|0\.00)$/);
    }
  });
});
