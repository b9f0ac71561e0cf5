import { describe, expect, it, beforeAll } from 'vitest';
import { call, signIn } from '../support/http';
import { createUser } from '@/lib/auth/users';
import { closeSequelize } from '@/lib/db/connection';

describe('authentication and role checks on the server', () => {
  let engineer: string;
  let admin: string;

  beforeAll(async () => {
    engineer = (await signIn('engineer@demo.example')).cookie!;
    admin = (await signIn('admin@demo.example')).cookie!;
    expect(engineer).toMatch(/next-auth\.session-token=/);
    expect(admin).toMatch(/next-auth\.session-token=/);
  });

  it('answers 401 with the error shape when there is no session or token', async () => {
    const res = await call('/api/admin/users');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated:required');
  });

  it('answers 403 to a signed-in user lacking the role', async () => {
    const res = await call('/api/admin/users', { cookie: engineer });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden:role');
  });

  it('serves the admin with every demo user and their roles', async () => {
    const res = await call('/api/admin/users', { cookie: admin });
    expect(res.status).toBe(200);
    const byEmail = Object.fromEntries(res.body.items.map((u: { email: string; roles: string[] }) => [u.email, u.roles]));
    expect(byEmail['approver2@demo.example']).toContain('approver');
    expect(byEmail['integrator@demo.example']).toEqual(['integrator']);
  });

  it('refuses a wrong password and an unknown user with the same message', async () => {
    const wrong = await signIn('engineer@demo.example', 'not-the-password');
    const unknown = await signIn('nobody@demo.example', 'whatever-password');
    expect(wrong.cookie).toBeUndefined();
    expect(wrong.error).toBe('E-mail or password is not correct.');
    expect(unknown.error).toBe('E-mail or password is not correct.');
  });

  it('refuses empty and over-long credentials with a clear message', async () => {
    expect((await signIn('', '')).error).toBe('Enter your e-mail and password.');
    expect((await signIn(`${'a'.repeat(200)}@x.example`, 'x')).error).toBe('E-mail or password is too long.');
  });

  it('locks an account after repeated wrong passwords, even for the right password', async () => {
    const email = `lockout-${Date.now()}@demo.example`;
    await createUser({ actorId: null, email, name: 'Lockout Probe', password: 'right-password-123', roles: ['engineer'] });
    await closeSequelize();
    const answers: string[] = [];
    for (let i = 0; i < 5; i++) answers.push((await signIn(email, 'wrong-password-000')).error ?? '');
    expect(answers.slice(0, 4).every((a) => a === 'E-mail or password is not correct.')).toBe(true);
    expect(answers[4]).toMatch(/locked for 15 minutes/);
    const right = await signIn(email, 'right-password-123');
    expect(right.cookie).toBeUndefined();
    expect(right.error).toMatch(/locked; try again in 1[45] minutes/);
  });

  it('validates the user-creation body field by field', async () => {
    const res = await call('/api/admin/users', { cookie: admin, body: { email: 'not-an-email', name: '', password: 'short', roles: [] } });
    expect(res.status).toBe(422);
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['email', 'name', 'password', 'roles']);
  });

  it('answers health with database up and no pending migration', async () => {
    const res = await call('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up', migrations: 'current' });
  });
});
