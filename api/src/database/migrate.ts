import { DataSource } from 'typeorm';
import { dataSourceOptions } from './typeorm-options';

/** Applies every pending migration; returns the names applied. */
export async function runMigrations(url: string): Promise<string[]> {
  const dataSource = new DataSource(dataSourceOptions(url));
  await dataSource.initialize();
  try {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    return applied.map((migration) => migration.name);
  } finally {
    await dataSource.destroy();
  }
}
