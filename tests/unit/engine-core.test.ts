import { describe, expect, it } from 'vitest';
import {
  compileDefinition, compareDefinitions, contentHash, canonicalJson, validateVersion, convert, brent, interpolate,
  EvaluationError, InputError, DefinitionError, type Definition,
} from '@/lib/engine';
import { boundsOf } from '@/lib/engine/ranges';
import { blasius, pohlhausenNusseltCoefficient } from '@/validation/reference/similarity';

const base = (over: Partial<Definition>): Definition => ({
  schemaVersion: 1, title: 'Test correlation', summary: 'A definition built for a test', category: 'external-flow',
  situation: 'flat plate', inputs: [], outputs: [], references: [{ citation: 'test definition' }], ...over,
});

const laminarLocal = base({
  inputs: [{ symbol: 'Re_x', name: 'local Reynolds number', unit: '1' }, { symbol: 'Pr', name: 'Prandtl number', unit: '1' }],
  outputs: [{ symbol: 'Nu_x', name: 'local Nusselt number', unit: '1', expression: '0.332*Re_x^(1/2)*Pr^(1/3)' }],
  validity: [{ symbol: 'Re_x', max: 5e5, note: 'laminar boundary layer' }, { symbol: 'Pr', min: 0.6 }],
});

const colebrook = base({
  category: 'friction', situation: 'pipe flow',
  inputs: [{ symbol: 'Re_D', name: 'Reynolds number', unit: '1' }, { symbol: 'eps_D', name: 'relative roughness', unit: '1' }],
  steps: [{ kind: 'solve', symbol: 'f_D', name: 'Darcy friction factor', unit: '1', residual: '1/sqrt(f_D) + 2*log10(eps_D/3.7 + 2.51/(Re_D*sqrt(f_D)))', bracket: [0.002, 0.2] }],
  outputs: [{ symbol: 'f', name: 'Darcy friction factor', unit: '1', expression: 'f_D' }],
  validity: [{ symbol: 'Re_D', min: 4000, max: 1e8 }, { symbol: 'eps_D', min: 0, max: 0.05 }],
});

