import { join } from 'node:path';
import type { DataSourceOptions } from 'typeorm';

// Compiled (dist/*.js) and test (ts-jest, *.ts) runs load their own kind of file.
const ext = __filename.endsWith('.ts') ? 'ts' : 'js';

/** One description of the database for the app, the migration CLI and the tests. */
export function dataSourceOptions(url: string): DataSourceOptions {
  return {
    type: 'postgres',
    url,
    entities: [join(__dirname, '..', '**', `*.entity.${ext}`)],
    migrations: [join(__dirname, 'migrations', `*.${ext}`)],
    migrationsTableName: 'schema_migrations',
    synchronize: false,
    migrationsRun: false,
    // gen_random_uuid() is built into PostgreSQL 13+: no extension to install, none needed on a managed server.
    uuidExtension: 'pgcrypto',
    installExtensions: false,
  };
}
