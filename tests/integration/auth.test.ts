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

  it('slows down repeated wrong passwords from one client without locking the account for others, and says the same for unknown accounts', async () => {
    const email = `throttle-${Date.now()}@demo.example`;
    await createUser({ actorId: null, email, name: 'Throttle Probe', password: 'right-password-123', roles: ['engineer'] });
    await closeSequelize();
    const attacker = { 'x-forwarded-for': '198.51.100.7' }; // documentation address range (RFC 5737)
    const answers: string[] = [];
    for (let i = 0; i < 6; i++) answers.push((await signIn(email, 'wrong-password-000', attacker)).error ?? '');
    expect(answers.slice(0, 5).every((a) => a === 'E-mail or password is not correct.')).toBe(true);
    expect(answers[5]).toMatch(/Too many wrong passwords for this sign-in\. Wait \d+ seconds?/);
    // From the attacker's address even the right password waits; the owner elsewhere signs in.
    expect((await signIn(email, 'right-password-123', attacker)).error).toMatch(/Wait/);
    expect((await signIn(email, 'right-password-123', { 'x-forwarded-for': '203.0.113.20' })).cookie).toMatch(/session-token/);
    // An account that does not exist gets the very same answers.
    const ghost = `nobody-${Date.now()}@demo.example`;
    const ghostAnswers: string[] = [];
    for (let i = 0; i < 6; i++) ghostAnswers.push((await signIn(ghost, 'wrong-password-000', attacker)).error ?? '');
    expect(ghostAnswers.slice(0, 5)).toEqual(answers.slice(0, 5));
    expect(ghostAnswers[5].replace(/\d+/g, 'N')).toBe(answers[5].replace(/\d+/g, 'N'));
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
