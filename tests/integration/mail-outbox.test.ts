import { afterAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { Op } from 'sequelize';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { closeMail, deliverPendingMail, enqueueMail } from '@/lib/mail/outbox';

const MAIL_DIR = process.env.MAIL_DIR!;
const received = (subjectPart: string) => (existsSync(MAIL_DIR) ? readdirSync(MAIL_DIR) : [])
  .map((f) => JSON.parse(readFileSync(join(MAIL_DIR, f), 'utf8')) as { subject: string })
  .filter((m) => m.subject.includes(subjectPart));

describe('mail outbox', () => {
  afterAll(async () => { closeMail(); await closeSequelize(); });

  it('sends each message once when several deliveries run at once (two approvals committing together, two instances)', async () => {
    const run = `outbox-race-${Date.now()}`;
    await db().sequelize.transaction((transaction) => enqueueMail({ transaction, messages: Array.from({ length: 8 }, (_, i) => ({
      to: `race${i}@demo.example`, subject: `[Correlary] ${run} message ${i}`, body: 'A message of the outbox race test.', kind: 'test',
    })) }));
    const results = await Promise.all([deliverPendingMail(), deliverPendingMail(), deliverPendingMail()]);
    // Between them the three deliveries sent each message exactly once.
    expect(results.reduce((n, r) => n + r.sent, 0)).toBeGreaterThanOrEqual(8);
    const rows = await db().Notification.findAll({ where: { subject: { [Op.like]: `%${run}%` } } });
    expect(rows.map((r) => r.status)).toEqual(Array(8).fill('sent'));
    for (let wait = 0; wait < 20 && received(run).length < 8; wait++) await new Promise((r) => setTimeout(r, 100));
    const subjects = received(run).map((m) => m.subject).sort();
    expect(subjects).toEqual(Array.from({ length: 8 }, (_, i) => `[Correlary] ${run} message ${i}`).sort());
  });

  it('takes over a claim left by a delivery that died mid-send, and only a stale one', async () => {
    const run = `outbox-stale-${Date.now()}`;
    const { Notification } = db();
    const base = { body: 'A message of the stale-claim test.', kind: 'test', versionId: null, error: null, sentAt: null };
    const [stale, fresh] = await Notification.bulkCreate([
      { ...base, toEmail: 'stale@demo.example', subject: `[Correlary] ${run} stale`, status: 'sending', claimedAt: new Date(Date.now() - 11 * 60_000) },
      { ...base, toEmail: 'fresh@demo.example', subject: `[Correlary] ${run} fresh`, status: 'sending', claimedAt: new Date() },
    ]);
    await deliverPendingMail();
    expect((await Notification.findByPk(stale.id))!.status).toBe('sent');
    expect((await Notification.findByPk(fresh.id))!.status).toBe('sending');
    await Notification.update({ status: 'sent' }, { where: { id: fresh.id } }); // leave nothing for other tests
  });
});
