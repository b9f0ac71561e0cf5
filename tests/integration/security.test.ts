import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { BASE, call, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition } from '../support/fixtures';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken, type TokenScope } from '@/lib/api/tokens';

const userId = async (email: string) => (await db().User.findOne({ where: { email } }))!.id;
const token = async (email: string, scopes: TokenScope[]) => (await createApiToken({ actorId: null, userId: await userId(email), name: `security ${scopes.join('+')}`, scopes, expiresAt: null })).token;

/** Holes found by an outside review (issue "Hardening"), each reproduced here and now closed. */
describe('security: tokens, ownership, cross-site requests, bounded answers, headers', () => {
  let admin: string;
  let author: Awaited<ReturnType<typeof freshUser>>;
  let author2: Awaited<ReturnType<typeof freshUser>>;
  beforeAll(async () => {
    admin = (await signIn('admin@demo.example')).cookie!;
    author = await freshUser(['author'], 'sec-author');
    author2 = await freshUser(['author'], 'sec-author2');
  });
  afterAll(() => closeSequelize());

  it('1: a token cannot do what only a person may: user admin, audit, mail, tokens, sign-off (deny by default)', async () => {
    const evalOnly = await token('admin@demo.example', ['evaluate']);
    const all = await token('admin@demo.example', ['read', 'evaluate', 'write']);
    for (const t of [evalOnly, all]) {
      const created = await call('/api/admin/users', { token: t, body: { email: `x-${Date.now()}@test.example`, name: 'Should not exist', password: 'long-enough-password-1', roles: ['approver'] } });
      expect(created.body.error.code).toBe('forbidden:person-only');
      for (const path of ['/api/admin/audit', '/api/admin/mail', '/api/admin/users', '/api/tokens']) expect((await call(path, { token: t })).body.error.code, path).toBe('forbidden:person-only');
      expect((await call('/api/correlations/friction-factor-blasius/versions/1/withdraw', { token: t, body: { reason: 'a token must never withdraw' } })).body.error.code).toBe('forbidden:person-only');
    }
    const approverAll = await token('approver@demo.example', ['read', 'evaluate', 'write']);
    expect((await call('/api/correlations/friction-factor-blasius/versions/1/decision', { token: approverAll, body: { decision: 'return', comment: 'x' } })).body.error.code).toBe('forbidden:person-only');
    expect((await call('/api/correlations/friction-factor-blasius/versions/1/comments', { token: approverAll, body: { body: 'x' } })).body.error.code).toBe('forbidden:person-only');
  });

  it('2: authoring needs the write scope; read and evaluate tokens cannot create, copy or edit', async () => {
    const readEval = await token(author.user.email, ['read', 'evaluate']);
    const slug = `sec-${Date.now()}`;
    expect((await call('/api/correlations', { token: readEval, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).body.error.code).toBe('forbidden:token-scope');
    const write = await token(author.user.email, ['write']);
    expect((await call('/api/correlations', { token: write, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1`, { token: readEval, method: 'PATCH', body: { checkCases: [] } })).body.error.code).toBe('forbidden:token-scope');
  });

  it('4: a body with many unknown keys gets a short, bounded error answer', async () => {
    const t = await token('integrator@demo.example', ['evaluate']);
    const inputs: Record<string, number> = { Re_D: 1e4, Pr: 0.7 };
    for (let i = 0; i < 200_000; i++) inputs[`k${i}`] = i;
    const res = await call('/api/correlations/pipe-turbulent-gnielinski/evaluate', { token: t, body: { inputs } });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body).length).toBeLessThan(5_000);
    expect(JSON.stringify(res.body)).toMatch(/199995 more unknown inputs/);
  });

  it('5: another author cannot copy or rename someone else\'s unpublished correlation', async () => {
    const slug = `sec-owned-${Date.now()}`;
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).status).toBe(200);
    const copy = await call(`/api/correlations/${slug}/versions`, { cookie: author2.cookie, body: {} });
    expect(copy.status).toBe(404);
    const pinned = await call(`/api/correlations/${slug}/versions`, { cookie: author2.cookie, body: { fromVersion: 1 } });
    expect(pinned.body.error.code).toBe('forbidden:unpublished-version');
    expect(await db().CorrelationVersion.count({ where: { correlationId: (await db().Correlation.findOne({ where: { slug } }))!.id } })).toBe(1);
  });

  it('6: a signed-in change from another site, or not as JSON, is refused', async () => {
    const body = { name: 'cross-site', scopes: ['read'] };
    const foreign = await call('/api/tokens', { cookie: author.cookie, body, headers: { origin: 'https://attacker.example' } });
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe('forbidden:cross-origin');
    const plain = await fetch(`${BASE}/api/tokens`, { method: 'POST', headers: { cookie: author.cookie, origin: BASE, 'content-type': 'text/plain' }, body: JSON.stringify(body) });
    expect(plain.status).toBe(400);
    expect((await call('/api/tokens', { cookie: author.cookie, body })).status).toBe(200);
  });

  it('9: a draft that does not compile and a token for a missing user answer 422, not 500', async () => {
    const slug = `sec-broken-${Date.now()}`;
    const def = plateDefinition();
    def.outputs[0].expression = '0.332 * Re_x^(1/2) * Pr^(1/3) * missing_symbol';
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: def, checkCases: [] } })).status).toBe(200);
    const res = await call(`/api/correlations/${slug}/evaluate`, { cookie: author.cookie, body: { version: 1, inputs: { Re_x: 1e4, Pr: 0.7 } } });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid:definition');
    const missing = await call('/api/tokens', { cookie: admin, body: { name: 'for nobody', scopes: ['read'], userId: 99_999_999 } });
    expect(missing.status).toBe(422);
    expect(missing.body.error.details.issues[0].path).toBe('userId');
  });

  it('10: security headers on pages and API answers; user data is never cached', async () => {
    const page = await fetch(`${BASE}/sign-in`);
    expect(page.headers.get('content-security-policy')).toMatch(/frame-ancestors 'none'/);
    expect(page.headers.get('content-security-policy')).toMatch(/default-src 'self'/);
    expect(page.headers.get('x-content-type-options')).toBe('nosniff');
    expect(page.headers.get('referrer-policy')).toBe('same-origin');
    const tokens = await call('/api/tokens', { cookie: author.cookie });
    expect(tokens.headers.get('cache-control')).toBe('no-store');
    expect((await call('/api/admin/users', { cookie: admin })).headers.get('cache-control')).toBe('no-store');
  });

  it('7: wrong passwords at sign-off and at password change are throttled too', async () => {
    const approver = await freshUser(['approver'], 'sec-signoff');
    const decide = () => call('/api/correlations/friction-factor-blasius/versions/1/decision', { cookie: approver.cookie, body: { decision: 'approve', comment: '', password: 'not-my-password' } });
    for (let i = 0; i < 5; i++) expect((await decide()).body.error.code).toBe('invalid:password');
    const slowed = await decide();
    expect(slowed.status).toBe(429);
    expect(slowed.body.error.message).toMatch(/Too many wrong passwords for sign-off/);
    expect(Number(slowed.headers.get('retry-after'))).toBeGreaterThan(0);
    const change = () => call('/api/account/password', { cookie: approver.cookie, body: { currentPassword: 'wrong-current-1', newPassword: 'a-new-long-password-2' } });
    for (let i = 0; i < 5; i++) expect((await change()).body.error.code).toBe('invalid:password');
    expect((await change()).status).toBe(429);
  });

  it('8: password change, sign-out everywhere and deactivation end sessions; reactivation revives no token', async () => {
    const who = await freshUser(['engineer'], 'sec-sessions');
    const second = (await signIn(who.user.email, who.password)).cookie!;
    expect((await call('/api/tokens', { cookie: second })).status).toBe(200);
    expect((await call('/api/account/password', { cookie: who.cookie, body: { currentPassword: who.password, newPassword: 'a-brand-new-password-9' } })).status).toBe(200);
    expect((await call('/api/tokens', { cookie: who.cookie })).status).toBe(401);
    expect((await call('/api/tokens', { cookie: second })).status).toBe(401);
    const third = (await signIn(who.user.email, 'a-brand-new-password-9')).cookie!;
    expect((await call('/api/account/sessions', { cookie: third, method: 'DELETE' })).status).toBe(200);
    expect((await call('/api/tokens', { cookie: third })).status).toBe(401);
    const fourth = (await signIn(who.user.email, 'a-brand-new-password-9')).cookie!;
    const t = await token(who.user.email, ['read']);
    expect((await call('/api/correlations?pageSize=1', { token: t })).status).toBe(200);
    expect((await call(`/api/admin/users/${who.user.id}`, { cookie: admin, method: 'PATCH', body: { isActive: false } })).status).toBe(200);
    expect((await call('/api/tokens', { cookie: fourth })).status).toBe(401);
    expect((await call('/api/correlations?pageSize=1', { token: t })).status).toBe(401);
    expect((await call(`/api/admin/users/${who.user.id}`, { cookie: admin, method: 'PATCH', body: { isActive: true } })).status).toBe(200);
    expect((await call('/api/correlations?pageSize=1', { token: t })).body.error.code).toBe('unauthenticated:token-revoked');
    expect((await call('/api/tokens', { cookie: fourth })).status).toBe(401);
  });

  it('11: the documented commands work from a fresh shell with nothing but PATH and HOME set', () => {
    // Which installation: the test database and its document store, as DB_NAME alone would name the database.
    const env = { PATH: process.env.PATH!, HOME: process.env.HOME ?? '/root', DB_NAME: process.env.DB_NAME!, S3_ENDPOINT: process.env.S3_ENDPOINT!, S3_BUCKET: process.env.S3_BUCKET! } as unknown as NodeJS.ProcessEnv;
    expect(execFileSync('npm', ['run', '-s', 'audit:verify'], { env, encoding: 'utf8' })).toMatch(/Audit chain intact: \d+ events/);
    const out = execFileSync('npm', ['run', '-s', 'token', '--', 'create', '--email', 'integrator@demo.example', '--name', 'fresh shell', '--scopes', 'read'], { env, encoding: 'utf8' });
    expect(out.trim().split('\n').at(-1)).toMatch(/^crl_/);
  });
});
