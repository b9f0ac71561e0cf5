import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken } from '@/lib/api/tokens';
import { gnielinski } from '@/validation/reference/formulas';

/**
 * The applicability advisor and the bands over HTTP, against the seeded library. Reference values:
 * Gnielinski (1976) and Dittus–Boelter written out independently in validation/reference/formulas.ts.
 */
describe('applicability advisor and accuracy bands', () => {
  let token: string;
  let readOnly: string;
  beforeAll(async () => {
    const integrator = (await db().User.findOne({ where: { email: 'integrator@demo.example' } }))!.id;
    token = (await createApiToken({ actorId: null, userId: integrator, name: 'advice test', scopes: ['read', 'evaluate'], expiresAt: null })).token;
    readOnly = (await createApiToken({ actorId: null, userId: integrator, name: 'advice read', scopes: ['read'], expiresAt: null })).token;
  });
  afterAll(() => closeSequelize());

  it('lists Dittus–Boelter, Sieder–Tate, Petukhov and Gnielinski in a tube at Re_D = 3e4, Pr = 3, with values, bands, grades and the spread', async () => {
    const res = await call('/api/advice', { token, body: { situation: 'circular tube', inputs: { Re_D: 3e4, Pr: 3, L_over_D: 60, mu_ratio: 1, x_over_D: 60 } } });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    const a = res.body;
    expect(a.output).toBe('Nu_D');
    const by = Object.fromEntries(a.candidates.map((c: { slug: string }) => [c.slug, c]));
    for (const slug of ['pipe-turbulent-dittus-boelter-heating', 'pipe-turbulent-dittus-boelter-cooling', 'pipe-turbulent-sieder-tate', 'pipe-turbulent-petukhov', 'pipe-turbulent-gnielinski']) {
      expect(by[slug]?.status, slug).toBe('inside');
      expect(by[slug].band.rel, slug).toBeGreaterThan(0);
      expect(['well-founded', 'adequate', 'thin']).toContain(by[slug].grade);
    }
    expect(by['pipe-turbulent-gnielinski'].value / gnielinski(3e4, 3) - 1).toBeLessThan(1e-9);
    expect(Math.abs(by['pipe-turbulent-dittus-boelter-heating'].value / (0.023 * 3e4 ** 0.8 * 3 ** 0.4) - 1)).toBeLessThan(1e-12);
    // Laminar correlations of the same situation are listed with the range they break, after every in-range one.
    expect(by['pipe-laminar-developed-uniform-wall-temperature'].status).toBe('outside');
    expect(by['pipe-laminar-developed-uniform-wall-temperature'].breaks[0]).toMatchObject({ symbol: 'Re_D', max: 2300 });
    const firstOutside = a.candidates.findIndex((c: { status: string }) => c.status !== 'inside');
    expect(a.candidates.slice(firstOutside).every((c: { status: string }) => c.status !== 'inside')).toBe(true);
    // Spread among the in-range ones: Dittus–Boelter (cooling) to Sieder–Tate, computed here from the listed values.
    const inside = a.candidates.filter((c: { status: string }) => c.status === 'inside').map((c: { value: number }) => c.value).sort((x: number, y: number) => x - y);
    expect(a.spread.inside.min).toBe(inside[0]);
    expect(a.spread.inside.max).toBe(inside[inside.length - 1]);
    expect(a.spread.inside.rel).toBeGreaterThan(0.07);
    expect(a.ranking).toMatch(/inside every validity range first/);
  });

  it('marks the correlations whose range Re_D = 3000 breaks, by how much, and keeps Gnielinski inside', async () => {
    const res = await call('/api/advice', { token, body: { situation: 'circular tube', inputs: { Re_D: 3000, Pr: 3, L_over_D: 60, mu_ratio: 1, x_over_D: 60 } } });
    const by = Object.fromEntries(res.body.candidates.map((c: { slug: string }) => [c.slug, c]));
    expect(by['pipe-turbulent-gnielinski'].status).toBe('inside');
    for (const slug of ['pipe-turbulent-dittus-boelter-heating', 'pipe-turbulent-sieder-tate', 'pipe-turbulent-petukhov']) {
      expect(by[slug].status, slug).toBe('outside');
      const b = by[slug].breaks.find((x: { symbol: string }) => x.symbol === 'Re_D');
      expect(b.min, slug).toBe(10000);
      expect(b.factor, slug).toBeCloseTo(0.3, 12);
    }
    expect(res.body.candidates[0].slug).toBe('pipe-turbulent-gnielinski');
  });

  it('sweeps one input for the plot, with each point marked inside or outside the ranges', async () => {
    const res = await call('/api/advice', { token, body: { like: 'pipe-turbulent-gnielinski', inputs: { Re_D: 3e4, Pr: 3, L_over_D: 60, mu_ratio: 1, x_over_D: 60 }, sweep: { symbol: 'Re_D', from: 1000, to: 1e6, points: 31 } } });
    expect(res.status).toBe(200);
    expect(res.body.sweep.x).toHaveLength(31);
    const db = res.body.candidates.find((c: { slug: string }) => c.slug === 'pipe-turbulent-dittus-boelter-heating');
    expect(db.series.filter((p: { inside: boolean }) => !p.inside).every((p: { x: number }) => p.x < 1e4)).toBe(true);
    expect(db.series.filter((p: { inside: boolean }) => p.inside).every((p: { x: number }) => p.x >= 1e4)).toBe(true);
  });

  it('refuses bad requests with the field named, needs the evaluate scope, and lists the situations with read', async () => {
    const bad = await call('/api/advice', { token, body: { situation: 'circular tube', inputs: { Re_D: 'many' } } });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body.error.details)).toContain('inputs.Re_D');
    const none = await call('/api/advice', { token, body: { inputs: { Re_D: 1 } } });
    expect(none.status).toBe(422);
    expect(JSON.stringify(none.body.error.details)).toContain('situation');
    const sweep = await call('/api/advice', { token, body: { situation: 'circular tube', inputs: { Re_D: 1e4 }, sweep: { symbol: 'Re_D', from: 10, to: 1, points: 5000 } } });
    expect(sweep.status).toBe(422);
    expect((await call('/api/advice', { token: readOnly, body: { situation: 'circular tube', inputs: { Re_D: 1e4 } } })).status).toBe(403);
    const list = await call('/api/advice', { token: readOnly });
    expect(list.status).toBe(200);
    const tube = list.body.situations.find((s: { situation: string }) => s.situation === 'circular tube');
    expect(tube.outputs[0]).toBe('Nu_D');
    expect(tube.inputs).toEqual(expect.arrayContaining(['Re_D', 'Pr', 'L_over_D']));
  });

  it('answers every evaluation with the band of each output, from the version’s stated accuracy', async () => {
    const one = await call('/api/correlations/pipe-turbulent-gnielinski/evaluate', { token, body: { inputs: { Re_D: 3e4, Pr: 3 } } });
    expect(one.body.outputs.Nu_D / gnielinski(3e4, 3) - 1).toBeLessThan(1e-9);
    expect(one.body.bands.Nu_D).toMatchObject({ rel: 0.1 });
    expect(one.body.bands.Nu_D.basis).toMatch(/Gnielinski/);
    const haaland = await call('/api/correlations/friction-factor-haaland/evaluate', { token, body: { rows: [{ Re_D: 1e5, eps_D: 1e-4 }] } });
    expect(haaland.body.bands.f).toMatchObject({ rel: 0.015, approximates: 'friction-factor-colebrook' });
    const exact = await call('/api/correlations/friction-factor-laminar/evaluate', { token, body: { inputs: { Re_D: 1000 } } });
    expect(exact.body.bands.f.rel).toBe(0);
  });

  it('runs a template with the propagated band of each result, its budget by step and the sensitivities', async () => {
    const res = await call('/api/templates/flat-plate-forced-convection-air/run', { token, body: { inputs: { T_inf: 288.15, T_s: 328.15, p: 98000, u_inf: 20, L: 1.2, W: 0.25 } } });
    expect(res.status).toBe(200);
    const q = res.body.uncertainty.outputs.q;
    expect(q.value).toBe(res.body.outputs.q);
    expect(q.budget[0].step).toBe('nusselt-mixed');
    expect(q.budget[0].share).toBeGreaterThan(0.9);
    expect(q.rel).toBeGreaterThan(0.15);
    expect(q.sensitivities.W.elasticity).toBeCloseTo(1, 9);
    expect(res.body.uncertainty.method).toMatch(/automatic differentiation/);
  });
});
