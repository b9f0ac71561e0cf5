// Usage: tsx scripts/seed.ts [up|down]  — runs the seeders not yet applied (tracked in SequelizeData).
import { Umzug, SequelizeStorage } from 'umzug';
import { closeSequelize, getSequelize } from '@/lib/db/connection';
import { seeders } from '@/seeders';
import { closeMail, deferMailDelivery, deliverPendingMail } from '@/lib/mail/outbox';
import { flushUsage } from '@/lib/api/usage';

async function main() {
  const sequelize = getSequelize();
  const umzug = new Umzug({
    migrations: seeders.map((s) => ({ name: s.name, up: () => s.up(), down: () => s.down() })),
    storage: new SequelizeStorage({ sequelize, tableName: 'SequelizeData' }),
    logger: undefined,
  });
  const command = process.argv[2] ?? 'up';
  deferMailDelivery(true);
  const done = command === 'down' ? await umzug.down({ to: 0 }) : await umzug.up();
  await flushUsage();
  for (let round = 0; round < 20; round++) {
    const { sent, failed } = await deliverPendingMail();
    if (sent === 0 || failed > 0) {
      if (failed) console.warn(`${failed} notification(s) could not be sent (is the SMTP server on ${process.env.SMTP_HOST ?? '127.0.0.1'}:${process.env.SMTP_PORT ?? 2525} running?); they stay in the outbox.`);
      break;
    }
  }
  console.log(done.length ? `${command === 'down' ? 'Reverted' : 'Applied'} seeder(s): ${done.map((m) => m.name).join(', ')}` : 'Seed data is up to date');
}

main()
  .catch((err) => { console.error(`Seeding failed: ${err instanceof Error ? err.message : err}`); process.exitCode = 1; })
  .finally(() => { closeMail(); return closeSequelize(); });
