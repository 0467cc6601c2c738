import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { createApp } from './app.factory';
import { ConfigurationError, loadConfig } from './config/config';

async function bootstrap() {
  const config = loadConfig();
  const app = await createApp(config);
  await app.listen(config.PORT, config.HOST);
  Logger.log(`Provenote API listening on ${config.PUBLIC_URL}`, 'Bootstrap');
}

bootstrap().catch((error: unknown) => {
  if (error instanceof ConfigurationError) {
    console.error(error.message);
  } else {
    console.error(error);
  }
  process.exit(1);
});
