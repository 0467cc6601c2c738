import { Global, Module } from '@nestjs/common';
import { AppConfig, loadConfig } from './config';

export const APP_CONFIG = Symbol('APP_CONFIG');

/** Provides the validated configuration to every module as the APP_CONFIG token. */
@Global()
@Module({})
export class AppConfigModule {
  static forRoot(config: AppConfig = loadConfig()) {
    return {
      module: AppConfigModule,
      providers: [{ provide: APP_CONFIG, useValue: config }],
      exports: [APP_CONFIG],
    };
  }
}
