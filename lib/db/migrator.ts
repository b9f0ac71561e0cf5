import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { migrations } from '@/migrations';

export const MIGRATION_TABLE = 'SequelizeMeta';

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: migrations.map((m) => ({
      name: m.name,
      up: ({ context }) => m.up(context),
      down: ({ context }) => m.down(context),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: MIGRATION_TABLE }),
    logger: undefined,
  });
}

/** Names of migrations known to the code but not yet applied to the database. */
export async function pendingMigrations(sequelize: Sequelize): Promise<string[]> {
  const pending = await createMigrator(sequelize).pending();
  return pending.map((m) => m.name);
}
