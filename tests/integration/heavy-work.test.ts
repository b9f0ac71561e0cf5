import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call } from '../support/http';
import { freshUser } from '../support/fixtures';
import { closeSequelize } from '@/lib/db/connection';
import { validateVersion } from '@/lib/engine/validate';
import { MAX_ROW_COST } from '@/lib/engine/compile';
import { runOnPool } from '@/lib/evaluation/pool';
import { AppError } from '@/lib/http/errors';

/** A definition of `k` implicit solves, each residual a long sum: expensive per row, still valid. */
function heavy(k: number, terms: number) {
  const steps = Array.from({ length: k }, (_, i) => ({
    kind: 'solve', symbol: `x${i}`, name: `root ${i}`, unit: '1', bracket: [0, 100],
    residual: `x${i} + ${Array.from({ length: terms }, (_, j) => `0.001 * sin(${j + 1} * x${i})`).join(' + ')} - (a + ${i})`,
  }));
  return {
    schemaVersion: 1, title: `Heavy test definition ${k}×${terms}`, summary: 'Many implicit solves, for the worker-pool tests.', category: 'friction', situation: 'test',
    inputs: [{ symbol: 'a', name: 'offset', unit: '1' }], steps,
    outputs: [{ symbol: 'y', name: 'sum of roots', unit: '1', expression: steps.slice(0, 11).map((s) => s.symbol).join(' + ') }],
    validity: [{ symbol: 'a', min: 0, max: 50 }], references: [{ citation: 'test definition, no source' }],
  };
}

describe('heavy work stays off the request loop', () => {
  let author: Awaited<ReturnType<typeof freshUser>>;
  beforeAll(async () => { author = await freshUser(['author', 'engineer'], 'heavy'); });
  afterAll(() => closeSequelize());

  it('caps the complexity of a definition at validation', () => {
    const report = validateVersion(heavy(50, 15), []);
    const issue = report.stages.find((s) => s.stage === 'expressions')!.issues[0];
    expect(issue.message).toMatch(new RegExp(`more than the ${MAX_ROW_COST.toLocaleString('en')} allowed`));
    expect(validateVersion(heavy(11, 15), []).stages.find((s) => s.stage === 'expressions')!.passed).toBe(true);
  });

  it('answers health while the heaviest allowed batches run', async () => {
    const slug = `heavy-${Date.now()}`;
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: heavy(11, 15), checkCases: [] } })).status).toBe(200);
    const rows = Array.from({ length: 10_000 }, (_, i) => ({ a: (i % 500) / 10 }));
    let heavyDone = 0;
    const batches = Array.from({ length: 3 }, () => call(`/api/correlations/${slug}/evaluate`, { cookie: author.cookie, body: { version: 1, rows } }).then((r) => { heavyDone = Date.now(); return r; }));
    const healthAnswered: number[] = [];
    const poll = (async () => {
      while (!heavyDone) {
        const res = await call('/api/health');
        expect(res.status).toBe(200);
        healthAnswered.push(Date.now());
        await new Promise((r) => setTimeout(r, 25));
      }
    })();
    const answers = await Promise.all(batches);
    await poll;
    for (const a of answers) {
      expect(a.status, JSON.stringify(a.body).slice(0, 200)).toBe(200);
      expect(a.body.results).toHaveLength(10_000);
      // x + Σ 0.001 sin(jx) = a + i: the sum of the roots is close to Σ (a + i), within 11 × 15 × 0.001.
      expect(Math.abs(a.body.results[10].outputs.y - (11 * 1 + 55))).toBeLessThan(0.2);
    }
    // Health was answered again and again before the last batch finished: the loop was never held.
    expect(healthAnswered.filter((t) => t < heavyDone).length).toBeGreaterThanOrEqual(3);
  });

  it('stops a task over its time budget with a clear answer', async () => {
    process.env.EVALUATION_BUDGET_MS = '30';
    const def = heavy(11, 15);
    const rows = Float64Array.from({ length: 200_000 }, (_, i) => (i % 500) / 10);
    await expect(runOnPool({ kind: 'correlation', version: { definitionText: JSON.stringify(def), contentHash: null }, rows, count: rows.length }, 'The test batch'))
      .rejects.toSatisfy((e: unknown) => e instanceof AppError && e.code === 'invalid:too-expensive' && /took longer than/.test(e.message));
    delete process.env.EVALUATION_BUDGET_MS;
  });
});
