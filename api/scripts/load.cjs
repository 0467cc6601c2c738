'use strict';
/**
 * `npm run load`: simulated users browsing studies and result pages while runs are computed, on loopback.
 * Starts its own stack (throwaway PostgreSQL and Redis, the built api serving the built web app, demo
 * data) unless LOAD_URL points at a running Provenote with the demo accounts. Bounded in time
 * (LOAD_SECONDS, default 60) and in requests (LOAD_MAX_REQUESTS, default 60,000). Prints the error rate
 * and latency percentiles and writes them to .data/bench/load.json.
 */
const { Buffer } = require('node:buffer');
const { spawn } = require('node:child_process');
const fs = require('node:fs');
const http = require('node:http');
const os = require('node:os');
const path = require('node:path');
const services = require('./local-services.cjs');
const { repoRoot, buildServer, buildWeb, capture } = require('./workspace.cjs');
const { stackRun } = require('./load-run.cjs');

const USERS = Number(process.env.LOAD_USERS ?? 50);
const CONCURRENT_RUNS = Number(process.env.LOAD_RUNS ?? 5);
const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const MAX_REQUESTS = Number(process.env.LOAD_MAX_REQUESTS ?? 60_000);
const TARGET_P95_MS = 300;
const log = (message) => console.log(`[load] ${message}`);

const agent = new http.Agent({ keepAlive: true, maxSockets: USERS + CONCURRENT_RUNS + 4 });

/** One HTTP request with the session's cookies; resolves to { status, body, ms } and never rejects. */
function send(base, session, method, urlPath, body) {
  const url = new URL(urlPath, base);
  if (url.hostname !== '127.0.0.1' && url.hostname !== 'localhost') throw new Error(`Loopback only, not ${url.host}`);
  const payload = body === undefined ? undefined : Buffer.from(JSON.stringify(body));
  const headers = {
    cookie: Object.entries(session.cookies)
      .map(([k, v]) => `${k}=${v}`)
      .join('; '),
  };
  if (payload) Object.assign(headers, { 'content-type': 'application/json', 'content-length': payload.length });
  if (method !== 'GET' && session.cookies.provenote_csrf) headers['x-csrf-token'] = session.cookies.provenote_csrf;
  const started = process.hrtime.bigint();
  return new Promise((resolve) => {
    const req = http.request(url, { method, headers, agent, timeout: 30_000 }, (res) => {
      const chunks = [];
      res.on('data', (chunk) => chunks.push(chunk));
      res.on('end', () => {
        for (const cookie of res.headers['set-cookie'] ?? []) {
          const [pair] = cookie.split(';');
          const eq = pair.indexOf('=');
          session.cookies[pair.slice(0, eq)] = pair.slice(eq + 1);
        }
        const text = Buffer.concat(chunks).toString('utf8');
        let parsed = text;
        if (String(res.headers['content-type']).includes('json')) parsed = JSON.parse(text);
        resolve({ status: res.statusCode, body: parsed, ms: Number(process.hrtime.bigint() - started) / 1e6 });
      });
    });
    req.on('timeout', () => req.destroy(new Error('timed out after 30 s')));
    req.on('error', (error) =>
      resolve({ status: 0, body: error.message, ms: Number(process.hrtime.bigint() - started) / 1e6 }),
    );
    req.end(payload);
  });
}

