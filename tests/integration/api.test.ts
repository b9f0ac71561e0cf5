import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { QueryTypes } from 'sequelize';
import { validate, compileErrors } from '@readme/openapi-parser';
import { BASE, call, signIn } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken, revokeApiToken } from '@/lib/api/tokens';
import { compiled, type Definition } from '@/lib/engine';
import { cylinderSweep } from '../integrator-example';
import { evaluatePinned } from '@/clients/typescript/evaluate';

const CB = 'cylinder-crossflow-churchill-bernstein';
const userId = async (email: string) => (await db().User.findOne({ where: { email } }))!.id;

describe('integrator API', () => {
  let evalToken: string;
  let readOnly: string;
  let revoked: string;
  let expired: string;
  let engineerCookie: string;

  beforeAll(async () => {
    const integrator = await userId('integrator@demo.example');
    evalToken = (await createApiToken({ actorId: null, userId: integrator, name: 'api test', scopes: ['read', 'evaluate'], expiresAt: null })).token;
    readOnly = (await createApiToken({ actorId: null, userId: integrator, name: 'read only', scopes: ['read'], expiresAt: null })).token;
    const r = await createApiToken({ actorId: null, userId: integrator, name: 'to revoke', scopes: ['read', 'evaluate'], expiresAt: null });
    await revokeApiToken({ actorId: integrator, tokenId: r.id, isAdmin: false });
    revoked = r.token;
    expired = (await createApiToken({ actorId: null, userId: integrator, name: 'expired', scopes: ['read', 'evaluate'], expiresAt: new Date(Date.now() - 1000) })).token;
    engineerCookie = (await signIn('engineer@demo.example')).cookie!;
  });
  afterAll(() => closeSequelize());

  const body = { inputs: { Re_D: 1e4, Pr: 0.71 } };

  it('answers every path with 401 for no, revoked, expired or malformed tokens', async () => {
    for (const [path, method] of [['/api/correlations', 'GET'], [`/api/correlations/${CB}`, 'GET'], [`/api/correlations/${CB}/versions/1`, 'GET'], [`/api/correlations/${CB}/evaluate`, 'POST']]) {
      const b = method === 'POST' ? body : undefined;
      expect((await call(path, { method, body: b })).body.error.code, path).toBe('unauthenticated:required');
      expect((await call(path, { method, body: b, token: revoked })).body.error.code, path).toBe('unauthenticated:token-revoked');
      expect((await call(path, { method, body: b, token: expired })).body.error.code, path).toBe('unauthenticated:token-expired');
      expect((await call(path, { method, body: b, token: 'crl_not-a-real-token' })).status, path).toBe(401);
      expect((await call(path, { method, body: b, headers: { authorization: 'Basic abc' } })).body.error.code, path).toBe('unauthenticated:header');
    }
  });

  it('shows the evidence of every approved standard-library version: grade, counts by kind, stated accuracy, and the waiver where it is below the policy', async () => {
    const { readLibrary } = await import('@/lib/governance/library');
    const { CorrelationVersion, Correlation, SignOff } = db();
    for (const { slug, definition } of readLibrary()) {
      const c = await Correlation.findOne({ where: { slug } });
      const v = await CorrelationVersion.findOne({ where: { correlationId: c!.id, status: 'approved' }, order: [['version', 'DESC']] });
      const res = await call(`/api/correlations/${slug}/versions/${v!.version}`, { token: readOnly });
      expect(res.status, slug).toBe(200);
      const e = res.body.evidence;
      expect(['well-founded', 'adequate', 'thin'], slug).toContain(e.grade);
      expect(e.independent, slug).toBe(Object.entries(e.byKind).filter(([k]) => k !== 'transcription').reduce((n, [, x]) => n + (x as number), 0));
      // The stated accuracy travels from the definition to the API unchanged (version 1 of each file).
      if (v!.version === 1) expect(e.accuracy, slug).toEqual((definition as { accuracy?: unknown }).accuracy ?? null);
      if (!e.meetsPolicy) {
        const signOff = await SignOff.findOne({ where: { versionId: v!.id, decision: 'approved' } });
        expect(signOff?.waiver, `${slug}: below the policy, approved with a waiver`).toMatch(/independent in-range/);
      }
    }
    const gn = (await call('/api/correlations/pipe-turbulent-gnielinski/versions/1', { token: readOnly })).body.evidence;
    expect(gn.accuracy.rel).toBe(0.1);
    expect(gn.meetsPolicy).toBe(true);
    expect(gn.byKind['independent-solution']).toBeGreaterThanOrEqual(3);
  });

  it('needs the evaluate scope to evaluate, and read to list', async () => {
    const res = await call(`/api/correlations/${CB}/evaluate`, { token: readOnly, body });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden:token-scope');
    expect((await call('/api/correlations?pageSize=5', { token: readOnly })).status).toBe(200);
  });

  it('serves each role: all may read and evaluate approved versions; authoring and sign-off need their roles', async () => {
    for (const who of ['admin', 'author', 'approver', 'engineer', 'integrator']) {
      const cookie = (await signIn(`${who}@demo.example`)).cookie!;
      expect((await call(`/api/correlations/${CB}/evaluate`, { cookie, body })).status, who).toBe(200);
      expect((await call('/api/review-queue', { cookie })).status, who).toBe(who === 'approver' ? 200 : 403);
      expect((await call('/api/my-work', { cookie })).status, who).toBe(who === 'author' ? 200 : 403);
      expect((await call('/api/admin/audit', { cookie })).status, who).toBe(who === 'admin' ? 200 : 403);
    }
  });

  it('evaluates with the same numbers as the engine, naming version and content hash', async () => {
    const res = await call(`/api/correlations/${CB}/evaluate`, { token: evalToken, body });
    expect(res.status).toBe(200);
    const version = await call(`/api/correlations/${CB}/versions/${res.body.version}`, { token: evalToken });
    expect(res.body.contentHash).toBe(version.body.contentHash);
    const engine = compiled(version.body.definition as Definition).evaluate(body.inputs);
    expect(res.body.outputs.Nu_D).toBe(engine.outputs.Nu_D);
    expect(res.body.warnings).toEqual([]);
  });

  it('converts { value, unit } inputs and warns out of range', async () => {
    const res = await call('/api/correlations/air-viscosity-sutherland/evaluate', { token: evalToken, body: { inputs: { T: { value: 15, unit: 'degC' } } } });
    expect(res.body.outputs.mu).toBeCloseTo(1.7894e-5, 8); // U.S. Standard Atmosphere 1976, sea level
    const cold = await call('/api/correlations/air-viscosity-sutherland/evaluate', { token: evalToken, body: { inputs: { T: 100 } } });
    expect(cold.body.warnings[0]).toMatchObject({ symbol: 'T', value: 100, min: 170, max: 1900 });
  });

  it('answers outputs in the units asked for, and refuses an unknown output or a unit of another dimension by field', async () => {
    const path = '/api/correlations/ideal-gas-density/evaluate';
    const inputs = { p: 101325, T: 288.15, M: 0.0289644 };
    const si = await call(path, { token: evalToken, body: { inputs } });
    expect(si.body.units).toEqual({ rho: 'kg/m^3' });
    // 1 lb/ft^3 = 0.45359237 kg / 0.3048^3 m^3 exactly (the international pound and foot, NIST SP 811 appendix B).
    const lb = await call(path, { token: evalToken, body: { inputs, outputUnits: { rho: 'lb/ft^3' } } });
    expect(lb.body.units).toEqual({ rho: 'lb/ft^3' });
    expect(lb.body.outputs.rho).toBeCloseTo(si.body.outputs.rho / (0.45359237 / 0.3048 ** 3), 12);
    const rows = await call(path, { token: evalToken, body: { rows: [inputs, { ...inputs, T: 576.3 }], outputUnits: { rho: 'g/cm^3' } } });
    expect(rows.body.results[0].outputs.rho).toBeCloseTo(si.body.outputs.rho / 1000, 14);
    const unknown = await call(path, { token: evalToken, body: { inputs, outputUnits: { h: 'W/(m^2 K)' } } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.details.issues[0].path).toBe('outputUnits.h');
    const wrong = await call(path, { token: evalToken, body: { inputs, outputUnits: { rho: 'Pa' } } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.details.issues[0]).toMatchObject({ path: 'outputUnits.rho' });
    expect(wrong.body.error.details.issues[0].message).toMatch(/different dimensions/);
  });

  it('evaluates batches in order, and refuses more than 10,000 rows with 413', async () => {
    const rows = [1, 10, 100, 1e3, 1e4, 1e5].map((re) => ({ Re_D: re, Pr: 0.71 }));
    const res = await call(`/api/correlations/${CB}/evaluate`, { token: evalToken, body: { rows } });
    expect(res.body.results).toHaveLength(6);
    const single = await call(`/api/correlations/${CB}/evaluate`, { token: evalToken, body: { inputs: rows[3] } });
    expect(res.body.results[3].outputs.Nu_D).toBe(single.body.outputs.Nu_D);
    const big = await call(`/api/correlations/${CB}/evaluate`, { token: evalToken, body: { rows: Array.from({ length: 10_001 }, () => rows[0]) } });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too_large:rows');
    expect(big.body.error.message).toContain('10000');
  });

  it('answers bad bodies with exact statuses and codes, naming field and row', async () => {
    const ev = `/api/correlations/${CB}/evaluate`;
    expect((await call(ev, { token: evalToken, rawBody: '{"inputs": ' })).body.error.code).toBe('bad_request:json');
    expect((await call(ev, { token: evalToken, rawBody: '' })).body.error.code).toBe('bad_request:body');
    const wrongType = await call(ev, { token: evalToken, body: { inputs: { Re_D: 'many', Pr: 0.7 } } });
    expect(wrongType.status).toBe(422);
    expect(wrongType.body.error.details.issues[0].path).toBe('inputs.Re_D');
    const row = await call(ev, { token: evalToken, body: { rows: [{ Re_D: 1e3, Pr: 0.7 }, { Re_D: 1e3 }, { Re_D: 1e3, Pr: 0.7, Gr: 2 }] } });
    expect(row.status).toBe(422);
    expect(row.body.error.details.issues.map((i: { path: string }) => i.path)).toEqual(['rows[1].Pr', 'rows[2].Gr']);
    expect((await call(ev, { token: evalToken, body: { inputs: { Re_D: { value: 1, unit: 'm' }, Pr: 0.7 } } })).body.error.details.issues[0].path).toBe('inputs.Re_D.unit');
    expect((await call(ev, { token: evalToken, body: { inputs: {}, rows: [] } })).body.error.code).toBe('invalid:body');
    expect((await call(ev, { token: evalToken, body: { version: 'latest', inputs: {} } })).body.error.details.issues[0].path).toBe('version');
    expect((await call('/api/correlations/no-such-correlation/evaluate', { token: evalToken, body })).body.error.code).toBe('not_found:correlation');
    expect((await call(`/api/correlations/${CB}/evaluate`, { token: evalToken, body: { version: 99, ...body } })).body.error.code).toBe('not_found:version');
    expect((await call('/api/correlations/Not_A_Slug', { token: evalToken })).status).toBe(422);
    expect((await call('/api/correlations?pageSize=500', { token: evalToken })).body.error.details.issues[0].path).toBe('pageSize');
  });

  it('lists with filters and paging as the contract says', async () => {
    const res = await call('/api/correlations?category=friction&pageSize=3&page=1&sort=slug', { token: evalToken });
    expect(res.body).toMatchObject({ page: 1, pageSize: 3 });
    expect(res.body.total).toBeGreaterThanOrEqual(7);
    expect(res.body.items).toHaveLength(3);
    expect(res.body.items.every((i: { category: string }) => i.category === 'friction')).toBe(true);
    expect(res.body.items[0]).toEqual(expect.objectContaining({ slug: expect.any(String), title: expect.any(String), latestApprovedVersion: 1 }));
    const q = await call('/api/correlations?q=colebrook', { token: evalToken });
    expect(q.body.items.map((i: { slug: string }) => i.slug)).toContain('friction-factor-colebrook');
  });

  it('gives frozen versions an ETag and answers If-None-Match with 304', async () => {
    const first = await call(`/api/correlations/${CB}/versions/1`, { token: evalToken });
    const etag = first.headers.get('etag');
    expect(etag).toContain(first.body.contentHash);
    const again = await call(`/api/correlations/${CB}/versions/1`, { token: evalToken, headers: { 'if-none-match': etag! } });
    expect(again.status).toBe(304);
  });

  it('records usage per day, user, token and version', async () => {
    // A token of its own, so counts still being gathered from earlier tests cannot mix in.
    const t = await createApiToken({ actorId: null, userId: await userId('integrator@demo.example'), name: 'usage', scopes: ['evaluate', 'read'], expiresAt: null });
    const { sequelize } = db();
    const count = async () => Number((await sequelize.query<{ n: number }>('SELECT COALESCE(SUM(evaluations), 0) AS n FROM usage_records WHERE token_id = ?',
      { replacements: [t.id], type: QueryTypes.SELECT }))[0].n);
    await call(`/api/correlations/${CB}/evaluate`, { token: t.token, body: { rows: [body.inputs, body.inputs, body.inputs] } });
    await call(`/api/correlations/${CB}/evaluate`, { token: t.token, body });
    // The server gathers counts in memory and writes them within about a second.
    let n = 0;
    for (let i = 0; i < 30 && n < 4; i++) { await new Promise((r) => setTimeout(r, 200)); n = await count(); }
    expect(n).toBe(4);
  });

  it('limits the rate per token with 429 and Retry-After, from state shared in the database', async () => {
    const t = await createApiToken({ actorId: null, userId: await userId('integrator@demo.example'), name: 'rate', scopes: ['evaluate'], expiresAt: null });
    const { sequelize } = db();
    const windowStart = Math.floor(Date.now() / 60_000) * 60_000;
    // Another app instance has used up this minute's allowance: its counter is in the shared table.
    await sequelize.query('INSERT INTO rate_limit_windows (bucket, window_start, hits) VALUES (?, ?, ?)', {
      replacements: [`token:${t.id}`, windowStart, Number(process.env.RATE_LIMIT_PER_MINUTE ?? 100000)], type: QueryTypes.INSERT,
    });
    // This instance learns the shared count at its next sync (RATE_SYNC_MS, 200 ms): within that bound it refuses.
    let res = await call(`/api/correlations/${CB}/evaluate`, { token: t.token, body });
    let admitted = 0;
    for (let i = 0; i < 40 && res.status === 200; i++) {
      admitted++;
      await new Promise((r) => setTimeout(r, 50));
      res = await call(`/api/correlations/${CB}/evaluate`, { token: t.token, body });
    }
    if (Math.floor(Date.now() / 60_000) * 60_000 === windowStart) {
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited:requests');
      expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
      // The overshoot is what this instance admits before its first sync: a handful of requests at most.
      expect(admitted).toBeLessThanOrEqual(10);
    } else {
      expect(res.status).toBe(200); // the minute turned over between the insert and the call
    }
  });

  it('serves a valid OpenAPI 3.1 document covering the contract paths', async () => {
    const res = await call('/api/openapi.json');
    expect(res.body.openapi).toBe('3.1.0');
    const result = await validate(res.body);
    expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true);
    for (const p of ['/api/correlations', '/api/correlations/{slug}', '/api/correlations/{slug}/versions/{n}', '/api/correlations/{slug}/evaluate']) expect(res.body.paths[p], p).toBeDefined();
    expect(res.body.paths['/api/correlations'].get.parameters.find((p: { name: string }) => p.name === 'pageSize').schema.maximum).toBe(200);
  });

  it('works for an integrator script with a token made by the command line', () => {
    const out = execFileSync('node', ['--import', 'tsx', 'scripts/token.ts', 'create', '--email', 'integrator@demo.example', '--name', 'example script', '--days', '30'], { env: process.env, encoding: 'utf8' });
    const token = out.trim().split('\n').pop()!;
    expect(token).toMatch(/^crl_[A-Za-z0-9_-]{32}$/);
    return cylinderSweep(BASE, token, 0.71, [100, 1e4, 0.1]).then((r) => {
      expect(r.contentHash).toMatch(/^[0-9a-f]{64}$/);
      expect(r.rows[1].Nu_D).toBeGreaterThan(r.rows[0].Nu_D);
      expect(r.rows[2].warnings[0]).toMatch(/Pe_D = 0\.071 is below the minimum 0\.2/);
    });
  });

  it('works through the typed openapi-fetch client generated from the description (clients/typescript/evaluate.ts)', async () => {
    const r = await evaluatePinned(BASE, evalToken, 'pipe-turbulent-gnielinski', 1, { Re_D: 3e4, Pr: 4.3 });
    expect(r.version).toBe(1);
    expect(r.contentHash).toMatch(/^[0-9a-f]{64}$/);
    // Gnielinski at Re_D = 3×10⁴, Pr = 4.3 recomputed here from the published form with the Petukhov friction factor.
    const f = (0.79 * Math.log(3e4) - 1.64) ** -2;
    expect(r.outputs.Nu_D).toBeCloseTo(((f / 8) * (3e4 - 1000) * 4.3) / (1 + 12.7 * Math.sqrt(f / 8) * (4.3 ** (2 / 3) - 1)), 6);
    await expect(evaluatePinned(BASE, evalToken, 'pipe-turbulent-gnielinski', 1, { Re_D: Number.NaN, Pr: 4.3 })).rejects.toThrow(/invalid/);
  });

  it('keeps sessions working on the API', async () => {
    expect((await call(`/api/correlations/${CB}/evaluate`, { cookie: engineerCookie, body })).status).toBe(200);
  });
  it('searches by every word, in titles and in the approved definitions, and explains a result the formula cannot give', async () => {
    const phrase = await call(`/api/correlations?q=${encodeURIComponent('laminar flat plate average')}`, { token: evalToken });
    expect(phrase.body.items.map((i: { slug: string }) => i.slug)).toContain('flat-plate-laminar-average');
    const word = await call('/api/correlations?q=reynolds&pageSize=200', { token: evalToken });
    expect(word.body.total).toBeGreaterThan(20);
    const negative = await call('/api/correlations/pipe-turbulent-gnielinski/evaluate', { token: evalToken, body: { inputs: { Re_D: -5, Pr: 3 } } });
    expect(negative.status).toBe(422);
    expect(negative.body.error.message).toMatch(/^Re_D = -5 is below the minimum 3000 of the published validity range/);
  });
  it('marks a pinned superseded version as deprecated, pointing at its successor; the approved one is not', async () => {
    const old = await call('/api/correlations/air-properties-1atm/evaluate', { token: evalToken, body: { version: 1, inputs: { T: 300 } } });
    expect(old.status).toBe(200);
    expect(old.headers.get('deprecation')).toMatch(/^@\d{9,}$/);
    expect(old.headers.get('link')).toBe('</api/correlations/air-properties-1atm/versions/2>; rel="successor-version"');
    expect(old.body.warnings[0]).toMatchObject({ symbol: 'version', message: expect.stringMatching(/superseded/) });
    const now = await call('/api/correlations/air-properties-1atm/evaluate', { token: evalToken, body: { inputs: { T: 300 } } });
    expect(now.body.version).toBe(2);
    expect(now.headers.get('deprecation')).toBeNull();
    // Lemmon et al. (2000) / Lemmon & Jacobsen (2004) through python3-iapws at 300 K, 101.325 kPa: ρ 1.1770 kg/m³, μ 1.8537e-5 Pa s (STACK.md).
    expect(now.body.outputs.rho).toBeCloseTo(1.1770, 3);
    expect(Math.abs(now.body.outputs.mu / 1.8537e-5 - 1)).toBeLessThan(1e-3);
  });
});