describe('engine against outside references', () => {
  it('Blasius similarity solution solved here gives f\'\'(0) = 0.33206 (Howarth 1938, Proc. R. Soc. A 164, 547)', () => {
    const b = blasius();
    expect(b.fpp0).toBeCloseTo(0.33206, 5);
    // Published constants: η99 ≈ 4.91, displacement 1.7208, momentum 0.664 (Schlichting, Boundary-Layer Theory, ch. 7).
    expect(b.eta99).toBeCloseTo(4.91, 2);
    expect(b.displacement).toBeCloseTo(1.7208, 3);
    expect(b.momentum / b.fpp0).toBeCloseTo(2, 6); // momentum constant = 2 f''(0), an exact identity
  });

  it('the laminar local Nusselt coefficient 0.332 Pr^(1/3) matches Pohlhausen\'s solution computed here within 2 % for 0.6 ≤ Pr ≤ 50', () => {
    const c = compileDefinition(laminarLocal);
    for (const pr of [0.6, 0.7, 1, 2, 5, 10, 50]) {
      const exact = pohlhausenNusseltCoefficient(pr) * Math.sqrt(1e5);
      const engine = c.evaluate({ Re_x: 1e5, Pr: pr }).outputs.Nu_x;
      // 0.332 Pr^1/3 is itself a fit to the similarity solution, good to about ±2 % for Pr ≥ 0.6 (common
      // practice); the gap grows towards the large-Pr limit 0.339 Pr^1/3 (Lévêque), hence 2 % here.
      expect(Math.abs(engine / exact - 1)).toBeLessThan(0.02);
    }
    // At Pr = 1 the two coincide up to rounding of f''(0) to 0.332 (0.02 %).
    expect(c.evaluate({ Re_x: 1e5, Pr: 1 }).outputs.Nu_x / (blasius().fpp0 * Math.sqrt(1e5))).toBeCloseTo(1, 3);
  });

  it('Colebrook through the engine\'s Brent solve equals Colebrook solved independently by fixed-point iteration', () => {
    const c = compileDefinition(colebrook);
    const fixedPoint = (re: number, eps: number) => {
      let x = 8; // x = 1/sqrt(f)
      for (let i = 0; i < 200; i++) x = -2 * Math.log10(eps / 3.7 + (2.51 * x) / re);
      return 1 / (x * x);
    };
    for (const [re, eps] of [[4e3, 0], [1e5, 0], [1e6, 1e-4], [1e7, 1e-3], [5e4, 0.05], [1e8, 1e-6]]) {
      const f = c.evaluate({ Re_D: re, eps_D: eps }).outputs.f;
      expect(Math.abs(f / fixedPoint(re, eps) - 1)).toBeLessThan(1e-10);
    }
    // Moody-chart reading for a smooth pipe at Re = 1e5: f ≈ 0.018 (common practice).
    expect(c.evaluate({ Re_D: 1e5, eps_D: 0 }).outputs.f).toBeCloseTo(0.018, 3);
  });

  it('converts units as the SI definitions say (BIPM SI Brochure, 9th ed.; NIST SP 811)', () => {
    expect(convert(40, 'degC', 'K')).toBeCloseTo(313.15, 10); // T/K = t/°C + 273.15 exactly
    expect(convert(212, 'degF', 'K')).toBeCloseTo(373.15, 10); // boiling point of water at 1 atm on both scales
    expect(convert(1, 'inch', 'm')).toBe(0.0254); // the international inch, exact
    expect(convert(1, 'atm', 'Pa')).toBe(101325); // standard atmosphere, exact
    expect(convert(1, 'bar', 'Pa')).toBe(1e5);
    expect(convert(1, 'mPa s', 'Pa s')).toBeCloseTo(1e-3, 15);
    expect(() => convert(1, 'm', 'K')).toThrow(/different dimensions/);
  });
});

