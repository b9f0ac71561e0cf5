import { describe, expect, it } from 'vitest';
import { readLibrary, readTemplates, seededVersion } from '@/lib/governance/library';
import { compiled, contentHash, EvaluationError, type Definition } from '@/lib/engine';
import { compileChain, type Resolve } from '@/lib/engine/chain';
import { validateTemplate } from '@/lib/engine/validate';
import { DefinitionError } from '@/lib/engine/analyse';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import { CALCULATIONS } from '@/validation/reference/calculations';

const library = readLibrary();
/** Resolves pins against the standard library files, as the seeder freezes them (version 1, or 2 for generated tables). */
const resolve: Resolve = (pin) => {
  const e = seededVersion(pin.slug, pin.version, library);
  if (!e) return { problem: 'no such version' };
  if (contentHash(e.definition, e.checkCases) !== pin.contentHash) return { problem: 'content hash does not match' };
  return compiled(e.definition as unknown as Definition);
};
const templates = readTemplates();
const flat = templates.find((t) => t.slug === 'flat-plate-forced-convection-air')!;
const flatDef = () => structuredClone(flat.definition) as unknown as TemplateDefinition;

describe('calculation chains', () => {
  it('validates every seeded template: schema, pins, bindings, dimensions and its check cases', () => {
    for (const t of templates) {
      const report = validateTemplate(t.definition, t.checkCases, resolve);
      expect(report.passed, `${t.slug}: ${JSON.stringify(report.stages.flatMap((s) => s.issues)).slice(0, 500)}`).toBe(true);
      expect(report.summary.checkCases).toBeGreaterThanOrEqual(4);
    }
  });

  it('keeps every template check case equal to the hand calculation it names, recomputed now', () => {
    let checked = 0;
    for (const t of templates) {
      for (const c of t.checkCases as { inputs: Record<string, number>; expected: Record<string, number>; source: { locator?: string } }[]) {
        const key = /calculations\.ts#(\w+)/.exec(c.source.locator ?? '')?.[1];
        expect(key, `${t.slug}: names its hand calculation`).toBeDefined();
        const hand = CALCULATIONS[key!](c.inputs);
        for (const [s, v] of Object.entries(c.expected)) { expect(Math.abs(hand[s] / v - 1), `${t.slug} ${s}`).toBeLessThan(1e-9); checked++; }
      }
    }
    expect(checked).toBeGreaterThan(80);
  });

  it('converts units at each binding and records every step, with the regime rule', () => {
    const chain = compileChain(flatDef(), resolve);
    // °C and kPa at the boundary, as an engineer types them (conversion by mathjs's SI definitions).
    const values = chain.readInputs({ T_inf: { value: 20, unit: 'degC' }, T_s: { value: 60, unit: 'degC' }, p: { value: 95, unit: 'kPa' }, u_inf: 3, L: { value: 500, unit: 'mm' }, W: 0.3 }, 'inputs');
    const r = chain.runDetailed(values);
    const hand = CALCULATIONS.flatPlateAir({ T_inf: 293.15, T_s: 333.15, p: 95000, u_inf: 3, L: 0.5, W: 0.3 });
    for (const s of ['T_f', 'Re_L', 'Nu_L', 'h', 'q', 'delta_L']) expect(r.outputs[s] / hand[s] - 1, s).toBeLessThan(1e-12);
    expect(r.steps.map((s) => s.key)).toEqual(['film-temperature', 'air-properties', 'pressure-correction', 'reynolds', 'nusselt-laminar', 'heat', 'thickness-laminar']);
    const nusselt = r.steps.find((s) => s.key === 'nusselt-laminar')!;
    expect(nusselt.choice).toMatchObject({ key: 'nusselt', picked: 'laminar', options: ['laminar', 'mixed'] });
    expect(nusselt.correlation?.slug).toBe('flat-plate-laminar-average');
    expect(nusselt.inputs).toEqual({ Re_L: r.outputs.Re_L, Pr: r.outputs.Pr });
    expect(r.warnings).toEqual([]);
  });

  it('reports a range warning at the step where it arises, and picks the mixed layer past transition', () => {
    const chain = compileChain(flatDef(), resolve);
    const hot = chain.runDetailed(chain.readInputs({ T_inf: 1300, T_s: 1800, p: 101325, u_inf: 5, L: 0.3, W: 0.3 }, 'inputs'));
    expect(hot.warnings.map((w) => [w.step, w.symbol])).toEqual([['air-properties', 'T']]);
    expect(hot.steps.find((s) => s.key === 'air-properties')!.warnings[0].message).toMatch(/T = 1550 is above the maximum 1500 of the published validity range/);
    const fast = chain.runDetailed(chain.readInputs({ T_inf: 300, T_s: 400, p: 101000, u_inf: 12, L: 1.2, W: 0.5 }, 'inputs'));
    expect(fast.steps.map((s) => s.key)).toContain('nusselt-mixed');
    expect(fast.steps.map((s) => s.key)).toContain('thickness-turbulent-scale');
  });

  it('runs many rows with the same numbers as single runs, and reports refused rows by row', () => {
    const chain = compileChain(flatDef(), resolve);
    const rows = [[293.15, 333.15, 95000, 3, 0.5, 0.3], [300, 400, 101000, 12, 1.2, 0.5], [300, 400, 101000, -1, 1.2, 0.5]];
    const out = chain.runMany(Float64Array.from(rows.flat()), rows.length);
    const n = chain.outputSymbols.length;
    rows.slice(0, 2).forEach((row, i) => {
      const single = chain.runDetailed(row);
      chain.outputSymbols.forEach((s, j) => expect(out.outputs[i * n + j]).toBe(single.outputs[s]));
    });
    expect(out.errors.get(2)).toBeInstanceOf(EvaluationError);
    expect(out.errors.get(2)!.code).toBe('refused');
    expect([...out.picks[0]]).toEqual([0, 1, 0]);
  });

  it('refuses a chain whose bindings, symbols or options do not fit, naming each place', () => {
    const issuesOf = (mutate: (d: TemplateDefinition) => void) => {
      const d = flatDef();
      mutate(d);
      try { compileChain(d, resolve); return []; } catch (err) { if (err instanceof DefinitionError) return err.issues; throw err; }
    };
    const dim = issuesOf((d) => { (d.steps[1] as { inputs: Record<string, string> }).inputs.T = 'p'; });
    expect(dim[0]).toMatchObject({ stage: 'dimensions', pointer: '/steps/1/inputs/T' });
    expect(dim[0].message).toMatch(/p is in Pa but air-properties-1atm takes T in K/);
    const later = issuesOf((d) => { (d.steps[3] as { outputs: { expression: string }[] }).outputs[0].expression = 'u_inf * L / nu * h'; });
    expect(later[0].message).toMatch(/"h" is not declared before this step/);
    const pin = issuesOf((d) => { (d.steps[1] as { use: { contentHash: string } }).use.contentHash = 'f'.repeat(64); });
    expect(pin[0]).toMatchObject({ stage: 'symbols', pointer: '/steps/1/use' });
    const local = issuesOf((d) => { d.outputs.push({ symbol: 'delta_over_L', name: 'local to an option' }); });
    expect(local[0].message).toMatch(/visible after it only if the choice gives it/);
    const otherwise = issuesOf((d) => { delete (d.steps[4] as { options: { when?: string }[] }).options[0].when; });
    expect(otherwise.some((i) => /needs a condition/.test(i.message))).toBe(true);
    const units = issuesOf((d) => { (d.steps[5] as { outputs: { unit: string }[] }).outputs[1].unit = 'W/m^2'; });
    expect(units[0]).toMatchObject({ stage: 'dimensions', pointer: '/steps/5/outputs/1/expression' });
  });

  it('refuses expressions outside the safe language inside a chain', () => {
    const d = flatDef();
    (d.steps[3] as { outputs: { expression: string }[] }).outputs[0].expression = 'constructor.constructor("return 1")()';
    expect(() => compileChain(d, resolve)).toThrow(DefinitionError);
  });
});
