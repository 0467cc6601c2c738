import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { join, resolve } from 'node:path';
import { ApiClient } from './api-client';
import { ProcessMemory } from './process-memory';

/** The repository root, from workers/dist/bench/stack. */
export const REPO_ROOT = resolve(__dirname, '..', '..', '..', '..');

interface ThrowawayServices {
  databaseUrl: string;
  redisUrl: string;
  stop(): Promise<void>;
}
interface LocalServices {
  ensureSystemPackages(names: string[], log?: (line: string) => void): void;
  startThrowawayServices(): Promise<ThrowawayServices>;
  freePort(): Promise<number>;
}
// Plain CommonJS shared with the test scripts; loaded at run time so the workers build does not reach into api.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const localServices = require(join(REPO_ROOT, 'api', 'scripts', 'local-services.cjs')) as LocalServices;

const DEMO_ANALYST = 'analyst@demo.provenote.test';
const DEMO_PASSWORD = 'provenote-demo';

/**
 * The product as `npm start` runs it, on throwaway PostgreSQL and Redis: the API process and one
 * separate worker process (WORKERS=external), so the API's own memory is measured apart from the
 * numeric work. The demo lab's analyst is signed in.
 */
export interface BenchStack {
  readonly baseUrl: string;
  readonly client: ApiClient;
  readonly labId: string;
  readonly apiMemory: ProcessMemory;
  readonly workerMemory: ProcessMemory;
  /** Restarts the API process (same database) serving this built web app beside the API. */
  serveWeb(webDist: string): Promise<void>;
}

class RunningStack implements BenchStack {
  baseUrl = '';
  client = new ApiClient('http://127.0.0.1');
  labId = '';
  apiMemory!: ProcessMemory;
  workerMemory!: ProcessMemory;
  private api?: ChildProcess;
  private worker?: ChildProcess;
  private webDist?: string;

  constructor(
    private readonly services: ThrowawayServices,
    private readonly port: number,
  ) {}

  private env(): NodeJS.ProcessEnv {
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      DATABASE_URL: this.services.databaseUrl,
      REDIS_URL: this.services.redisUrl,
      HOST: '127.0.0.1',
      PORT: String(this.port),
      NODE_ENV: 'production',
      MAIL_MODE: 'embedded',
      WORKERS: 'external',
      WORKER_CONCURRENCY: '1',
      UPLOAD_LIMIT_MB: '100',
    };
    delete env.PUBLIC_URL;
    delete env.SMTP_URL;
    if (this.webDist) env.WEB_DIST = this.webDist;
    else delete env.WEB_DIST;
    return env;
  }

  async start(): Promise<void> {
    execFileSync(process.execPath, [join(REPO_ROOT, 'api', 'dist', 'cli', 'prepare-database.js')], {
      env: this.env(),
      stdio: 'ignore',
    });
    this.worker = startChild('worker', join(REPO_ROOT, 'api', 'dist', 'queue', 'worker-main.js'), this.env());
    this.workerMemory = new ProcessMemory(this.worker.pid!);
    await this.startApi();
    await this.client.signIn(DEMO_ANALYST, DEMO_PASSWORD);
    const me = (await this.client.ok('GET', '/api/me')).json<{ memberships: { labId: string }[] }>();
    const labId = me.memberships[0]?.labId;
    if (!labId) throw new Error(`the demo analyst ${DEMO_ANALYST} belongs to no lab`);
    this.labId = labId;
  }

  private async startApi(): Promise<void> {
    this.api = startChild('api', join(REPO_ROOT, 'api', 'dist', 'main.js'), this.env());
    this.apiMemory = new ProcessMemory(this.api.pid!);
    this.baseUrl = `http://127.0.0.1:${this.port}`;
    const deadline = Date.now() + 60_000;
    for (;;) {
      if (this.api.exitCode !== null) throw new Error(`the API process exited with ${this.api.exitCode}`);
      const probe = new ApiClient(this.baseUrl);
      const up = await probe.send('GET', '/api/health').then(
        (r) => r.status === 200,
        () => false,
      );
      probe.close();
      if (up) break;
      if (Date.now() > deadline) throw new Error('the API did not answer /api/health within 60 s');
      await new Promise((r) => setTimeout(r, 200));
    }
    // A new process means a new session: start from an empty cookie jar on the new address.
    const previous = this.client;
    this.client = new ApiClient(this.baseUrl);
    previous.close();
  }

  async serveWeb(webDist: string): Promise<void> {
    if (this.webDist === webDist) return;
    this.webDist = webDist;
    await stopChild(this.api);
    await this.startApi();
    await this.client.signIn(DEMO_ANALYST, DEMO_PASSWORD);
  }

  async stop(): Promise<void> {
    this.client.close();
    await Promise.all([stopChild(this.api), stopChild(this.worker)]);
    await this.services.stop();
  }
}

/** BENCH_CPU_PROFILE=1 writes a V8 CPU profile per child process into .data/bench/profiles (open in DevTools). */
function profileFlags(): string[] {
  if (!process.env.BENCH_CPU_PROFILE) return [];
  return ['--cpu-prof', `--cpu-prof-dir=${join(REPO_ROOT, '.data', 'bench', 'profiles')}`];
}

function startChild(name: string, script: string, env: NodeJS.ProcessEnv): ChildProcess {
  const child = spawn(process.execPath, [...profileFlags(), script], {
    cwd: REPO_ROOT,
    env,
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  // Errors only: the bench's own table stays readable, and a crash still says why.
  child.stderr?.on('data', (chunk: Buffer) => process.stderr.write(`[${name}] ${chunk.toString('utf8')}`));
  return child;
}

function stopChild(child: ChildProcess | undefined): Promise<void> {
  if (!child || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((done) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
    child.once('exit', () => {
      clearTimeout(timer);
      done();
    });
    child.kill('SIGTERM');
  });
}

let running: Promise<RunningStack> | undefined;

/** Starts the stack on first use (building the server code); later sections share it. */
export function benchStack(log: (line: string) => void): Promise<BenchStack> {
  running ??= (async () => {
    log('building the server code and starting PostgreSQL, Redis, the API and a worker…');
    try {
      execFileSync(process.execPath, [require.resolve('typescript/bin/tsc', { paths: [REPO_ROOT] }), '-b', 'api'], {
        cwd: REPO_ROOT,
        stdio: ['ignore', 'ignore', 'inherit'],
      });
    } catch {
      // As in bench.cjs: tsc still emits JavaScript when it reports type errors (often someone's work in progress).
      log('warning: the TypeScript build of api reported errors; measuring the JavaScript it emitted');
    }
    // As npm start and npm test do: Debian's PostgreSQL, Redis and Chromium, installed on first use.
    localServices.ensureSystemPackages(['postgres', 'redis', 'chromium'], log);
    const services = await localServices.startThrowawayServices();
    const stack = new RunningStack(services, await localServices.freePort());
    try {
      await stack.start();
    } catch (error) {
      await stack.stop();
      throw error;
    }
    return stack;
  })();
  return running;
}

/** Stops whatever benchStack started; safe to call when nothing was started or the start failed. */
export async function stopBenchStack(): Promise<void> {
  const current = running;
  running = undefined;
  if (!current) return;
  const stack = await current.catch(() => undefined);
  await stack?.stop();
}
