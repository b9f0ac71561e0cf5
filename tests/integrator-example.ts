/**
 * How an integrator calls Correlary from a script: evaluate a pinned correlation version with a
 * personal API token, in a batch, and keep the version and content hash with the results.
 *
 *   CORRELARY_URL=http://localhost:3000 CORRELARY_TOKEN=crl_… npx tsx tests/integrator-example.ts
 *
 * The test suite runs it (tests/integration/api.test.ts) against the test server.
 */
export interface SweepResult {
  version: number;
  contentHash: string;
  rows: { Re_D: number; Nu_D: number; warnings: string[] }[];
}

export async function cylinderSweep(baseUrl: string, token: string, pr: number, reynolds: number[]): Promise<SweepResult> {
  const slug = 'cylinder-crossflow-churchill-bernstein';
  const head = await fetch(`${baseUrl}/api/correlations/${slug}`, { headers: { authorization: `Bearer ${token}` } });
  if (!head.ok) throw new Error(`cannot read ${slug}: ${head.status} ${await head.text()}`);
  const { latestApprovedVersion } = (await head.json()) as { latestApprovedVersion: number };
  const res = await fetch(`${baseUrl}/api/correlations/${slug}/evaluate`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    // Pin the version so that a later approval does not silently change the numbers.
    body: JSON.stringify({ version: latestApprovedVersion, rows: reynolds.map((re) => ({ Re_D: re, Pr: pr })) }),
  });
  if (!res.ok) throw new Error(`evaluation failed: ${res.status} ${await res.text()}`);
  const out = (await res.json()) as { version: number; contentHash: string; results: { outputs: { Nu_D: number }; warnings: { message: string }[] }[] };
  return {
    version: out.version,
    contentHash: out.contentHash,
    rows: out.results.map((r, i) => ({ Re_D: reynolds[i], Nu_D: r.outputs.Nu_D, warnings: r.warnings.map((w) => w.message) })),
  };
}

if (process.argv[1]?.endsWith('integrator-example.ts')) {
  const url = process.env.CORRELARY_URL ?? 'http://localhost:3000';
  const token = process.env.CORRELARY_TOKEN;
  if (!token) {
    console.error('Set CORRELARY_TOKEN to a token with the evaluate scope (Account page, or npm run token).');
    process.exit(2);
  }
  cylinderSweep(url, token, 0.71, [10, 100, 1e3, 1e4, 1e5]).then((r) => {
    console.log(`cylinder-crossflow-churchill-bernstein v${r.version} (${r.contentHash.slice(0, 12)}…)`);
    for (const row of r.rows) console.log(`Re_D = ${row.Re_D.toExponential(1)}  Nu_D = ${row.Nu_D.toFixed(3)}${row.warnings.length ? `  ⚠ ${row.warnings.join('; ')}` : ''}`);
  });
}
