// Load generator: autocannon, 50 connections, against a server started by scripts/bench-api.sh.
import autocannon from 'autocannon';
import { closeSequelize } from '@/lib/db/connection';
import { db } from '@/models';
import { createApiToken } from '@/lib/api/tokens';

const url = process.env.BENCH_URL ?? 'http://127.0.0.1:3200';
const DURATION = Number(process.env.BENCH_SECONDS ?? 10);

async function run(title: string, opts: Partial<autocannon.Options>) {
  const result = await autocannon({ url, connections: 50, duration: DURATION, ...opts } as autocannon.Options);
  const bad = result.non2xx + result.errors;
  return { title, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, bad };
}

async function main() {
  const { User } = db();
  const integrator = await User.findOne({ where: { email: 'integrator@demo.example' } });
  if (!integrator) throw new Error('the demo data is missing: run npm run db:seed');
  const { token } = await createApiToken({ actorId: null, userId: integrator.id, name: 'benchmark', scopes: ['read', 'evaluate'], expiresAt: new Date(Date.now() + 3_600_000) });
  const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
  const path = '/api/correlations/pipe-turbulent-gnielinski/evaluate';
  const rows = Array.from({ length: 1000 }, (_, i) => ({ Re_D: 4000 + i * 1000, Pr: 0.7 + (i % 10) }));

  const health = await run('GET /api/health', { url: `${url}/api/health` });
  const single = await run('POST evaluate (single)', { url: `${url}${path}`, method: 'POST', headers, body: JSON.stringify({ inputs: { Re_D: 5e4, Pr: 4 } }) });
  const batch = await run('POST evaluate (1,000 rows)', { url: `${url}${path}`, method: 'POST', headers, body: JSON.stringify({ rows }), connections: 10 });
  const plateRows = Array.from({ length: 1000 }, (_, i) => ({ T_inf: 290 + (i % 20), T_s: 330 + (i % 40), p: 101325, u_inf: 0.5 + (i % 50) * 0.5, L: 0.2 + (i % 10) * 0.2, W: 0.5 }));
  const template = await run('POST template run (1,000 rows)', { url: `${url}/api/templates/flat-plate-forced-convection-air/run`, method: 'POST', headers, body: JSON.stringify({ rows: plateRows }), connections: 10 });
  const library = await run('GET library page (50)', { url: `${url}/api/correlations?pageSize=50&sort=title`, headers });

  console.log(`${'case'.padEnd(32)} ${'req/s'.padStart(9)} ${'p50 ms'.padStart(8)} ${'p99 ms'.padStart(8)}  non-2xx`);
  for (const r of [health, single, batch, template, library]) console.log(`${r.title.padEnd(32)} ${r.rps.toFixed(0).padStart(9)} ${String(r.p50).padStart(8)} ${String(r.p99).padStart(8)}  ${r.bad}`);
  console.log(`single evaluate / health throughput: ${(single.rps / health.rps).toFixed(2)}; 1,000-row batch: ${(batch.rps * 1000).toFixed(0)} evaluations/s; template: ${(template.rps * 1000).toFixed(0)} rows/s`);
  console.log(JSON.stringify({ health, single, batch, template, library, single_over_health: Number((single.rps / health.rps).toFixed(3)) }));
}

main().catch((err) => { console.error(err); process.exitCode = 1; }).finally(() => closeSequelize());
