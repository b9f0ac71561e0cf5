import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';

const TARGET = `${process.env.DB_NAME}_restore`;

describe('backup and restore', () => {
  const dir = mkdtempSync(join(tmpdir(), 'correlary-backup-'));
  afterAll(async () => {
    rmSync(dir, { recursive: true, force: true });
    execFileSync('bash', ['-c', `. scripts/env.sh && mariadb --defaults-file="$DATA_DIR/mariadb/my.cnf" --user=root -e 'DROP DATABASE IF EXISTS \`${TARGET}\`'`], { stdio: 'pipe', env: { ...process.env, PATH: `${process.env.PATH}:/usr/sbin` } });
    await closeSequelize();
  });

  it('restores a backup into a fresh database whose audit chain and content hashes all verify', async () => {
    const file = join(dir, 'test.sql.gz');
    execFileSync('bash', ['-c', `. scripts/env.sh && mariadb --defaults-file="$DATA_DIR/mariadb/my.cnf" --user=root -e 'DROP DATABASE IF EXISTS \`${TARGET}\`'`], { stdio: 'pipe', env: { ...process.env, PATH: `${process.env.PATH}:/usr/sbin` } });
    expect(execFileSync('npm', ['run', '-s', 'db:backup', '--', file], { encoding: 'utf8', env: process.env })).toMatch(/Backed up/);
    expect(statSync(file).size).toBeGreaterThan(10_000);
    expect(execFileSync('npm', ['run', '-s', 'db:restore', '--', file, TARGET], { encoding: 'utf8', env: process.env })).toMatch(`Restored ${file} into ${TARGET}`);
    // A second restore into the same, now full, database is refused.
    expect(() => execFileSync('npm', ['run', '-s', 'db:restore', '--', file, TARGET], { encoding: 'utf8', env: process.env, stdio: 'pipe' })).toThrow();
    const out = execFileSync('npm', ['run', '-s', 'audit:verify'], { encoding: 'utf8', env: { ...process.env, DB_NAME: TARGET } });
    const [{ events }] = await db().sequelize.query<{ events: number }>('SELECT COUNT(*) AS events FROM audit_events', { type: QueryTypes.SELECT });
    const [{ frozen }] = await db().sequelize.query<{ frozen: number }>('SELECT COUNT(*) AS frozen FROM correlation_versions WHERE content_hash IS NOT NULL', { type: QueryTypes.SELECT });
    expect(out).toMatch(/Audit chain intact: (\d+) events/);
    expect(Number(/Audit chain intact: (\d+) events/.exec(out)![1])).toBe(Number(events));
    expect(Number(/Content hashes intact: (\d+) frozen versions/.exec(out)![1])).toBe(Number(frozen));
  });
});
