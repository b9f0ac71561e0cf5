import { Sequelize } from 'sequelize';

/** Database settings from the environment; tests point DB_NAME at the test database. */
export function databaseConfig() {
  return {
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3307),
    database: process.env.DB_NAME ?? 'correlary',
    username: process.env.DB_USER ?? 'correlary',
    password: process.env.DB_PASSWORD ?? '',
  };
}

const globalForDb = globalThis as unknown as { correlarySequelize?: Sequelize };

/**
 * One Sequelize instance per process (Next.js dev reloads modules; the global keeps the pool).
 * Always give raw queries a `type` (QueryTypes.SELECT, UPDATE…): with mariadb 3.5 an untyped raw
 * query fails in Sequelize ("Cannot delete property 'meta'").
 */
export function getSequelize(): Sequelize {
  if (!globalForDb.correlarySequelize) {
    const cfg = databaseConfig();
    globalForDb.correlarySequelize = new Sequelize(cfg.database, cfg.username, cfg.password, {
      host: cfg.host,
      port: cfg.port,
      dialect: 'mariadb',
      logging: false,
      pool: { max: 20, min: 0, idle: 10_000, acquire: 20_000 },
      dialectOptions: { timezone: 'Z', connectTimeout: 5_000 },
      timezone: '+00:00',
      define: { underscored: true },
    });
  }
  return globalForDb.correlarySequelize;
}

export async function closeSequelize(): Promise<void> {
  if (globalForDb.correlarySequelize) {
    await globalForDb.correlarySequelize.close();
    globalForDb.correlarySequelize = undefined;
  }
}