describe('evaluation', () => {
  it('computes and warns outside the range, naming symbol, value and limit', () => {
    const r = compileDefinition(laminarLocal).evaluate({ Re_x: 1e6, Pr: 0.7 });
    expect(r.outputs.Nu_x).toBeCloseTo(0.332 * 1000 * Math.cbrt(0.7), 9);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatchObject({ symbol: 'Re_x', value: 1e6, max: 5e5 });
    expect(r.warnings[0].message).toMatch(/Re_x = 1e\+6 is above the maximum 5e\+5/);
  });

  it('refuses, with no result, where a limit is marked hard', () => {
    const hard = { ...laminarLocal, validity: [{ symbol: 'Pr', min: 0.6, action: 'refuse' as const }] };
    expect(() => compileDefinition(hard).evaluate({ Re_x: 1e4, Pr: 0.01 })).toThrow(EvaluationError);
    expect(() => compileDefinition(hard).evaluate({ Re_x: 1e4, Pr: 0.01 })).toThrow(/marked hard/);
  });

  it('accepts { value, unit } inputs and refuses incompatible units, missing, unknown and non-finite inputs by field', () => {
    const sutherland = base({
      category: 'properties', situation: 'air properties',
      inputs: [{ symbol: 'T', name: 'temperature', unit: 'K' }],
      constants: [{ symbol: 'mu_0', name: 'reference viscosity', value: 1.716e-5, unit: 'Pa s' }, { symbol: 'T_0', name: 'reference temperature', value: 273.15, unit: 'K' }, { symbol: 'S', name: 'Sutherland constant', value: 110.4, unit: 'K' }],
      outputs: [{ symbol: 'mu', name: 'dynamic viscosity', unit: 'Pa s', expression: 'mu_0*(T/T_0)^(3/2)*(T_0 + S)/(T + S)' }],
    });
    const c = compileDefinition(sutherland);
    expect(c.evaluate({ T: { value: 0, unit: 'degC' } }).outputs.mu).toBeCloseTo(1.716e-5, 15);
    const issues = (inputs: Record<string, unknown>) => { try { c.evaluate(inputs); } catch (e) { return (e as InputError).issues; } return []; };
    expect(issues({ T: { value: 3, unit: 'm' } })[0]).toMatchObject({ path: 'inputs.T.unit' });
    expect(issues({})[0]).toEqual({ path: 'inputs.T', message: 'is missing' });
    expect(issues({ T: 300, P: 1 })[0].path).toBe('inputs.P');
    expect(issues({ T: Number.NaN })[0].message).toMatch(/finite/);
    expect(issues({ T: '300' })[0].message).toMatch(/must be a number/);
  });

  it('interpolates tables linearly and warns outside them', () => {
    const table = base({
      category: 'properties', situation: 'air properties',
      inputs: [{ symbol: 'T', name: 'temperature', unit: 'K' }],
      tables: [{ name: 'air', source: 'test table', key: 'T', columns: [{ name: 'T', unit: 'K', values: [300, 400, 500] }, { name: 'k', unit: 'W/(m K)', values: [0.0263, 0.0338, 0.0407] }] }],
      steps: [{ kind: 'table', symbol: 'k_t', name: 'conductivity', unit: 'W/(m K)', table: 'air', column: 'k', at: 'T' }],
      outputs: [{ symbol: 'k', name: 'conductivity', unit: 'W/(m K)', expression: 'k_t' }],
    });
    const c = compileDefinition(table);
    expect(c.evaluate({ T: 350 }).outputs.k).toBeCloseTo((0.0263 + 0.0338) / 2, 15);
    const out = c.evaluate({ T: 600 });
    expect(out.warnings[0].message).toMatch(/outside the tabulated range/);
    expect(interpolate([1, 2, 4], [10, 20, 40], 3)).toBe(30);
  });

  it('Brent finds a root to 1e-12 relative and says so when the bracket holds none', () => {
    expect(Math.abs(brent((x) => x ** 3 - 2, 0, 2) / Math.cbrt(2) - 1)).toBeLessThan(1e-12);
    expect(() => brent((x) => x * x + 1, -1, 1)).toThrow(/holds no root/);
    const c = compileDefinition({ ...colebrook, steps: [{ ...colebrook.steps![0], bracket: [0.5, 1] } as never] });
    expect(() => c.evaluate({ Re_D: 1e5, eps_D: 0 })).toThrow(/solving for f_D: the bracket \[0.5, 1\] holds no root/);
  });
});

