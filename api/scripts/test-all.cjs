'use strict';
/**
 * `npm test`: every check and every suite of every workspace, on a fresh clone too. Installs what is
 * missing (npm dependencies, PostgreSQL, Redis, Chromium), starts one throwaway PostgreSQL cluster and
 * Redis on loopback for all suites, removes them afterwards (also when tests fail or on Ctrl-C), and ends
 * with one line `N passed, N failed` counting all suites together.
 *
 * `npm test -- api web` runs only the named suites (shared, web, workers, api, e2e); checks run always.
 */
const fs = require('node:fs');
const os = require('node:os');
const path = require('node:path');
const services = require('./local-services.cjs');
const { repoRoot, run, ensureDependencies, buildServer, buildWeb } = require('./workspace.cjs');

const log = (message) => console.log(`\n[test] ${message}`);
const reportDir = fs.mkdtempSync(path.join(os.tmpdir(), 'provenote-reports-'));

/** Checks count as one test each; suites write a Jest-style JSON report that is summed. */
const checks = [
  { name: 'typecheck and build (shared, workers, api)', run: () => buildServer() },
  { name: 'build (web)', run: () => buildWeb({ force: true }) },
  { name: 'lint', run: () => run('npx', ['eslint', '.', '--max-warnings', '0']) },
  { name: 'demo data match their seeded generator', run: () => run('node', ['samples/check.cjs']) },
];

const vitest = (cwd, config) => (report) =>
  run(
    'npx',
    [
      'vitest',
      'run',
      ...(config ? ['--config', config] : []),
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${report}`,
    ],
    {
      cwd: path.join(repoRoot, cwd),
    },
  );
const jest = (cwd) => (report) =>
  run('npx', ['jest', '--ci', '--json', `--outputFile=${report}`], { cwd: path.join(repoRoot, cwd) });

const suites = [
  { name: 'shared', run: vitest('shared') },
  { name: 'web', run: vitest('web') },
  { name: 'workers', run: jest('workers') },
  { name: 'api', run: jest('api') },
  { name: 'e2e', run: vitest('web', 'vitest.e2e.config.ts'), needs: ['chromium'] },
];

function readReport(file) {
  try {
    const report = JSON.parse(fs.readFileSync(file, 'utf8'));
    return {
      passed: report.numPassedTests ?? 0,
      failed: report.numFailedTests ?? 0,
      skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
      // A file that failed to load counts as a failure even when no test inside it ran.
      brokenFiles: (report.testResults ?? []).filter(
        (r) => r.status === 'failed' && (r.assertionResults ?? []).length === 0,
      ).length,
    };
  } catch {
    return undefined;
  }
}

async function main() {
  const only = process.argv.slice(2).filter((arg) => !arg.startsWith('-'));
  const selected = only.length ? suites.filter((s) => only.includes(s.name)) : suites;
  await ensureDependencies((message) => log(message));
  services.ensureSystemPackages(['postgres', 'redis', ...new Set(selected.flatMap((s) => s.needs ?? []))], log);

  const rows = [];
  let passed = 0;
  let failed = 0;
  let skipped = 0;

  for (const check of checks) {
    log(check.name);
    let ok = false;
    try {
      const code = await check.run();
      ok = code === undefined || code === 0;
    } catch (error) {
      console.error(error instanceof Error ? error.message : error);
    }
    rows.push(`${ok ? 'ok  ' : 'FAIL'} ${check.name}`);
    if (ok) passed++;
    else failed++;
  }

  log('starting throwaway PostgreSQL and Redis');
  const stack = await services.startThrowawayServices();
  const stop = async () => {
    await stack.stop();
    fs.rmSync(reportDir, { recursive: true, force: true });
  };
  const interrupt = () => stop().finally(() => process.exit(130));
  process.once('SIGINT', interrupt);
  process.once('SIGTERM', interrupt);
  process.env.DATABASE_URL = stack.databaseUrl;
  process.env.REDIS_URL = stack.redisUrl;

  try {
    for (const suite of selected) {
      log(`suite: ${suite.name}`);
      const report = path.join(reportDir, `${suite.name}.json`);
      const code = await suite.run(report);
      const result = readReport(report);
      if (!result) {
        rows.push(`FAIL ${suite.name}: the runner exited with code ${code} and wrote no report`);
        failed++;
        continue;
      }
      const suiteFailed = result.failed + result.brokenFiles + (code !== 0 && result.failed === 0 ? 1 : 0);
      rows.push(
        `${suiteFailed ? 'FAIL' : 'ok  '} ${suite.name}: ${result.passed} passed, ${suiteFailed} failed` +
          (result.skipped ? `, ${result.skipped} skipped` : ''),
      );
      passed += result.passed;
      failed += suiteFailed;
      skipped += result.skipped;
    }
  } finally {
    await stop();
  }

  console.log(`\n${rows.join('\n')}\n`);
  console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
  process.exit(failed > 0 ? 1 : 0);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
