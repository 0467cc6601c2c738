import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import cookieParser from 'cookie-parser';
import express, { type NextFunction, type Request, type Response } from 'express';
import helmet from 'helmet';
import { cleanupOpenApiDoc } from 'nestjs-zod';
import { AppModule } from './app.module';
import type { AppConfig } from './config/config';
import { APP_VERSION } from './version';

export const API_PREFIX = 'api';

/**
 * Builds the HTTP application: security headers, one origin for the API (under /api) and the built web
 * app, the OpenAPI description at /api/docs. Used by main.ts and by the HTTP tests.
 */
export async function createApp(config: AppConfig, options: { logger?: false } = {}) {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    logger: options.logger ?? ['log', 'warn', 'error'],
    bufferLogs: false,
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

/** The built single-page app: static assets, and index.html for every other non-API GET. */
function serveWebApp(app: NestExpressApplication, dist: string) {
  const index = join(dist, 'index.html');
  if (!existsSync(index)) throw new Error(`WEB_DIST has no index.html: ${dist} (run npm run build -w web)`);
  app.use(express.static(dist, { index: false, maxAge: '1h', immutable: false }));
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || req.path === `/${API_PREFIX}` || req.path.startsWith(`/${API_PREFIX}/`)) {
      return next();
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
