import { afterAll, describe, expect, it } from 'vitest';
import autocannon from 'autocannon';
import { BASE, signIn } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken } from '@/lib/api/tokens';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);

/** A bounded loopback load: reads, single and batch evaluations and a few writes at once, 50 connections. */
describe(`${SECONDS} s of mixed load at 50 connections`, () => {
  afterAll(() => closeSequelize());

  it('answers every request without a server error, and reports the latencies', async () => {
    const integrator = (await db().User.findOne({ where: { email: 'integrator@demo.example' } }))!.id;
    const { token } = await createApiToken({ actorId: null, userId: integrator, name: 'load', scopes: ['read', 'evaluate'], expiresAt: new Date(Date.now() + 3_600_000) });
    const auth = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
    const approver = (await signIn('approver@demo.example')).cookie!;
    const rows = Array.from({ length: 100 }, (_, i) => ({ Re_D: 4000 + i * 1000, Pr: 0.7 + (i % 10) }));
    const mix: [string, number, Partial<autocannon.Options>][] = [
      ['reads', 18, { url: `${BASE}/api/correlations?pageSize=20&q=plate`, headers: auth }],
      ['single evaluations', 18, { url: `${BASE}/api/correlations/pipe-turbulent-gnielinski/evaluate`, method: 'POST', headers: auth, body: JSON.stringify({ inputs: { Re_D: 5e4, Pr: 4 } }) }],
      ['100-row batches', 8, { url: `${BASE}/api/correlations/pipe-turbulent-gnielinski/evaluate`, method: 'POST', headers: auth, body: JSON.stringify({ rows }) }],
      ['template runs', 4, { url: `${BASE}/api/templates/flat-plate-forced-convection-air/run`, method: 'POST', headers: auth, body: JSON.stringify({ inputs: { T_inf: 300, T_s: 340, p: 101325, u_inf: 5, L: 0.5, W: 0.3 } }) }],
      ['writes (comments)', 2, { url: `${BASE}/api/correlations/brightwater-louvre-pressure-loss/versions/2/comments`, method: 'POST', headers: { cookie: approver, origin: BASE, 'content-type': 'application/json' }, body: JSON.stringify({ body: 'load-test comment' }), overallRate: 10 }],
    ];
    const results = await Promise.all(mix.map(([, connections, opts]) => autocannon({ connections, duration: SECONDS, ...opts } as autocannon.Options)));
    let serverErrors = 0;
    results.forEach((r, k) => {
      serverErrors += r['5xx'] + r.errors + r.timeouts;
      console.log(`load: ${mix[k][0].padEnd(20)} ${String(r.requests.total).padStart(7)} requests, ${r.requests.average.toFixed(0).padStart(5)}/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, 2xx ${r['2xx']}, 4xx ${r['4xx']}, 5xx ${r['5xx']}, errors ${r.errors}`);
    });
    expect(serverErrors).toBe(0);
    for (const r of results) expect(r['2xx']).toBeGreaterThan(0);
    expect(results.reduce((n, r) => n + r['4xx'], 0)).toBe(0);
  });
});
