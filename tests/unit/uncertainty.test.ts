import { describe, expect, it } from 'vitest';
import { readLibrary, readTemplates, seededVersion } from '@/lib/governance/library';
import { compiled, contentHash, type Definition } from '@/lib/engine';
import { compileChain } from '@/lib/engine/chain';
import { definitionDual, variable } from '@/lib/engine/sensitivity';
import { bandsOf, propagate } from '@/lib/engine/uncertainty';
import type { Pin, TemplateDefinition } from '@/lib/engine/template-types';

const library = readLibrary();
const resolve = (pin: Pin) => {
  const e = seededVersion(pin.slug, pin.version, library)!;
  if (contentHash(e.definition, e.checkCases) !== pin.contentHash) throw new Error(`${pin.slug}: content hash`);
  return compiled(e.definition as unknown as Definition);
};
const entry = (slug: string) => compiled(library.find((e) => e.slug === slug)!.definition as unknown as Definition);
const flat = () => structuredClone(readTemplates().find((t) => t.slug === 'flat-plate-forced-convection-air')!.definition) as unknown as TemplateDefinition;

/** Standard normal deviates (Box–Muller) from a fixed-seed generator: the same samples in every run. */
function normals(seed: number) {
  let s = seed;
  const u = () => { s = (s * 1103515245 + 12345) % 2 ** 31; return (s + 0.5) / 2 ** 31; };
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
}

describe('automatic differentiation of the expression trees', () => {
  it('gives the derivatives of Dittus–Boelter that calculus gives by hand: ∂ln Nu/∂ln Re = 0.8, ∂ln Nu/∂ln Pr = 0.4', () => {
    const c = entry('pipe-turbulent-dittus-boelter-heating');
    const [re, pr] = [5e4, 3];
    const out = definitionDual(c, [variable(re, 3, 0), variable(pr, 3, 1), variable(60, 3, 2)]).Nu_D;
    expect(out.d[0] * re / out.v).toBeCloseTo(0.8, 12);
    expect(out.d[1] * pr / out.v).toBeCloseTo(0.4, 12);
    expect(out.d[2]).toBe(0);
  });

  it('differentiates Colebrook through its implicit solve (implicit function theorem) as the closed derivative of the equation does', () => {
    // Colebrook: F(x) = x + 2 log10(ε/3.7 + 2.51 x/Re) = 0 with x = f^(−½). Differentiating by hand:
    // dx/dRe = −F_Re/F_x with F_x = 1 + 2·2.51/(Re ln10 (ε/3.7 + 2.51x/Re)), F_Re = −2·2.51 x/(Re² ln10 (…)); df = −2 x^(−3) dx.
    const c = entry('friction-factor-colebrook');
    const [re, eps] = [1e5, 1e-3];
    const out = definitionDual(c, [variable(re, 2, 0), variable(eps, 2, 1)]).f;
    const x = 1 / Math.sqrt(out.v);
    const g = eps / 3.7 + (2.51 * x) / re;
    const fx = 1 + (2 * 2.51) / (re * Math.LN10 * g);
    const fre = (-2 * 2.51 * x) / (re * re * Math.LN10 * g);
    const feps = 2 / (3.7 * Math.LN10 * g);
    expect(out.d[0] / ((-2 / x ** 3) * (-fre / fx)) - 1).toBeLessThan(1e-6);
    expect(Math.abs(out.d[1] / ((-2 / x ** 3) * (-feps / fx)) - 1)).toBeLessThan(1e-6);
  });

  it('differentiates a table look-up by the slope of its segment', () => {
    const c = compiled(readLibrary('seeders/property-tables').find((e) => e.slug === 'air-properties-1atm')!.definition as unknown as Definition);
    const t = c.definition.tables![0];
    const T = t.columns.find((k) => k.name === 'T')!.values;
    const mu = t.columns.find((k) => k.name === 'mu')!.values;
    const out = definitionDual(c, [variable(305, 1, 0)]).mu;
    const k = T.findIndex((x) => x > 305);
    expect(out.d[0]).toBeCloseTo((mu[k] - mu[k - 1]) / (T[k] - T[k - 1]), 15);
  });

  it('gives each output its band from the stated accuracy (per output for property tables)', () => {
    expect(bandsOf(entry('pipe-turbulent-gnielinski').definition).Nu_D?.rel).toBe(0.1);
    const air = readLibrary('seeders/property-tables').find((e) => e.slug === 'air-properties-1atm')!.definition as unknown as Definition;
    const b = bandsOf(air);
    expect(b.rho?.rel).toBe(0.001);
    expect(b.k?.rel).toBe(0.02);
  });
});