describe('validation report', () => {
  const cases = [
    { label: 'low', inputs: { Re_x: 1e2, Pr: 0.7 }, expected: { Nu_x: 0.332 * 10 * Math.cbrt(0.7) }, tolerance: { rel: 1e-9 }, source: { kind: 'common-practice', citation: 'arithmetic' } },
  ];

  it('catches a deliberately wrong unit with the dimension it found', () => {
    const wrong = base({
      inputs: [{ symbol: 'Nu', name: 'Nusselt number', unit: '1' }, { symbol: 'k', name: 'conductivity', unit: 'W/(m K)' }, { symbol: 'L', name: 'length', unit: 'm' }],
      outputs: [{ symbol: 'h', name: 'heat transfer coefficient', unit: 'W/m^2', expression: 'Nu*k/L' }],
    });
    const report = validateVersion(wrong, []);
    const dims = report.stages.find((s) => s.stage === 'dimensions')!;
    expect(dims.passed).toBe(false);
    expect(dims.issues[0].message).toBe('h has dimension kg / (s^3 K) but is declared W/m^2');
    expect(dims.issues[0].pointer).toBe('/outputs/0/expression');
    expect(report.passed).toBe(false);
  });

  it('flags a suite whose in-range cases all sit in one corner', () => {
    const bounded = { ...laminarLocal, validity: [{ symbol: 'Re_x', min: 10, max: 5e5 }, { symbol: 'Pr', min: 0.6, max: 50 }] };
    const report = validateVersion(bounded, cases);
    expect(report.passed).toBe(true);
    expect(report.coverage.oneCorner).toBe(true);
    expect(report.stages.find((s) => s.stage === 'coverage')!.passed).toBe(false);
    const spread = [...cases, { ...cases[0], label: 'high', inputs: { Re_x: 3e5, Pr: 30 }, expected: { Nu_x: 0.332 * Math.sqrt(3e5) * Math.cbrt(30) } }];
    expect(validateVersion(bounded, spread).coverage.oneCorner).toBe(false);
  });

  it('reads several rules on one symbol as the box where none warns (a published range and a narrower checked one)', () => {
    const twoRules = { ...laminarLocal, validity: [{ symbol: 'Pr', min: 0.6, max: 50 }, { symbol: 'Pr', max: 5, note: 'checked only up to 5' }, { symbol: 'Re_x', min: 10, max: 5e5 }] };
    expect(boundsOf(twoRules, 'Pr')).toEqual({ min: 0.6, max: 5 });
    const pr = validateVersion(twoRules, cases).coverage.entries.find((e) => e.symbol === 'Pr')!;
    expect([pr.min, pr.max]).toEqual([0.6, 5]);
    // Pr = 30 is inside the published range but beyond the checked one: the rule warns.
    const r = compileDefinition(twoRules).evaluate({ Re_x: 1e4, Pr: 30 });
    expect(r.warnings.map((w) => w.symbol)).toEqual(['Pr']);
  });

  it('fails a check case outside its tolerance and one whose expected warning does not come', () => {
    const report = validateVersion(laminarLocal, [
      { ...cases[0], expected: { Nu_x: 3 } },
      { ...cases[0], label: 'meant out of range', expectWarnings: ['Re_x'] },
    ]);
    expect(report.passed).toBe(false);
    expect(report.cases[0].problems[0]).toMatch(/differs from expected 3/);
    expect(report.cases[1].problems[0]).toMatch(/expected range warnings for \[Re_x\] but got \[none\]/);
  });

  it('lists every schema problem by JSON pointer in plain words', () => {
    const report = validateVersion({ schemaVersion: 1, title: 'x', category: 'heat', inputs: [{ symbol: '1bad', name: 'n', unit: '1' }], outputs: [], references: [], extra: 1 }, []);
    const issues = report.stages[0].issues.map((i) => `${i.pointer} ${i.message}`);
    expect(issues).toEqual(expect.arrayContaining([
      '/ "summary" is required here', '/ "extra" is not a field of this object (check the spelling)', '/title must have at least 3 characters',
      '/inputs/0/symbol must be an identifier: a letter, then letters, digits or _ (at most 32 characters), e.g. Re_D', '/outputs needs at least 1 item',
    ]));
    expect(issues.some((i) => i.startsWith('/category must be one of'))).toBe(true);
  });

  it('names a step that uses a symbol defined later, and a duplicate symbol', () => {
    expect(() => compileDefinition(base({
      inputs: [{ symbol: 'a', name: 'a', unit: '1' }],
      steps: [{ kind: 'expression', symbol: 'b', name: 'b', unit: '1', expression: 'c*2' }, { kind: 'expression', symbol: 'c', name: 'c', unit: '1', expression: 'a' }],
      outputs: [{ symbol: 'a', name: 'dup', unit: '1', expression: 'b' }],
    }))).toThrow(DefinitionError);
  });
});

