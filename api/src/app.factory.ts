import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import cookieParser from 'cookie-parser';
import express, { type NextFunction, type Request, type Response } from 'express';
import { PayloadTooLargeException } from '@nestjs/common';
import helmet from 'helmet';
import { cleanupOpenApiDoc } from 'nestjs-zod';
import { AppModule } from './app.module';
import type { AppConfig } from './config/config';
import { APP_VERSION } from './version';

export const API_PREFIX = 'api';

/**
 * The widest file a mapping may confirm. Instrument exports run to a few hundred columns; this leaves room for
 * wide merged sheets while keeping one request's parse bounded.
 */
export const MAX_MAPPING_COLUMNS = 20_000;
/** Room for MAX_MAPPING_COLUMNS columns at up to 1 kB of JSON each (a typical column takes about 120 bytes). */
const MAPPING_BODY_LIMIT = `${MAX_MAPPING_COLUMNS}kb`;
const DEFAULT_BODY_LIMIT = '100kb';
/** The routes whose body carries a whole mapping (one entry per column of the file). */
const MAPPING_ROUTE = new RegExp(
  `^/${API_PREFIX}/labs/[^/]+/(dataset-files/[^/]+/preview|datasets|datasets/[^/]+/versions)/?$`,
);

/**
 * Builds the HTTP application: security headers, one origin for the API (under /api) and the built web
 * app, the OpenAPI description at /api/docs. Used by main.ts and by the HTTP tests.
 */
export async function createApp(config: AppConfig, options: { logger?: false } = {}) {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    logger: options.logger ?? ['log', 'warn', 'error'],
    bufferLogs: false,
    // Registered below, so the mapping routes can take a larger body than the rest.
    bodyParser: false,
  });
  app.enableShutdownHooks();
  app.set('trust proxy', 'loopback');
  app.setGlobalPrefix(API_PREFIX);
  app.use((req: Request & { id?: string }, res: Response, next: NextFunction) => {
    req.id = randomUUID();
    res.setHeader('X-Request-Id', req.id);
    next();
  });
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Mantine and Plotly add style elements at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.enableCors({ origin: new URL(config.PUBLIC_URL).origin, credentials: true });
  app.use(cookieParser());
  useBodyParsers(app);

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Provenote API')
      .setDescription('Provenance assignment of geochemical samples to reference groups.')
      .setVersion(APP_VERSION)
      .addCookieAuth('provenote_session')
      .build(),
  );
  SwaggerModule.setup(`${API_PREFIX}/docs`, app, cleanupOpenApiDoc(document), {
    jsonDocumentUrl: `${API_PREFIX}/docs/openapi.json`,
  });

  if (config.WEB_DIST) serveWebApp(app, config.WEB_DIST);
  return app;
}

function useBodyParsers(app: NestExpressApplication) {
  const mappingJson = express.json({ limit: MAPPING_BODY_LIMIT });
  const json = express.json({ limit: DEFAULT_BODY_LIMIT });
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'POST' || !MAPPING_ROUTE.test(req.path)) return json(req, res, next);
    mappingJson(req, res, (error?: unknown) => {
      if (error) return next(isTooLarge(error) ? tooManyColumns() : error);
      const columns = (req.body as { mapping?: { columns?: unknown } } | undefined)?.mapping?.columns;
      next(Array.isArray(columns) && columns.length > MAX_MAPPING_COLUMNS ? tooManyColumns() : undefined);
    });
  });
  app.use(express.urlencoded({ extended: true, limit: DEFAULT_BODY_LIMIT }));
}

const isTooLarge = (error: unknown) => (error as { type?: unknown }).type === 'entity.too.large';

const tooManyColumns = () =>
  new PayloadTooLargeException(
    `A mapping may confirm at most ${MAX_MAPPING_COLUMNS.toLocaleString('en')} columns; ` +
      'split the file into narrower files (sample id plus a share of the columns) and import each',
  );

const isApiPath = (path: string) => path === `/${API_PREFIX}` || path.startsWith(`/${API_PREFIX}/`);

/** The built single-page app: static assets, and index.html for every other non-API GET. */
function serveWebApp(app: NestExpressApplication, dist: string) {
  const index = join(dist, 'index.html');
  if (!existsSync(index)) throw new Error(`WEB_DIST has no index.html: ${dist} (run npm run build -w web)`);
  const assets = express.static(dist, { index: false, maxAge: '1h', immutable: false });
  // API requests skip the file lookup the static handler would make for each of them.
  app.use((req: Request, res: Response, next: NextFunction) => (isApiPath(req.path) ? next() : assets(req, res, next)));
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || isApiPath(req.path)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
