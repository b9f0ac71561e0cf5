// Usage: tsx scripts/migrate.ts up | down [--to 0] | status
import { closeSequelize, getSequelize } from '@/lib/db/connection';
import { createMigrator } from '@/lib/db/migrator';

async function main() {
  const [command = 'up', ...rest] = process.argv.slice(2);
  const migrator = createMigrator(getSequelize());
  if (command === 'up') {
    const done = await migrator.up();
    console.log(done.length ? `Applied ${done.length} migration(s): ${done.map((m) => m.name).join(', ')}` : 'Schema is up to date');
  } else if (command === 'down') {
    const all = rest.includes('--all');
    const done = await migrator.down(all ? { to: 0 } : undefined);
    console.log(`Reverted ${done.length} migration(s)`);
  } else if (command === 'status') {
    const executed = await migrator.executed();
    const pending = await migrator.pending();
    console.log(`executed: ${executed.length}, pending: ${pending.map((m) => m.name).join(', ') || 'none'}`);
  } else {
    throw new Error(`Unknown command "${command}" (use up, down [--all] or status)`);
  }
}

main()
  .catch((err) => { console.error(err instanceof Error ? err.message : err); process.exitCode = 1; })
  .finally(() => closeSequelize());
