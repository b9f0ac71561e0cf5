import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, signIn } from '../support/http';
import { freshUser } from '../support/fixtures';
import { closeSequelize } from '@/lib/db/connection';

/** The admin's audit trail: filters, links' raw material and a CSV export a spreadsheet cannot be tricked by. */
describe('audit trail filters and export', () => {
  let admin: string;
  let actor: Awaited<ReturnType<typeof freshUser>>;
  beforeAll(async () => {
    admin = (await signIn('admin@demo.example')).cookie!;
    actor = await freshUser(['integrator'], 'audit');
    // Two events by a fresh person: one token named like a spreadsheet formula, then its revocation.
    const made = await call('/api/tokens', { cookie: actor.cookie, body: { name: '=HYPERLINK("http://x")', scopes: ['read'], expiresInDays: 1 } });
    expect(made.status).toBe(200);
    const mine = await call('/api/tokens', { cookie: actor.cookie });
    expect((await call(`/api/tokens/${mine.body.items[0].id}`, { cookie: actor.cookie, method: 'DELETE' })).status).toBe(200);
  });
  afterAll(() => closeSequelize());

  it('filters by who, what and subject, and says how many match', async () => {
    const byActor = await call(`/api/admin/audit?actor=${encodeURIComponent(actor.user.email)}`, { cookie: admin });
    expect(byActor.body.items.map((e: { action: string }) => e.action).sort()).toEqual(['token.created', 'token.revoked']);
    expect(byActor.body.total).toBe(2);
    const created = await call(`/api/admin/audit?actor=${encodeURIComponent(actor.user.email)}&action=token.created`, { cookie: admin });
    expect(created.body.items).toHaveLength(1);
    const versions = await call('/api/admin/audit?action=version.&pageSize=200', { cookie: admin });
    expect(versions.body.items.length).toBeGreaterThan(0);
    expect(versions.body.items.every((e: { action: string; entityType: string }) => e.action.startsWith('version.') && e.entityType === 'version')).toBe(true);
    const subject = await call('/api/admin/audit?subject=pipe-turbulent-gnielinski@', { cookie: admin });
    expect(subject.body.items.every((e: { entityId: string }) => e.entityId.startsWith('pipe-turbulent-gnielinski@'))).toBe(true);
    expect((await call('/api/admin/audit?actor=nobody%40nowhere.example', { cookie: admin })).body.total).toBe(0);
    const future = await call('/api/admin/audit?from=2999-01-01', { cookie: admin });
    expect(future.body.total).toBe(0);
  });

  it('refuses a malformed filter by name, and exports CSV with formulas neutralised', async () => {
    const bad = await call('/api/admin/audit?from=yesterday', { cookie: admin });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.issues[0].path).toBe('from');
    const res = await fetch(`${process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100'}/api/admin/audit?format=csv&actor=${encodeURIComponent(actor.user.email)}`, { headers: { cookie: admin } });
    expect(res.headers.get('content-type')).toContain('text/csv');
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="correlary-audit-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = (await res.text()).trim().split('\n');
    expect(lines[0]).toBe('id,at_utc,actor,action,subject_type,subject,before_hash,after_hash,details,event_hash');
    expect(lines).toHaveLength(3);
    // The token's name sits inside the JSON details, which start with "{", so nothing here can start a formula.
    expect(lines.every((l) => !/(^|,)"[=+\-@]/.test(l))).toBe(true);
    expect(lines.some((l) => l.includes('token.created'))).toBe(true);
  });
});
