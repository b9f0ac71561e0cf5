import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { call, DEMO_PASSWORD, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { readPropertyTables } from '@/lib/governance/library';
import { revisionHash } from '@/lib/calculations/records';

const TEMPLATE = 'flat-plate-forced-convection-air';
const MAIL_DIR = process.env.MAIL_DIR!;
const mailTo = (email: string) => (existsSync(MAIL_DIR) ? readdirSync(MAIL_DIR) : [])
  .map((f) => JSON.parse(readFileSync(join(MAIL_DIR, f), 'utf8')) as { to: string[]; subject: string; text: string })
  .filter((m) => m.to.includes(email));
const until = async (what: () => boolean, ms = 5000) => { const end = Date.now() + ms; while (!what() && Date.now() < end) await new Promise((r) => setTimeout(r, 100)); return what(); };
const rel = (a: number, b: number) => Math.abs(a / b - 1);

/**
 * The air rows the hand calculation reads: the governed table air-properties-1atm v2, generated from
 * Lemmon et al. (2000) and Lemmon & Jacobsen (2004) at 101.325 kPa by scripts/property-tables.py.
 */
function airRow(T: number) {
  const air = readPropertyTables().find((e) => e.slug === 'air-properties-1atm')!.definition as { tables: { columns: { name: string; values: number[] }[] }[] };
  const col = (n: string) => air.tables[0].columns.find((c) => c.name === n)!.values;
  const Ts = col('T');
  const i = Ts.findIndex((t, k) => T >= t && T <= Ts[k + 1]);
  const f = (T - Ts[i]) / (Ts[i + 1] - Ts[i]);
  const at = (n: string) => col(n)[i] + f * (col(n)[i + 1] - col(n)[i]);
  return { nu: at('nu'), k: at('k'), Pr: at('Pr') };
}

describe('calculations: templates, saved records, parametric runs and withdrawal impact', () => {
  let engineer: Awaited<ReturnType<typeof freshUser>>;
  let outsider: Awaited<ReturnType<typeof freshUser>>;
  let reviewer: Awaited<ReturnType<typeof freshUser>>;
  let author: Awaited<ReturnType<typeof freshUser>>;
  let approver: string;
  let approver2: string;
  let project: number;

  beforeAll(async () => {
    engineer = await freshUser(['engineer'], 'calc-engineer');
    outsider = await freshUser(['engineer'], 'calc-outsider');
    reviewer = await freshUser(['engineer'], 'calc-reviewer');
    author = await freshUser(['author'], 'calc-author');
    approver = (await signIn('approver@demo.example')).cookie!;
    approver2 = (await signIn('approver2@demo.example')).cookie!;
    project = (await call('/api/projects', { cookie: engineer.cookie, body: { name: 'Solar charge controller housing (test)', description: 'invented' } })).body.id;
    expect((await call(`/api/projects/${project}/members`, { cookie: engineer.cookie, body: { email: reviewer.user.email, role: 'reviewer' } })).status).toBe(200);
  });
  afterAll(() => closeSequelize());

  it('runs the flat-plate template for a case of our own and reproduces every step of a hand calculation', async () => {
    // An invented case: a 0.45 m × 0.25 m fin plate of a charge controller at 48 °C in 22 °C air at
    // 2.5 m/s, site pressure 97.0 kPa; entered in °C and kPa as an engineer would.
    const res = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { inputs: {
      T_inf: { value: 22, unit: 'degC' }, T_s: { value: 48, unit: 'degC' }, p: { value: 97, unit: 'kPa' }, u_inf: 2.5, L: { value: 450, unit: 'mm' }, W: 0.25,
    } } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const step = (key: string) => res.body.steps.find((s: { key: string }) => s.key === key);
    // Hand calculation, step by step.
    const T_inf = 22 + 273.15; const T_s = 48 + 273.15; // K (ITS-90 offset, common practice)
    const T_f = (T_s + T_inf) / 2; // film temperature (Incropera et al. 2007, §7.1)
    const air = airRow(T_f); // linear interpolation between the 300 K and 310 K rows
    const nu = air.nu * (101325 / 97000); // ideal gas: ν ∝ 1/p at fixed T (Bird, Stewart & Lightfoot 2002, ch. 1)
    const Re = (2.5 * 0.45) / nu;
    expect(Re).toBeLessThan(5e5); // laminar over the whole plate
    const Nu = 0.664 * Math.sqrt(Re) * Math.cbrt(air.Pr); // Pohlhausen (1921) average, isothermal plate
    const h = (Nu * air.k) / 0.45;
    const q = h * 0.45 * 0.25 * (T_s - T_inf);
    const delta = (4.91 * 0.45) / Math.sqrt(Re); // Blasius (1908) 99 % thickness at x = L
    // Same arithmetic by another route: agreement to rounding shows the chain is wired as written.
    expect(step('film-temperature').outputs.T_f).toBeCloseTo(T_f, 10);
    expect(rel(step('air-properties').outputs.nu_table, air.nu)).toBeLessThan(1e-12);
    expect(rel(step('air-properties').outputs.k, air.k)).toBeLessThan(1e-12);
    expect(rel(step('pressure-correction').outputs.nu, nu)).toBeLessThan(1e-12);
    expect(rel(step('reynolds').outputs.Re_L, Re)).toBeLessThan(1e-12);
    expect(step('nusselt-laminar').choice.picked).toBe('laminar');
    expect(rel(step('nusselt-laminar').outputs.Nu_L, Nu)).toBeLessThan(1e-12);
    expect(rel(step('heat').outputs.h, h)).toBeLessThan(1e-12);
    expect(rel(step('heat').outputs.q, q)).toBeLessThan(1e-12);
    expect(rel(step('thickness-laminar').outputs.delta_L, delta)).toBeLessThan(1e-12);
    expect(res.body.outputs).toMatchObject({ T_f: expect.any(Number), Re_L: expect.any(Number), Pr: expect.any(Number), Nu_L: expect.any(Number), h: expect.any(Number), q: expect.any(Number), delta_L: expect.any(Number) });
    // Sanity against the trade: h of a few W/(m² K) to tens for gentle forced convection in air (common practice).
    expect(h).toBeGreaterThan(3);
    expect(h).toBeLessThan(30);
    // Every step names its pinned version and hash.
    expect(step('nusselt-laminar').correlation).toMatchObject({ slug: 'flat-plate-laminar-average', version: 1, contentHash: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(step('air-properties').correlation).toMatchObject({ slug: 'air-properties-1atm', version: 2 });
    expect(res.body.warnings).toEqual([]);
  });

  it('crosses transition: the mixed-boundary-layer average is picked and the rule is shown', async () => {
    const res = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { inputs: { T_inf: 300, T_s: 340, p: { value: 1, unit: 'atm' }, u_inf: 15, L: 1.5, W: 1 } } });
    const step = (key: string) => res.body.steps.find((s: { key: string }) => s.key === key);
    const air = airRow(320);
    const Re = (15 * 1.5) / air.nu;
    expect(Re).toBeGreaterThan(5e5);
    const Nu = (0.037 * Re ** 0.8 - 871) * Math.cbrt(air.Pr); // mixed layer, Re_x,c = 5×10^5 (Incropera et al. 2007, eq. 7.38)
    const nusselt = step('nusselt-mixed');
    expect(nusselt.choice).toMatchObject({ key: 'nusselt', picked: 'mixed', options: ['laminar', 'mixed'] });
    expect(nusselt.choice.rule).toMatch(/5×10\^5/);
    expect(rel(nusselt.outputs.Nu_L, Nu)).toBeLessThan(1e-12);
    expect(rel(step('thickness-turbulent-scale').outputs.delta_L, 0.37 * 1.5 * Re ** -0.2)).toBeLessThan(1e-12); // 1/7-power law (Schlichting & Gersten 2000)
    expect(step('nusselt-laminar')).toBeUndefined();
  });

  it('reports a range warning at the step where it arises, also in the top-level list with the step key', async () => {
    const res = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { inputs: { T_inf: 1400, T_s: 1800, p: 101325, u_inf: 2, L: 0.2, W: 0.2 } } });
    expect(res.status).toBe(200);
    const air = res.body.steps.find((s: { key: string }) => s.key === 'air-properties');
    expect(air.warnings).toHaveLength(1);
    expect(air.warnings[0]).toMatchObject({ symbol: 'T', value: 1600, max: 1500, step: 'air-properties' });
    expect(res.body.warnings).toEqual([air.warnings[0]]);
    const refused = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { inputs: { T_inf: 300, T_s: 340, p: 101325, u_inf: -1, L: 0.2, W: 0.2 } } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('invalid:refused');
    expect(refused.body.error.message).toMatch(/u_inf = -1/);
  });

  it('saves an immutable, hash-protected record, readable by members and approvers only', async () => {
    const inputs = { T_inf: { value: 22, unit: 'degC' }, T_s: { value: 48, unit: 'degC' }, p: { value: 97, unit: 'kPa' }, u_inf: 2.5, L: 0.45, W: 0.25 };
    const saved = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'Fin plate, summer', template: { slug: TEMPLATE }, inputs } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const got = await call(`/api/calculations/${saved.body.id}`, { cookie: engineer.cookie });
    expect(got.body.contentHash).toBe(saved.body.contentHash);
    expect(revisionHash(got.body.content)).toBe(saved.body.contentHash);
    expect(got.body.content.template).toMatchObject({ slug: TEMPLATE, version: 1 });
    expect(got.body.content.answer.steps).toHaveLength(7);
    expect(got.body.content.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect((await call(`/api/calculations/${saved.body.id}`, { cookie: reviewer.cookie })).status).toBe(200);
    expect((await call(`/api/calculations/${saved.body.id}`, { cookie: approver })).status).toBe(200);
    expect((await call(`/api/calculations/${saved.body.id}`, { cookie: outsider.cookie })).status).toBe(404);
    expect((await call('/api/calculations', { cookie: reviewer.cookie, body: { project, title: 'not allowed', template: { slug: TEMPLATE }, inputs } })).body.error.code).toBe('forbidden:project-edit');
    // A change is a new revision; the first stays as it was.
    const second = await call('/api/calculations', { cookie: engineer.cookie, body: { project, calculation: saved.body.id, title: 'Fin plate, summer', note: 'faster wind', template: { slug: TEMPLATE }, inputs: { ...inputs, u_inf: 4 } } });
    expect(second.body.revision).toBe(2);
    const first = await call(`/api/calculations/${saved.body.id}?revision=1`, { cookie: engineer.cookie });
    expect(first.body.contentHash).toBe(saved.body.contentHash);
    // Tampering with the stored record is caught.
    const { CalculationRevision, sequelize } = db();
    const row = await CalculationRevision.findOne({ where: { calculationId: saved.body.id, revision: 1 } });
    const original = JSON.stringify(row!.content);
    const content = row!.content as { answer: { outputs: { h: number } } };
    content.answer.outputs.h *= 1.1;
    await sequelize.query('UPDATE calculation_revisions SET content = ? WHERE id = ?', { replacements: [JSON.stringify(content), row!.id], type: QueryTypes.UPDATE });
    try {
      const tampered = await call(`/api/calculations/${saved.body.id}?revision=1`, { cookie: engineer.cookie });
      expect(tampered.status).toBe(409);
      expect(tampered.body.error.code).toBe('conflict:content-hash-mismatch');
      const { verifyAllContent } = await import('@/lib/governance/content-check');
      expect((await verifyAllContent()).mismatches).toEqual([`calculation ${saved.body.id} revision 1`]);
    } finally {
      await sequelize.query('UPDATE calculation_revisions SET content = ? WHERE id = ?', { replacements: [original, row!.id], type: QueryTypes.UPDATE });
    }
    expect((await call(`/api/calculations/${saved.body.id}?revision=1`, { cookie: engineer.cookie })).status).toBe(200);
  });

  it('runs a table of cases: per-row warnings and picks, bad cells named by row and column, nothing saved on error', async () => {
    const rows = [1, 5, 20, 40].map((u) => ({ T_inf: 300, T_s: 340, p: 101325, u_inf: u, L: 1.2, W: 0.5 }));
    const res = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { rows } });
    expect(res.body.results.map((r: { picked: Record<string, string> }) => r.picked.nusselt)).toEqual(['laminar', 'laminar', 'mixed', 'mixed']);
    const single = await call(`/api/templates/${TEMPLATE}/run`, { cookie: engineer.cookie, body: { inputs: rows[2] } });
    expect(res.body.results[2].outputs).toEqual(single.body.outputs);
    const before = await db().Calculation.count();
    const bad = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'bad table', template: { slug: TEMPLATE }, rows: [rows[0], { ...rows[1], u_inf: 'fast' }, { ...rows[2], L: { value: 1, unit: 'kg' } }] } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.issues.map((i: { path: string }) => i.path)).toEqual(['rows[1].u_inf', 'rows[2].L.unit']);
    expect(await db().Calculation.count()).toBe(before);
    const ok = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'wind sweep', template: { slug: TEMPLATE }, rows } });
    expect(ok.status).toBe(200);
    const csv = await call(`/api/calculations/${ok.body.id}/csv`, { cookie: engineer.cookie });
    expect(String(csv.body).split('\n').filter(Boolean)).toHaveLength(2 + rows.length);
  });

  it('flags the calculations that used a withdrawn version, mails their owners, and re-runs against the latest versions', async () => {
    // A correlation of the tests' own, approved, used by an own chain in a saved calculation.
    const slug = `calc-test-plate-${Date.now()}`;
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(0.332), checkCases: plateCases(0.332) } })).status).toBe(200);
    const approve = async (n: number) => {
      expect((await call(`/api/correlations/${slug}/versions/${n}/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
      expect((await call(`/api/correlations/${slug}/versions/${n}/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } })).status).toBe(200);
    };
    await approve(1);
    const hashOf = async (n: number) => (await call(`/api/correlations/${slug}/versions/${n}`, { cookie: engineer.cookie })).body.contentHash as string;
    const chain = (n: number, hash: string) => ({
      schemaVersion: 1, kind: 'template', title: 'Local Nusselt number at a station', summary: 'Own chain for the test.', category: 'external-flow', situation: 'flat plate',
      inputs: [{ symbol: 'u', name: 'velocity', unit: 'm/s' }, { symbol: 'x', name: 'distance', unit: 'm' }, { symbol: 'nu', name: 'kinematic viscosity', unit: 'm^2/s' }, { symbol: 'Pr', name: 'Prandtl number', unit: '1' }],
      steps: [
        { key: 'reynolds', kind: 'expression', title: 'Local Reynolds number', outputs: [{ symbol: 'Re_x', name: 'Re_x', unit: '1', expression: 'u * x / nu' }] },
        { key: 'nusselt', kind: 'correlation', title: 'Local Nusselt number', use: { slug, version: n, contentHash: hash }, inputs: { Re_x: 'Re_x', Pr: 'Pr' }, outputs: { Nu_x: 'Nu_x' } },
      ],
      outputs: [{ symbol: 'Nu_x', name: 'local Nusselt number' }], references: [{ citation: 'Pohlhausen (1921) Z. Angew. Math. Mech. 1:115' }],
    });
    const inputs = { u: 3, x: 0.2, nu: 1.6e-5, Pr: 0.71 };
    const a = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'Station A with v1', chain: chain(1, await hashOf(1)), inputs } });
    expect(a.status, JSON.stringify(a.body)).toBe(200);
    // Version 2 is approved; version 1 becomes superseded (not withdrawn): A is not flagged, and a re-run shows the change.
    expect((await call(`/api/correlations/${slug}/versions`, { cookie: author.cookie, body: { fromVersion: 1 } })).body.version).toBe(2);
    expect((await call(`/api/correlations/${slug}/versions/2`, { cookie: author.cookie, method: 'PATCH', body: { definition: plateDefinition(0.34), checkCases: plateCases(0.34) } })).status).toBe(200);
    await approve(2);
    const rerun = await call(`/api/calculations/${a.body.id}/rerun`, { cookie: engineer.cookie, method: 'POST' });
    expect(rerun.body.moved).toEqual([{ slug, from: 1, to: 2 }]);
    const nusselt = rerun.body.steps.find((s: { key: string }) => s.key === 'nusselt');
    expect(nusselt.outputs[0].change).toBeCloseTo(0.34 / 0.332 - 1, 12);
    const b = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'Station B with v2', chain: chain(2, await hashOf(2)), inputs } });
    // The approver sees what uses version 2 before withdrawing it.
    const uses = await call(`/api/correlations/${slug}/versions/2/uses`, { cookie: approver2 });
    expect(uses.body.calculations.map((c: { id: number }) => c.id)).toEqual([b.body.id]);
    expect((await call(`/api/correlations/${slug}/versions/2/uses`, { cookie: engineer.cookie })).status).toBe(403);
    const w = await call(`/api/correlations/${slug}/versions/2/withdraw`, { cookie: approver2, body: { reason: 'Coefficient typed from the wrong table row.', password: DEMO_PASSWORD } });
    expect(w.status).toBe(200);
    expect(w.body.notified).toContain(engineer.user.email);
    expect((await call(`/api/calculations/${b.body.id}`, { cookie: engineer.cookie })).body.flags).toEqual([expect.objectContaining({ slug, version: 2, reason: 'Coefficient typed from the wrong table row.' })]);
    expect((await call(`/api/calculations/${a.body.id}`, { cookie: engineer.cookie })).body.flags).toEqual([]);
    const proj = await call(`/api/projects/${project}`, { cookie: engineer.cookie });
    expect(proj.body.calculations.find((c: { id: number }) => c.id === b.body.id).flags).toHaveLength(1);
    expect(await until(() => mailTo(engineer.user.email).some((m) => m.subject.includes('Withdrawn') && m.text.includes('Station B with v2')))).toBe(true);
    // A withdrawn version cannot start new work.
    const again = await call('/api/calculations', { cookie: engineer.cookie, body: { project, title: 'Station C', chain: chain(2, await hashOf(2)), inputs } });
    expect(again.status).toBe(422);
    expect(again.body.error.message).toMatch(/withdrawn/);
  });

  it('governs templates like correlations: a template pinning a version that is not approved fails validation', async () => {
    const slug = `calc-test-template-${Date.now()}`;
    const visc = (await call('/api/correlations/air-viscosity-sutherland/versions/1', { cookie: author.cookie })).body.contentHash;
    const def = {
      schemaVersion: 1, kind: 'template', title: 'Air viscosity only', summary: 'Test template.', category: 'properties', situation: 'test',
      inputs: [{ symbol: 'T', name: 'temperature', unit: 'K' }],
      steps: [{ key: 'viscosity', kind: 'correlation', title: 'Air viscosity', use: { slug: 'air-viscosity-sutherland', version: 1, contentHash: visc }, inputs: { T: 'T' }, outputs: { mu: 'mu' } }],
      outputs: [{ symbol: 'mu', name: 'dynamic viscosity' }], references: [{ citation: 'Sutherland (1893), Phil. Mag. 36:507' }],
    };
    // Sutherland's law as the library states it (μ0 = 1.716e-5 Pa s at T0 = 273.15 K, S = 110.4 K): the case checks the wiring.
    const cases = [300, 400, 500].map((T) => ({ label: `T = ${T} K`, inputs: { T }, expected: { mu: 1.716e-5 * (T / 273.15) ** 1.5 * (273.15 + 110.4) / (T + 110.4) }, tolerance: { rel: 1e-9, why: 'the same law re-typed' }, source: { kind: 'transcription', citation: 'Sutherland’s law re-typed: checks the wiring' } }));
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: def, checkCases: cases } })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: author.cookie, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: '', password: author.password } })).body.error.code).toBe('forbidden:role');
    // Not listed as a correlation, listed as a template.
    expect((await call(`/api/correlations?q=${slug}`, { cookie: author.cookie })).body.total).toBe(0);
    const wrong = await call('/api/correlations', { cookie: author.cookie, body: { slug: `${slug}-b`, definition: { ...def, steps: [{ ...def.steps[0], use: { ...def.steps[0].use, contentHash: 'a'.repeat(64) } }] }, checkCases: cases } });
    expect(wrong.status).toBe(200);
    const sub = await call(`/api/correlations/${slug}-b/versions/1/submit`, { cookie: author.cookie, method: 'POST' });
    expect(sub.status).toBe(422);
    expect(JSON.stringify(sub.body.error.details.issues)).toMatch(/content hash is [0-9a-f]{64}, not the pinned a{64}/);
  });
});
