// Load generator for npm run bench:api (autocannon), against the server scripts/bench-api.sh starts on the benchmark
// database. Loaded cases use 50 connections (10 for 1,000-row bodies); "unloaded" cases use one connection, so their
// latency is the server's time plus a loopback hop. The last line of --json output is one JSON object with every case
// as { rps, p50, p99, bad } and the ratios the goals are stated in.
import autocannon from 'autocannon';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/lib/db/connection';
import { db } from '@/models';
import { createApiToken } from '@/lib/api/tokens';
import { signIn } from '../tests/support/http';

const url = process.env.BENCH_URL ?? 'http://127.0.0.1:3200';
const DURATION = Math.max(1, Number(process.env.BENCH_SECONDS ?? 10));

interface Case { title: string; connections: number; rps: number; p50: number; p99: number; bad: number; server_p50?: number; server_p99?: number }

const quantile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] : NaN);

/**
 * One case: a warm-up (route loaded, code compiled, caches filled, connections open — a server's first seconds are
 * not what the case measures), then DURATION seconds of load. With `serverTiming`, the handler's own time from each
 * answer's Server-Timing header is collected too (server_p50, server_p99 in ms): the request's latency less the HTTP
 * framework and the loopback hop.
 */
async function run(title: string, opts: Partial<autocannon.Options> & { connections?: number; serverTiming?: boolean }): Promise<Case> {
  const { serverTiming, ...rest } = opts;
  const connections = rest.connections ?? 50;
  await autocannon({ url, ...rest, connections, amount: Math.max(200, connections * 10) } as autocannon.Options);
  const timings: number[] = [];
  const requests = serverTiming ? [{
    onResponse: (_status: number, _body: string, _context: unknown, headers: Record<string, string>) => {
      const dur = /dur=([\d.]+)/.exec(headers['server-timing'] ?? '')?.[1];
      if (dur) timings.push(Number(dur));
    },
  }] : undefined;
  const result = await autocannon({ url, duration: DURATION, ...rest, connections, ...(requests ? { requests } : {}) } as autocannon.Options);
  const bad = result.non2xx + result.errors + result.timeouts;
  timings.sort((a, b) => a - b);
  return {
    title, connections, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, bad,
    ...(serverTiming ? { server_p50: Number(quantile(timings, 0.5).toFixed(2)), server_p99: Number(quantile(timings, 0.99).toFixed(2)) } : {}),
  };
}

