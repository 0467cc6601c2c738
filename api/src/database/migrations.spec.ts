import { DataSource } from 'typeorm';
import { createTestDatabase, type TestDatabase } from '../../test/test-database';
import { dataSourceOptions } from './typeorm-options';

const userTables = (dataSource: DataSource) =>
  dataSource
    .query(`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY 1`)
    .then((rows: { table_name: string }[]) => rows.map((row) => row.table_name));

describe('migrations', () => {
  let database: TestDatabase;
  let dataSource: DataSource;

  beforeAll(async () => {
    database = await createTestDatabase({ empty: true });
    dataSource = new DataSource(dataSourceOptions(database.url));
    await dataSource.initialize();
  });

  afterAll(async () => {
    await dataSource.destroy();
    await database.drop();
  });

  it('apply to an empty database, match the entities, and revert cleanly', async () => {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    expect(applied.length).toBe(dataSource.migrations.length);
    expect(await userTables(dataSource)).toEqual(expect.arrayContaining(['labs', 'memberships', 'users']));

    // The committed migrations describe exactly what the entities declare.
    const pending = await dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((query) => query.query)).toEqual([]);

    for (let i = 0; i < applied.length; i++) await dataSource.undoLastMigration({ transaction: 'each' });
    expect(await userTables(dataSource)).toEqual(['schema_migrations']);
  });
});
