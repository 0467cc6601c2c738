import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from './typeorm-options';

/** The data source the TypeORM CLI uses (`npm run migration:generate -w api -- src/database/migrations/Name`). */
const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is missing: point it at the database to migrate');

export default new DataSource(dataSourceOptions(url));
