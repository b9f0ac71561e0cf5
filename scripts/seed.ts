// Usage: tsx scripts/seed.ts [up|down]  — runs the seeders not yet applied (tracked in SequelizeData).
import { Umzug, SequelizeStorage } from 'umzug';
import { closeSequelize, getSequelize } from '@/lib/db/connection';
import { seeders } from '@/seeders';

async function main() {
  const sequelize = getSequelize();
  const umzug = new Umzug({
    migrations: seeders.map((s) => ({ name: s.name, up: () => s.up(), down: () => s.down() })),
    storage: new SequelizeStorage({ sequelize, tableName: 'SequelizeData' }),
    logger: undefined,
  });
  const command = process.argv[2] ?? 'up';
  const done = command === 'down' ? await umzug.down({ to: 0 }) : await umzug.up();
  console.log(done.length ? `${command === 'down' ? 'Reverted' : 'Applied'} seeder(s): ${done.map((m) => m.name).join(', ')}` : 'Seed data is up to date');
}

main()
  .catch((err) => { console.error(`Seeding failed: ${err instanceof Error ? err.message : err}`); process.exitCode = 1; })
  .finally(() => closeSequelize());
