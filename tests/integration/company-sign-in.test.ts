import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { call, DEMO_PASSWORD, signIn } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { authenticate } from '@/lib/auth/users';
import { companySettings, rolesOfGroups, setCompanySettings, signInWithCompanyAccount } from '@/lib/auth/company';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { demoActor } from '@/seeders/20261201000100-demo-users';
import { plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';

/** Company sign-in: groups → roles at every sign-in, refusals with reasons, and the password switch. */
describe('company sign-in', () => {
  afterAll(() => closeSequelize());
  const mapping = [{ group: 'thermal-methods', role: 'author' as const }, { group: 'thermal-approvers', role: 'approver' as const }, { group: 'thermal-engineers', role: 'engineer' as const }];

  it('maps groups to roles, ignoring groups it does not know', () => {
    expect(rolesOfGroups(['thermal-engineers', 'sales', 'thermal-approvers'], mapping)).toEqual(['approver', 'engineer']);
    expect(rolesOfGroups(['sales'], mapping)).toEqual([]);
  });

  it('creates the person at the first sign-in and sets their roles from their groups at every sign-in, ending older sessions when they change', async () => {
    const before = await companySettings();
    await setCompanySettings({ actor: null, settings: { ...before, groupRoles: mapping } });
    try {
      const email = `company-${Date.now()}@brightwater.example`;
      const first = await signInWithCompanyAccount({ email, emailVerified: true, name: 'Test Person', groups: ['thermal-approvers', 'thermal-engineers'] });
      expect(first.roles).toEqual(['approver', 'engineer']);
      const again = await signInWithCompanyAccount({ email, emailVerified: true, name: 'Test Person', groups: ['thermal-approvers', 'thermal-engineers'] });
      expect(again).toMatchObject({ id: first.id, sessionVersion: first.sessionVersion });
      const demoted = await signInWithCompanyAccount({ email, emailVerified: true, name: 'Test Person', groups: ['thermal-engineers'] });
      expect(demoted.roles).toEqual(['engineer']);
      expect(demoted.sessionVersion).toBe(first.sessionVersion + 1);
      const events = await db().sequelize.query<{ action: string }>('SELECT action FROM audit_events WHERE entity_type = ? AND entity_id = ? ORDER BY id', { replacements: ['user', String(first.id)], type: QueryTypes.SELECT });
      expect(events.map((e) => e.action)).toEqual(['user.created', 'user.signed-in', 'user.signed-in', 'user.roles-changed', 'user.signed-in']);
      // No group that maps: refused with the reason, nothing changed.
      await expect(signInWithCompanyAccount({ email, emailVerified: true, name: 'Test Person', groups: ['sales'] })).rejects.toMatchObject({ code: 'forbidden:no-role' });
      await expect(signInWithCompanyAccount({ email, emailVerified: false, name: 'Test Person', groups: ['thermal-engineers'] })).rejects.toMatchObject({ code: 'forbidden:company-email' });
      await db().User.update({ isActive: false }, { where: { id: first.id } });
      await expect(signInWithCompanyAccount({ email, emailVerified: true, name: 'Test Person', groups: ['thermal-engineers'] })).rejects.toMatchObject({ code: 'forbidden:inactive' });
    } finally {
      await setCompanySettings({ actor: null, settings: before });
    }
  });

  it('switches password sign-in off for everyone but the break-glass admin', async () => {
    const before = await companySettings();
    await setCompanySettings({ actor: null, settings: { ...before, passwordSignIn: false } });
    try {
      await expect(authenticate({ email: 'engineer@demo.example', password: DEMO_PASSWORD, client: 'company-test' })).rejects.toMatchObject({ code: 'forbidden:password-sign-in-off' });
      await expect(authenticate({ email: 'admin@demo.example', password: DEMO_PASSWORD, client: 'company-test' })).resolves.toMatchObject({ email: 'admin@demo.example' });
    } finally {
      await setCompanySettings({ actor: null, settings: before });
    }
    await expect(authenticate({ email: 'engineer@demo.example', password: DEMO_PASSWORD, client: 'company-test' })).resolves.toMatchObject({ email: 'engineer@demo.example' });
  });

  it('takes a company account\'s fresh sign-in as its signature, and refuses one older than five minutes', async () => {
    const author = await demoActor('author@demo.example');
    const approver = await demoActor('approver2@demo.example');
    const slug = `company-signature-${Date.now()}`;
    await createCorrelation({ actor: author, slug, definition: plateDefinition(), checkCases: plateCases() });
    await submitVersion({ actor: author, slug, version: 1 });
    const now = Math.floor(Date.now() / 1000);
    const stale = { ...approver, session: { via: 'company' as const, authAt: now - 301 } };
    await expect(decideVersion({ actor: stale, slug, version: 1, decision: 'approve', comment: 'ok', waiver: FIXTURE_WAIVER })).rejects.toMatchObject({ code: 'invalid:password', message: expect.stringContaining('within the last 5 minutes') });
    // A password session without a password is refused as before.
    await expect(decideVersion({ actor: { ...approver, session: { via: 'password', authAt: now } }, slug, version: 1, decision: 'approve', comment: 'ok', waiver: FIXTURE_WAIVER })).rejects.toMatchObject({ code: 'invalid:password' });
    const fresh = { ...approver, session: { via: 'company' as const, authAt: now - 10 } };
    await decideVersion({ actor: fresh, slug, version: 1, decision: 'approve', comment: 'ok', waiver: FIXTURE_WAIVER });
    const [signed] = await db().sequelize.query<{ status: string; user_id: number; decision: string }>(
      `SELECT v.status, s.user_id, s.decision FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
       JOIN sign_offs s ON s.version_id = v.id WHERE c.slug = ? AND v.version = 1`, { replacements: [slug], type: QueryTypes.SELECT });
    expect(signed).toEqual({ status: 'approved', user_id: approver.id, decision: 'approved' });
  });

  it('lets only an admin, in person, read and change the mapping; bad rows are named', async () => {
    const admin = (await signIn('admin@demo.example')).cookie!;
    const engineer = (await signIn('engineer@demo.example')).cookie!;
    expect((await call('/api/admin/sign-in', { cookie: engineer })).status).toBe(403);
    const current = await call('/api/admin/sign-in', { cookie: admin });
    expect(current.status).toBe(200);
    const bad = await call('/api/admin/sign-in', { cookie: admin, method: 'PUT', body: { passwordSignIn: true, groupRoles: [{ group: 'two words', role: 'engineer' }, { group: 'x', role: 'boss' }] } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.issues.map((i: { path: string }) => i.path)).toEqual(['groupRoles.0.group', 'groupRoles.1.role']);
    const same = await call('/api/admin/sign-in', { cookie: admin, method: 'PUT', body: { passwordSignIn: current.body.passwordSignIn, groupRoles: current.body.groupRoles } });
    expect(same.status).toBe(200);
  });
});
