import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { isConcurrentChange, isDatabaseUnavailable } from '@/lib/db/errors';

/**
 * What MariaDB really answers when two transactions collide, as the driver and Sequelize hand it over: the API
 * answers these 503 "unavailable:concurrent-change" with Retry-After (lib/http/handler.ts). A Galera cluster reports a
 * certification conflict the same way as a deadlock (error 1213, from memory of the Galera documentation).
 */
describe('database errors the API tells apart', () => {
  const table = `probe_locks_${process.pid}`;
  beforeAll(async () => {
    await db().sequelize.query(`CREATE TABLE ${table} (id INT PRIMARY KEY, n INT NOT NULL) ENGINE=InnoDB`);
    await db().sequelize.query(`INSERT INTO ${table} VALUES (1, 0), (2, 0)`);
  });
  afterAll(async () => {
    await db().sequelize.query(`DROP TABLE IF EXISTS ${table}`);
    await closeSequelize();
  });

  it('recognises a real deadlock between two transactions', async () => {
    const { sequelize } = db();
    const t1 = await sequelize.transaction();
    const t2 = await sequelize.transaction();
    const lock = (t: typeof t1, id: number) => sequelize.query(`SELECT n FROM ${table} WHERE id = ? FOR UPDATE`, { replacements: [id], transaction: t, type: QueryTypes.SELECT });
    await lock(t1, 1);
    await lock(t2, 2);
    const outcomes = await Promise.allSettled([lock(t1, 2), new Promise((r) => setTimeout(r, 100)).then(() => lock(t2, 1))]);
    await t1.rollback().catch(() => undefined);
    await t2.rollback().catch(() => undefined);
    const refused = outcomes.filter((o): o is PromiseRejectedResult => o.status === 'rejected');
    expect(refused).toHaveLength(1);
    expect(isConcurrentChange(refused[0].reason)).toBe(true);
    expect(isDatabaseUnavailable(refused[0].reason)).toBe(false);
  });

  it('recognises a lock wait that timed out, and not an ordinary bad query', async () => {
    const { sequelize } = db();
    const holder = await sequelize.transaction();
    const waiter = await sequelize.transaction();
    await sequelize.query(`SELECT n FROM ${table} WHERE id = 1 FOR UPDATE`, { transaction: holder, type: QueryTypes.SELECT });
    await sequelize.query('SET SESSION innodb_lock_wait_timeout = 1', { transaction: waiter });
    const timedOut = await sequelize.query(`UPDATE ${table} SET n = n + 1 WHERE id = 1`, { transaction: waiter }).catch((err: unknown) => err);
    await sequelize.query('SET SESSION innodb_lock_wait_timeout = DEFAULT', { transaction: waiter }).catch(() => undefined);
    await waiter.rollback().catch(() => undefined);
    await holder.rollback();
    expect(isConcurrentChange(timedOut)).toBe(true);
    const bad = await sequelize.query(`SELECT nothing FROM ${table}`, { type: QueryTypes.SELECT }).catch((err: unknown) => err);
    expect(isConcurrentChange(bad)).toBe(false);
    expect(isDatabaseUnavailable(bad)).toBe(false);
  });
});