async function signIn(base, email, password) {
  const session = { cookies: {} };
  await send(base, session, 'GET', '/api/auth/csrf');
  const res = await send(base, session, 'POST', '/api/auth/sign-in', { email, password });
  if (res.status !== 200) throw new Error(`Sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return session;
}

const percentile = (sorted, p) =>
  sorted.length === 0 ? null : sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
const round = (x) => (x === null ? null : Math.round(x * 10) / 10);
const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

/** Starts the product stack on free loopback ports; answers { base, stop }. */
async function startStack() {
  services.ensureSystemPackages(['postgres', 'redis'], log);
  const throwaway = await services.startThrowawayServices();
  const port = await services.freePort();
  log('Building the api and the web app…');
  await buildServer();
  await buildWeb();
  const env = {
    ...process.env,
    DATABASE_URL: throwaway.databaseUrl,
    REDIS_URL: throwaway.redisUrl,
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    WEB_DIST: path.join(repoRoot, 'web', 'dist'),
    MAIL_MODE: 'embedded',
    NODE_ENV: 'production',
    // Runs are computed in a worker process of their own, as in a deployment, not in the api's event loop.
    WORKERS: 'external',
    WORKER_CONCURRENCY: String(CONCURRENT_RUNS),
  };
  capture('node', ['api/dist/cli/prepare-database.js'], { env });
  const children = ['api/dist/main.js', 'api/dist/queue/worker-main.js'].map((entry) =>
    spawn('node', [entry], { cwd: repoRoot, env, stdio: ['ignore', 'ignore', 'inherit'] }),
  );
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    const res = await send(base, { cookies: {} }, 'GET', '/api/health');
    if (res.status === 200) break;
    if (Date.now() > deadline) throw new Error('The api did not become healthy within 60 s');
    await sleep(300);
  }
  const stop = async () => {
    for (const child of children) {
      if (child.exitCode !== null || child.signalCode !== null) continue;
      child.kill('SIGTERM');
      await new Promise((resolve) => child.once('exit', resolve));
    }
    await throwaway.stop();
  };
  return { base, stop };
}

async function main() {
  const stack = process.env.LOAD_URL ? { base: process.env.LOAD_URL, stop: async () => undefined } : await startStack();
  try {
    const password = process.env.LOAD_PASSWORD ?? 'provenote-demo';
    const roles = ['pi', 'analyst', 'student', 'guest'];
    const sessions = [];
    for (let i = 0; i < USERS; i++)
      sessions.push(await signIn(stack.base, `${roles[i % 4]}@demo.provenote.test`, password));
    const analyst = await signIn(stack.base, 'analyst@demo.provenote.test', password);
    const me = await send(stack.base, analyst, 'GET', '/api/me');
    const labId = me.body.memberships[0].labId;
    const lab = `/api/labs/${labId}`;
    const studies = (await send(stack.base, analyst, 'GET', `${lab}/studies`)).body.studies ?? [];
    log(`${USERS} users signed in; lab ${labId} with ${studies.length} studies`);

    // A finished run whose result pages the users read.
    const resultRun = await stackRun(send, stack.base, analyst, lab, 800, 0);
    if (resultRun.status !== 'succeeded') throw new Error(`The warm-up run ended ${resultRun.status}`);

    const samples = [];
    const byLabel = new Map();
    const failures = new Map();
    const record = (label, res) => {
      samples.push(res.ms);
      if (!byLabel.has(label)) byLabel.set(label, []);
      byLabel.get(label).push(res.ms);
      if (res.status < 200 || res.status >= 300) {
        const key = `${label}: ${res.status === 0 ? res.body : res.status}`;
        failures.set(key, (failures.get(key) ?? 0) + 1);
      }
    };
    const deadline = Date.now() + SECONDS * 1000;
    const running = () => Date.now() < deadline && samples.length < MAX_REQUESTS;
    const pages = [
      () => ['me', '/api/me'],
      () => ['studies', `${lab}/studies`],
      () =>
        studies.length
          ? ['study', `${lab}/studies/${studies[Math.floor(Math.random() * studies.length)].id}`]
          : ['studies', `${lab}/studies`],
      () => ['datasets', `${lab}/datasets`],
      () => ['groups', `${lab}/groups`],
      () => ['runs', `${lab}/runs`],
      () => ['run', `${lab}/runs/${resultRun.id}`],
      () => [
        'results',
        `${lab}/runs/${resultRun.id}/assignments?page=${1 + Math.floor(Math.random() * 40)}&pageSize=50`,
      ],
      () => ['web app', '/'],
    ];
    const browse = async (session) => {
      while (running()) {
        const [label, url] = pages[Math.floor(Math.random() * pages.length)]();
        record(label, await send(stack.base, session, 'GET', url));
        await sleep(50 + Math.random() * 200);
      }
    };
    const runs = { started: 0, succeeded: 0, failed: 0, seconds: [] };
    const compute = async (k) => {
      for (let i = 0; running(); i++) {
        const started = Date.now();
        runs.started++;
        const run = await stackRun(
          (...args) => send(...args).then((res) => (record('run', res), res)),
          stack.base,
          analyst,
          lab,
          500,
          k * 1000 + i,
          running,
        );
        if (run.status === 'succeeded') runs.succeeded++;
        else if (run.status !== 'unfinished') runs.failed++;
        if (run.status === 'succeeded') runs.seconds.push((Date.now() - started) / 1000);
      }
    };
    log(`Browsing with ${USERS} users and ${CONCURRENT_RUNS} concurrent runs for ${SECONDS} s…`);
    const loadBefore = os.loadavg().map(round);
    const t0 = Date.now();
    await Promise.all([...sessions.map(browse), ...Array.from({ length: CONCURRENT_RUNS }, (_, k) => compute(k))]);
    const elapsed = (Date.now() - t0) / 1000;

    const sorted = [...samples].sort((a, b) => a - b);
    const errors = [...failures.values()].reduce((a, b) => a + b, 0);
    const report = {
      when: new Date().toISOString(),
      target: process.env.LOAD_URL ? 'LOAD_URL' : 'own stack on loopback',
      node: process.version,
      cpus: os.cpus().length,
      // Other work on the machine shares the cores; the figures mean little without it.
      loadAverageBefore: loadBefore,
      users: USERS,
      concurrentRuns: CONCURRENT_RUNS,
      seconds: round(elapsed),
      requests: samples.length,
      requestsPerSecond: round(samples.length / elapsed),
      errors,
      errorRate: samples.length ? errors / samples.length : 0,
      failures: Object.fromEntries(failures),
      latencyMs: {
        p50: round(percentile(sorted, 50)),
        p95: round(percentile(sorted, 95)),
        p99: round(percentile(sorted, 99)),
        max: round(sorted.at(-1) ?? null),
      },
      p95MsByPage: Object.fromEntries(
        [...byLabel].map(([label, ms]) => [
          label,
          round(
            percentile(
              [...ms].sort((a, b) => a - b),
              95,
            ),
          ),
        ]),
      ),
      runs: {
        ...runs,
        seconds: undefined,
        medianSeconds: round(
          percentile(
            [...runs.seconds].sort((a, b) => a - b),
            50,
          ),
        ),
      },
      targets: { errorRate: 0, p95Ms: TARGET_P95_MS },
    };
    report.targetsMet =
      report.errors === 0 && report.runs.failed === 0 && (report.latencyMs.p95 ?? Infinity) <= TARGET_P95_MS;
    const out = path.join(repoRoot, '.data', 'bench', 'load.json');
    fs.mkdirSync(path.dirname(out), { recursive: true });
    fs.writeFileSync(out, `${JSON.stringify(report, null, 2)}\n`);
    console.log(JSON.stringify(report, null, 2));
    log(`Written to ${path.relative(repoRoot, out)}; targets ${report.targetsMet ? 'met' : 'NOT met'}`);
    process.exitCode = report.targetsMet ? 0 : 1;
  } finally {
    agent.destroy();
    await stack.stop();
  }
}

main().catch((error) => {
  console.error(`[load] ${error instanceof Error ? error.stack : error}`);
  process.exit(1);
});
