import { z } from 'zod';

/**
 * The api's configuration, read from the environment once at start. Everything the process needs to know
 * about its surroundings is here; nothing else reads process.env.
 */
const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/, error: 'must be a postgres:// URL' }),
  REDIS_URL: z.url({ protocol: /^rediss?$/, error: 'must be a redis:// URL' }),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  /** The origin people open in a browser; links in mails point here and CORS allows only it. */
  PUBLIC_URL: z.url().optional(),
  /** Built web app to serve beside the API (one origin); unset in `npm run dev`, where Vite serves it. */
  WEB_DIST: z.string().optional(),
  /** embedded: a local fake SMTP server in this process, with an outbox page; smtp: send through SMTP_URL. */
  MAIL_MODE: z.enum(['embedded', 'smtp']).default('embedded'),
  SMTP_URL: z.url({ protocol: /^smtps?$/, error: 'must be an smtp:// or smtps:// URL' }).optional(),
  MAIL_FROM: z.string().default('Provenote <no-reply@provenote.invalid>'),
  /** embedded: this process also runs the job processors; external: only enqueue (see `npm run worker`). */
  WORKERS: z.enum(['embedded', 'external']).default('embedded'),
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
  /** Redis key prefix of the run queue; by default derived from the database name, so installations sharing a Redis stay apart. */
  QUEUE_PREFIX: z
    .string()
    .regex(/^[\w:.-]+$/, 'may hold letters, digits and : . _ - only')
    .optional(),
  /** How long a worker holds a job without renewing; a dead worker's run moves on after about this long. */
  QUEUE_LOCK_MS: z.coerce.number().int().min(500).default(30_000),
  /** Upload limit for data files, in megabytes. */
  UPLOAD_LIMIT_MB: z.coerce.number().positive().default(50),
});

export type AppConfig = z.infer<typeof configSchema> & { PUBLIC_URL: string };

export class ConfigurationError extends Error {
  constructor(readonly problems: string[]) {
    super(`Provenote cannot start; fix these settings:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigurationError';
  }
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    throw new ConfigurationError(
      parsed.error.issues.map((issue) => {
        const name = issue.path.join('.');
        return env[name] === undefined ? `${name} is missing` : `${name} ${issue.message}`;
      }),
    );
  }
  const config = parsed.data;
  const problems: string[] = [];
  if (config.MAIL_MODE === 'smtp' && !config.SMTP_URL) problems.push('SMTP_URL is missing (MAIL_MODE=smtp)');
  if (problems.length > 0) throw new ConfigurationError(problems);
  return { ...config, PUBLIC_URL: config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}` };
}