describe('first-order propagation through the flat-plate template', () => {
  const chain = compileChain(flat(), (pin) => resolve(pin));
  // An invented case of our own: a 0.4 m plate at 55 °C in 15 °C air at 4 m/s and 98 kPa (laminar).
  const values = chain.readInputs({ T_inf: { value: 15, unit: 'degC' }, T_s: { value: 55, unit: 'degC' }, p: 98000, u_inf: 4, L: 0.4, W: 0.25 }, 'inputs');
  const result = propagate(chain, resolve, values);

  it('agrees with a 10,000-sample Monte Carlo run of the same chain within 10 % of the band', () => {
    const run = chain.runDetailed(values);
    const q0 = run.outputs.q;
    // Every correlation step output is perturbed by an independent normal relative error with its band as σ.
    const sources = result.outputs.q.budget.filter((l) => l.rel !== null && l.rel > 0);
    const all = run.steps.filter((s) => s.kind === 'correlation').flatMap((s) => Object.keys(s.outputs).map((sym) => ({ step: s.key, sym })));
    const n = 10_000;
    const z = normals(20261202);
    const qs: number[] = [];
    for (let i = 0; i < n; i++) {
      const factors: Record<string, number> = {};
      for (const { step, sym } of all) {
        const line = result.outputs.q.budget.find((l) => l.step === step && l.symbol === sym);
        const rel = line?.rel ?? 0;
        factors[sym] = 1 + rel * z();
      }
      qs.push(chain.runDetailed(values, factors).outputs.q);
    }
    const mean = qs.reduce((a, b) => a + b, 0) / n;
    const sd = Math.sqrt(qs.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
    const band = result.outputs.q.rel!;
    expect(sources.length).toBeGreaterThanOrEqual(3);
    expect(Math.abs(sd / q0 - band)).toBeLessThan(0.1 * band);
    expect(Math.abs(mean / q0 - 1)).toBeLessThan(0.01);
  });

  it('shows the Nusselt correlation dominating the budget of h and q once the layer is turbulent, the properties small', () => {
    // 1.2 m at 20 m/s: Re_L ≈ 1.5e6, the mixed-layer correlation (±15 %) is picked.
    const fast = chain.readInputs({ T_inf: { value: 15, unit: 'degC' }, T_s: { value: 55, unit: 'degC' }, p: 98000, u_inf: 20, L: 1.2, W: 0.25 }, 'inputs');
    const r = propagate(chain, resolve, fast);
    for (const s of ['h', 'q']) {
      const budget = r.outputs[s].budget;
      expect(budget[0].step, s).toBe('nusselt-mixed');
      expect(budget[0].share!, s).toBeGreaterThan(0.9);
      const properties = budget.filter((l) => l.step === 'air-properties' || l.step === 'pressure-correction').reduce((a, l) => a + (l.share ?? 0), 0);
      expect(properties, s).toBeLessThan(0.1);
      expect(r.outputs[s].rel!, s).toBeGreaterThan(0.15);
      expect(r.outputs[s].complete, s).toBe(true);
    }
    // In the laminar case the Nusselt law is the similarity solution's fit (±2.5 %): still the largest part, but the
    // conductivity (±2 %) is not negligible beside it.
    expect(result.outputs.q.budget[0].step).toBe('nusselt-laminar');
    expect(result.outputs.q.budget.find((l) => l.symbol === 'k')!.share!).toBeGreaterThan(0.2);
  });

  it('gives the sensitivities an engineer reads: laminar q ∝ u^½ L^½ W, linear in T_s − T_∞ away from the film-temperature effect', () => {
    const { sensitivities } = result.outputs.q;
    // Laminar mean: h ∝ (u/L)^½, q = h L W ΔT ∝ u^½ L^½ W ΔT: elasticities ½, ½, 1 (the properties do not depend on u, L, W).
    expect(sensitivities.u_inf.elasticity).toBeCloseTo(0.5, 6);
    expect(sensitivities.L.elasticity).toBeCloseTo(0.5, 6);
    expect(sensitivities.W.elasticity).toBeCloseTo(1, 9);
    // ∂q/∂u_inf in W per m/s equals the elasticity × q/u.
    expect(sensitivities.u_inf.derivative).toBeCloseTo((0.5 * result.outputs.q.value) / 4, 6);
    // Higher pressure: ν ∝ 1/p, so q ∝ p^½ in the laminar mean.
    expect(sensitivities.p.elasticity).toBeCloseTo(0.5, 6);
  });
});