describe('content hash and comparison', () => {
  it('hashes canonical JSON: key order and 1 vs 1.0 do not matter, content does', () => {
    expect(canonicalJson({ b: 1, a: [1.0, { d: -0, c: 'x' }] })).toBe('{"a":[1,{"c":"x","d":0}],"b":1}');
    const h1 = contentHash(laminarLocal, cases());
    const h2 = contentHash(JSON.parse(JSON.stringify(laminarLocal)), cases());
    expect(h1).toBe(h2);
    expect(h1).toMatch(/^[0-9a-f]{64}$/);
    expect(contentHash({ ...laminarLocal, notes: 'changed' }, cases())).not.toBe(h1);
    function cases() { return [{ label: 'a', inputs: { Re_x: 1 } }]; }
  });

  it('finds the largest relative difference between two versions and where it is', () => {
    const v2 = { ...laminarLocal, outputs: [{ ...laminarLocal.outputs[0], expression: '0.332*Re_x^(1/2)*Pr^(1/3)*(1 + Re_x/5e6)' }] };
    const cmp = compareDefinitions({ items: [{ label: 'v1', definition: laminarLocal }, { label: 'v2', definition: v2 }], sweep: 'Re_x', output: 'Nu_x', fixed: { Pr: 0.7 }, from: 1e3, to: 5e5, points: 50 });
    expect(cmp.scale).toBe('log');
    expect(cmp.largest[0].at).toBeCloseTo(5e5, 6);
    expect(cmp.largest[0].relDiff).toBeCloseTo(0.1, 12);
    expect(cmp.differences[0]).toMatchObject({ kind: 'varies' });
    // Exact: (1 + Re/5e6) − 1 runs from 2e-4 at Re = 1e3 to 0.1 at 5e5.
    expect(cmp.differences[0].min).toBeCloseTo(2e-4, 12);
    expect(cmp.differences[0].max).toBeCloseTo(0.1, 12);
  });

  it('says a changed leading coefficient is a uniform difference, and an identical version none', () => {
    // 0.332 → 0.3323: exactly (0.3323/0.332 − 1) everywhere, whatever the rounding of each evaluation.
    const scaled = { ...laminarLocal, outputs: [{ ...laminarLocal.outputs[0], expression: '0.3323*Re_x^(1/2)*Pr^(1/3)' }] };
    const same = { ...laminarLocal, outputs: [{ ...laminarLocal.outputs[0], expression: 'Re_x^(1/2)*Pr^(1/3)*0.332' }] };
    const cmp = compareDefinitions({ items: [{ label: 'v1', definition: laminarLocal }, { label: 'v2', definition: scaled }, { label: 'v3', definition: same }], sweep: 'Re_x', output: 'Nu_x', fixed: { Pr: 0.7 }, from: 1e3, to: 5e5, points: 60 });
    expect(cmp.differences[0].kind).toBe('uniform');
    expect(cmp.differences[0].value).toBeCloseTo(0.3323 / 0.332 - 1, 12);
    expect(cmp.differences[1]).toMatchObject({ kind: 'none', points: 60 });
  });

  it('compares only where both curves are inside their validity ranges', () => {
    // v2 differs by 10 % but only above Re 4e5, where v1 (valid to 5e5) and v2 (valid to 4e5) are not both valid.
    const v2 = { ...laminarLocal, outputs: [{ ...laminarLocal.outputs[0], expression: 'Re_x > 4e5 ? 1.1*0.332*Re_x^(1/2)*Pr^(1/3) : 0.332*Re_x^(1/2)*Pr^(1/3)' }], validity: [{ symbol: 'Re_x', max: 4e5 }, { symbol: 'Pr', min: 0.6 }] };
    const cmp = compareDefinitions({ items: [{ label: 'v1', definition: laminarLocal }, { label: 'v2', definition: v2 }], sweep: 'Re_x', output: 'Nu_x', fixed: { Pr: 0.7 }, from: 1e3, to: 5e5, points: 40 });
    expect(cmp.largest[0].relDiff).toBe(0);
    expect(cmp.differences[0].kind).toBe('none');
    expect(cmp.differences[0].points).toBeLessThan(40);
  });
});
