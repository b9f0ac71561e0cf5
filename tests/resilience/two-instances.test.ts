import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { BASE, call, DEMO_PASSWORD, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken, revokeApiToken } from '@/lib/api/tokens';

const SECOND = 'http://127.0.0.1:3101';
const LIMIT = 40;

/** A second app instance from the same build, on its own port, against the same database. */
describe('two app instances behind one database keep every rule', () => {
  let server: ChildProcess;
  beforeAll(async () => {
    server = spawn('./node_modules/.bin/next', ['start', '-H', '127.0.0.1', '-p', '3101'], {
      env: { ...process.env, NEXTAUTH_URL: SECOND, RATE_LIMIT_PER_MINUTE: String(LIMIT) }, stdio: 'ignore',
    });
    for (let i = 0; i < 120; i++) {
      try { if ((await fetch(`${SECOND}/api/health`)).ok) return; } catch { /* not up yet */ }
      await new Promise((r) => setTimeout(r, 500));
    }
    throw new Error('the second instance did not start');
  });
  afterAll(async () => { server.kill(); await closeSequelize(); });

  const at = (base: string) => (path: string, init: Parameters<typeof call>[1] = {}) =>
    fetch(base + path, { method: init.method ?? (init.body ? 'POST' : 'GET'), headers: { ...(init.token ? { authorization: `Bearer ${init.token}` } : {}), ...(init.cookie ? { cookie: init.cookie, origin: base } : {}), ...(init.body ? { 'content-type': 'application/json' } : {}) }, body: init.body ? JSON.stringify(init.body) : undefined })
      .then(async (r) => ({ status: r.status, body: await r.json().catch(() => null) }));
  const one = at(BASE);
  const two = at(SECOND);

  it('lets exactly one of two simultaneous approvals land, one through each instance', async () => {
    const author = await freshUser(['author'], 'two-author');
    const slug = `two-instances-${Date.now()}`;
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
    const a1 = (await signIn('approver@demo.example')).cookie!;
    const a2 = (await signIn('approver2@demo.example')).cookie!; // a session signed by one instance works on both (one secret)
    const decision = { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'race', password: DEMO_PASSWORD };
    const [r1, r2] = await Promise.all([one(`/api/correlations/${slug}/versions/1/decision`, { cookie: a1, body: decision }), two(`/api/correlations/${slug}/versions/1/decision`, { cookie: a2, body: decision })]);
    expect([r1.status, r2.status].sort()).toEqual([200, 409]);
    const c = await db().Correlation.findOne({ where: { slug } });
    expect(await db().CorrelationVersion.count({ where: { correlationId: c!.id, status: 'approved' } })).toBe(1);
    expect(await db().SignOff.count({ where: { versionId: (await db().CorrelationVersion.findOne({ where: { correlationId: c!.id, version: 1 } }))!.id, decision: 'approved' } })).toBe(1);
  });

  it('shares the rate limit: evaluations through both instances count against one window', async () => {
    const who = await freshUser(['integrator'], 'two-rate');
    const { token } = await createApiToken({ actorId: null, userId: who.user.id, name: 'two instances', scopes: ['evaluate'], expiresAt: null });
    const body = { inputs: { Re_D: 1e4, Pr: 3 } };
    const path = '/api/correlations/pipe-turbulent-gnielinski/evaluate';
    // Avoid straddling a minute boundary: the windows are fixed minutes.
    if (Date.now() % 60_000 > 50_000) await new Promise((r) => setTimeout(r, 61_000 - (Date.now() % 60_000)));
    for (let i = 0; i < LIMIT - 5; i++) expect((await one(path, { token, body })).status).toBe(200);
    // Each instance adds its counts to the shared window every RATE_SYNC_MS (200 ms); after that the second one knows.
    await new Promise((r) => setTimeout(r, 600));
    const second = [];
    for (let i = 0; i < 10; i++) second.push((await two(path, { token, body })).status);
    // LIMIT a minute for the token, shared: 35 came through the first instance, so the 6th here is the 41st.
    expect(second.slice(0, 5)).toEqual([200, 200, 200, 200, 200]);
    expect(second.slice(5)).toEqual([429, 429, 429, 429, 429]);
  });

  it('makes a withdrawal and a token revocation take effect on the other instance within the stated bound (FRESHNESS_MS, 1 s)', async () => {
    const integrator = (await freshUser(['integrator'], 'two-revoke')).user.id;
    const { token, id } = await createApiToken({ actorId: null, userId: integrator, name: 'revoke me', scopes: ['read', 'evaluate'], expiresAt: null });
    const author = await freshUser(['author'], 'two-author2');
    const slug = `two-withdraw-${Date.now()}`;
    await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases() } });
    await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' });
    const approver = (await signIn('approver@demo.example')).cookie!;
    expect((await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } })).status).toBe(200);
    const body = { inputs: { Re_x: 1e4, Pr: 0.7 } };
    expect((await two(`/api/correlations/${slug}/evaluate`, { token, body })).status).toBe(200);
    expect((await one(`/api/correlations/${slug}/versions/1/withdraw`, { cookie: approver, body: { reason: 'withdrawn in the two-instance test', password: DEMO_PASSWORD } })).status).toBe(200);
    const withdrawnAt = Date.now();
    // Within the bound the other instance may still answer from its cache; after it, never. Asked every 100 ms so
    // the token stays well inside this instance's LIMIT requests a minute.
    const pause = () => new Promise((r) => setTimeout(r, 100));
    let after = await two(`/api/correlations/${slug}/evaluate`, { token, body });
    while (after.status === 200 && Date.now() - withdrawnAt < 1000) { await pause(); after = await two(`/api/correlations/${slug}/evaluate`, { token, body }); }
    expect(Date.now() - withdrawnAt).toBeLessThan(1500);
    expect(after.status).toBe(404);
    expect(after.body.error.code).toBe('not_found:approved-version');
    await new Promise((r) => setTimeout(r, 1000));
    expect((await two(`/api/correlations/${slug}/evaluate`, { token, body })).status).toBe(404);
    await revokeApiToken({ actorId: integrator, tokenId: id, isAdmin: true });
    const revokedAt = Date.now();
    let refused = await two('/api/correlations?pageSize=1', { token });
    while (refused.status === 200 && Date.now() - revokedAt < 1000) { await pause(); refused = await two('/api/correlations?pageSize=1', { token }); }
    expect(Date.now() - revokedAt).toBeLessThan(1500);
    expect(refused.body.error.code).toBe('unauthenticated:token-revoked');
  });
});
