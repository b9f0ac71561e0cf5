import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { call } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken } from '@/lib/api/tokens';
import { verifyAuditChain } from '@/lib/audit/log';

const dbScript = (what: 'start' | 'stop') => execFileSync('bash', ['scripts/db.sh', what], { encoding: 'utf8', stdio: 'pipe' });
const auditCount = async () => db().AuditEvent.count();

describe('the database goes away and comes back', () => {
  afterAll(async () => { dbScript('start'); await closeSequelize(); });

  it('answers 503 with a clear message during the outage, recovers by itself, and loses or doubles no audit event', async () => {
    const integrator = (await db().User.findOne({ where: { email: 'integrator@demo.example' } }))!.id;
    const { token } = await createApiToken({ actorId: null, userId: integrator, name: 'outage', scopes: ['read', 'evaluate', 'write'], expiresAt: null });
    const before = await auditCount();
    expect((await verifyAuditChain()).intact).toBe(true);

    dbScript('stop');
    try {
      const answers = await Promise.all(Array.from({ length: 20 }, (_, i) => (i % 2
        ? call('/api/correlations/pipe-turbulent-gnielinski/evaluate', { token, body: { inputs: { Re_D: 1e4, Pr: 3 } } })
        : call('/api/correlations/friction-factor-blasius', { token }))));
      for (const a of answers) {
        expect(a.status).toBe(503);
        expect(a.body.error.code).toBe('unavailable:database');
        expect(a.headers.get('retry-after')).toBe('5');
      }
      expect((await call('/api/health')).status).toBe(503);
    } finally {
      dbScript('start');
    }
    // The connection pool finds the server again without a restart of the app.
    let healthy = false;
    for (let i = 0; i < 60 && !healthy; i++) {
      healthy = (await call('/api/health')).status === 200;
      if (!healthy) await new Promise((r) => setTimeout(r, 500));
    }
    expect(healthy).toBe(true);
    const ok = await call('/api/correlations/pipe-turbulent-gnielinski/evaluate', { token, body: { inputs: { Re_D: 1e4, Pr: 3 } } });
    expect(ok.status).toBe(200);
    // This process's own pool may hold connections that died with the server: the first query can fail once.
    const count = await auditCount().catch(() => auditCount());
    expect(count).toBe(before);
    expect((await verifyAuditChain()).intact).toBe(true);
  });
});
