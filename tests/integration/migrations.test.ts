import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes, Sequelize } from 'sequelize';
import { createMigrator } from '@/lib/db/migrator';
import { migrations } from '@/migrations';

// A scratch database of its own, so going down does not disturb the server the other tests use.
const sequelize = new Sequelize(`${process.env.DB_TEST_NAME ?? 'correlary_test'}_scratch`, process.env.DB_USER ?? 'correlary', process.env.DB_PASSWORD ?? '', {
  host: process.env.DB_HOST ?? '127.0.0.1', port: Number(process.env.DB_PORT ?? 3307), dialect: 'mariadb', logging: false,
});

async function tables(): Promise<string[]> {
  const rows = await sequelize.query<{ t: string }>('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY t', { type: QueryTypes.SELECT });
  return rows.map((r) => r.t).filter((t) => t !== 'SequelizeMeta');
}

describe('migrations against the real MariaDB', () => {
  afterAll(() => sequelize.close());

  it('run up, down to nothing, and up again, ending with the same tables', async () => {
    const migrator = createMigrator(sequelize);
    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);
    await migrator.up();
    const first = await tables();
    expect(first).toEqual(expect.arrayContaining(['users', 'user_roles', 'correlations', 'correlation_versions', 'audit_events', 'api_tokens']));
    expect(await migrator.pending()).toEqual([]);
    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);
    expect((await migrator.executed()).length).toBe(0);
    await migrator.up();
    expect(await tables()).toEqual(first);
    expect((await migrator.executed()).map((m) => m.name)).toEqual(migrations.map((m) => m.name));
  });
});
