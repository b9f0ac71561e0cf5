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

let currentSince = 0;
const CURRENT_FOR_MS = 10_000;

/**
 * Names of migrations known to the code but not yet applied. Umzug's storage re-syncs its table on
 * every call, so a "none pending" answer is remembered for CURRENT_FOR_MS (the health endpoint asks often).
 */
export async function pendingMigrations(sequelize: Sequelize): Promise<string[]> {
  if (Date.now() - currentSince < CURRENT_FOR_MS) return [];
  const pending = (await createMigrator(sequelize).pending()).map((m) => m.name);
  currentSince = pending.length === 0 ? Date.now() : 0;
  return pending;
}
