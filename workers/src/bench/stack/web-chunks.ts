import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { REPO_ROOT } from './bench-stack';

export interface Chunk {
  readonly file: string;
  readonly bytes: number;
  readonly gzipBytes: number;
  readonly hasPlotly: boolean;
}

export interface WebBuild {
  readonly dist: string;
  readonly buildMs: number;
  /** The entry chunk index.html loads, and the chunks it preloads (static imports): what every visit pays. */
  readonly entry: Chunk;
  readonly preloaded: Chunk[];
  readonly chunks: Chunk[];
}

/**
 * Builds the web app with Vite into a temporary folder, away from web/dist that others may be serving.
 * Not under .data: Express's static files refuse any path with a dot-folder in it.
 */
export function buildWeb(): WebBuild {
  const dist = join(tmpdir(), 'provenote-bench-web');
  const vitePackage = require.resolve('vite/package.json', { paths: [join(REPO_ROOT, 'web')] });
  const vite = join(dirname(vitePackage), 'bin', 'vite.js');
  const started = performance.now();
  execFileSync(process.execPath, [vite, 'build', '--outDir', dist, '--emptyOutDir', '--logLevel', 'error'], {
    cwd: join(REPO_ROOT, 'web'),
    stdio: 'inherit',
  });
  const buildMs = performance.now() - started;
  const assets = join(dist, 'assets');
  const chunks = readdirSync(assets)
    .filter((file) => file.endsWith('.js'))
    .map((file): Chunk => {
      const content = readFileSync(join(assets, file));
      return {
        file,
        bytes: content.byteLength,
        gzipBytes: gzipSync(content, { level: 9 }).byteLength,
        // plotly.js-dist-min starts with its own banner naming the library.
        hasPlotly:
          /plotly\.js v\d/i.test(content.subarray(0, 4096).toString('utf8')) ||
          /\bPlotly\b/.test(content.toString('utf8')),
      };
    });
  const html = readFileSync(join(dist, 'index.html'), 'utf8');
  const named = (pattern: RegExp) =>
    [...html.matchAll(pattern)]
      .map((m) => m[1].split('/').pop()!)
      .map((file) => {
        const chunk = chunks.find((c) => c.file === file);
        if (!chunk) throw new Error(`index.html names ${file}, which the build did not write`);
        return chunk;
      });
  const [entry] = named(/<script type="module"[^>]*src="([^"]+\.js)"/g);
  if (!entry) throw new Error('index.html has no module script');
  return { dist, buildMs, entry, preloaded: named(/<link rel="modulepreload"[^>]*href="([^"]+\.js)"/g), chunks };
}