async function main() {
  const { User, sequelize } = db();
  const integrator = await User.findOne({ where: { email: 'integrator@demo.example' } });
  if (!integrator) throw new Error('the demo data is missing from the benchmark database');
  const { token } = await createApiToken({ actorId: null, userId: integrator.id, name: 'benchmark', scopes: ['read', 'evaluate'], expiresAt: new Date(Date.now() + 3_600_000) });
  const [{ n: librarySize }] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM correlations WHERE kind = 'correlation'", { type: QueryTypes.SELECT });
  const session = await signIn('engineer@demo.example');
  if (!session.cookie) throw new Error(`could not sign in for the library cases: ${session.error}`);

  const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
  const cookie = { cookie: session.cookie };
  const path = '/api/correlations/pipe-turbulent-gnielinski/evaluate';
  const single = { method: 'POST' as const, headers, body: JSON.stringify({ inputs: { Re_D: 5e4, Pr: 4 } }) };
  const rows = Array.from({ length: 1000 }, (_, i) => ({ Re_D: 4000 + i * 1000, Pr: 0.7 + (i % 10) }));
  const plateRows = Array.from({ length: 1000 }, (_, i) => ({ T_inf: 290 + (i % 20), T_s: 330 + (i % 40), p: 101325, u_inf: 0.5 + (i % 50) * 0.5, L: 0.2 + (i % 10) * 0.2, W: 0.5 }));
  const template = { url: `${url}/api/templates/flat-plate-forced-convection-air/run`, method: 'POST' as const, headers, body: JSON.stringify({ rows: plateRows }) };

  const cases: Record<string, Case> = {};
  // BENCH_CASES=single,single_unloaded runs only those (while working on one path); all by default.
  const only = process.env.BENCH_CASES ? new Set(process.env.BENCH_CASES.split(',')) : null;
  const want = (key: string) => !only || only.has(key);
  if (want('health')) cases.health = await run('GET /api/health', { url: `${url}/api/health` });
  if (want('health_unloaded')) cases.health_unloaded = await run('GET /api/health (unloaded)', { url: `${url}/api/health`, connections: 1 });
  if (want('single')) cases.single = await run('POST evaluate (single)', { url: `${url}${path}`, ...single });
  if (want('single_unloaded')) cases.single_unloaded = await run('POST evaluate (single, unloaded)', { url: `${url}${path}`, ...single, connections: 1, serverTiming: true });
  if (want('batch')) cases.batch = await run('POST evaluate (1,000 rows)', { url: `${url}${path}`, method: 'POST', headers, body: JSON.stringify({ rows }), connections: 10 });
  if (want('template')) cases.template = await run('POST template run (1,000 rows)', { ...template, connections: 10 });
  if (want('template_unloaded')) cases.template_unloaded = await run('POST template run (1,000 rows, unloaded)', { ...template, connections: 1, serverTiming: true });
  if (want('library_api')) cases.library_api = await run(`GET library list, 50 of ${librarySize} (unloaded)`, { url: `${url}/api/correlations?pageSize=50&sort=title`, headers: cookie, connections: 1, serverTiming: true });
  if (want('library_search')) cases.library_search = await run('GET library search "laminar plate" (unloaded)', { url: `${url}/api/correlations?pageSize=50&q=laminar%20plate`, headers: cookie, connections: 1, serverTiming: true });
  if (want('library_page')) cases.library_page = await run('GET /library page (unloaded)', { url: `${url}/library`, headers: cookie, connections: 1 });
  if (want('library_api_loaded')) cases.library_api_loaded = await run('GET library list, 50 (10 connections)', { url: `${url}/api/correlations?pageSize=50&sort=title`, headers: cookie, connections: 10 });

  console.log(`library: ${librarySize} correlations; ${DURATION} s a case`);
  console.log(`${'case'.padEnd(46)} ${'conn'.padStart(4)} ${'req/s'.padStart(8)} ${'p50 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'server p50/p99'.padStart(15)}  bad`);
  for (const r of Object.values(cases)) {
    const server = r.server_p50 !== undefined ? `${r.server_p50}/${r.server_p99}` : '';
    console.log(`${r.title.padEnd(46)} ${String(r.connections).padStart(4)} ${r.rps.toFixed(0).padStart(8)} ${String(r.p50).padStart(7)} ${String(r.p99).padStart(7)} ${server.padStart(15)}  ${r.bad}`);
  }
  const ratio = cases.single && cases.health ? cases.single.rps / cases.health.rps : NaN;
  if (cases.single && cases.health) console.log(`single evaluate / health throughput: ${ratio.toFixed(2)} (goal ≥ 0.7)`);
  if (cases.single_unloaded) console.log(`unloaded single evaluate: p50 ${cases.single_unloaded.p50} ms, p99 ${cases.single_unloaded.p99} ms (goal p99 < 5); in the handler p99 ${cases.single_unloaded.server_p99} ms`);
  if (cases.batch) console.log(`1,000-row batch: ${(cases.batch.rps * 1000).toFixed(0)} evaluations/s`);
  if (cases.template) console.log(`template: ${(cases.template.rps * 1000).toFixed(0)} rows/s at 10 connections`);
  if (cases.template_unloaded) console.log(`one 1,000-row template run: p50 ${cases.template_unloaded.p50} ms (goal < 50)`);
  if (cases.library_api && cases.library_page) console.log(`library of ${librarySize}: list p50 ${cases.library_api.p50} ms, search p50 ${cases.library_search?.p50 ?? '–'} ms, page p50 ${cases.library_page.p50} ms (goal < 150)`);
  const strip = ({ title: _title, ...c }: Case) => ({ ...c, rps: Number(c.rps.toFixed(1)) });
  console.log(JSON.stringify({
    ...Object.fromEntries(Object.entries(cases).map(([k, c]) => [k, strip(c)])),
    single_over_health: Number.isFinite(ratio) ? Number(ratio.toFixed(3)) : null, library_size: Number(librarySize), seconds_per_case: DURATION,
  }));
  if (Object.values(cases).some((c) => c.bad > 0)) { console.error('some requests failed: see the "bad" column'); process.exitCode = 1; }
}

main().catch((err) => { console.error(err); process.exitCode = 1; }).finally(() => closeSequelize());
