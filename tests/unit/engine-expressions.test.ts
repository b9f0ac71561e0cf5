import { describe, expect, it } from 'vitest';
import { checkExpression, ExpressionError, FUNCTION_IMPLS, toJs, toTex } from '@/lib/engine/expressions';
import { compileDefinition } from '@/lib/engine/compile';
import type { Definition } from '@/lib/engine/types';

const declared = new Set(['Re_D', 'Pr', 'x', 'y']);
const refused = (src: string) => {
  try {
    checkExpression(src, declared);
  } catch (err) {
    expect(err).toBeInstanceOf(ExpressionError);
    return (err as Error).message;
  }
  throw new Error(`expected "${src}" to be refused`);
};

/** A balanced sum with 2^levels leaves: many terms, shallow nesting. */
const balanced = (levels: number): string => (levels === 0 ? 'x' : `(${balanced(levels - 1)}+${balanced(levels - 1)})`);

// Each entry: a hostile or malformed expression and a word its refusal message must contain.
const HOSTILE: [string, RegExp][] = [
  ['x = 1', /assignment/], ['Re_D = Pr', /assignment/], ['f(x) = x^2', /defining functions/], ['g(a, b) = a', /defining functions/],
  ['x.constructor', /property access/], ['x["constructor"]', /property access|index/], ['x.toString()', /property access|not allowed/],
  ['[1, 2, 3]', /matrices/], ['[x]', /matrices/], ['{a: 1}', /objects/], ['1:3', /ranges/], ['x; y', /statements/],
  ['x\ny', /statements/], ['"abc"', /finite numbers/], ['\'abc\'', /finite numbers/], ['true', /finite numbers/],
  ['false', /finite numbers/], ['null', /finite numbers|unknown symbol/], ['import({}, {})', /not allowed/],
  ['evaluate("1+1")', /not allowed/], ['parse("x")', /not allowed/], ['createUnit("foo")', /not allowed/],
  ['compile("x")', /not allowed/], ['simplify("x")', /not allowed/], ['derivative("x", "x")', /not allowed/],
  ['reviver("x")', /not allowed/], ['cos.constructor("return process")()', /not allowed|property access|cannot be read/],
  ['eval("1")', /not allowed/], ['Function("return 1")()', /not allowed|cannot be read/], ['require("fs")', /not allowed/],
  ['process', /unknown symbol/], ['globalThis', /unknown symbol/], ['constructor', /unknown symbol/], ['__proto__', /unknown symbol/],
  ['undeclared + 1', /unknown symbol "undeclared"/], ['Re_L * Pr', /unknown symbol "Re_L"/], ['2 x', /explicitly with \*/],
  ['2x', /explicitly with \*/], ['x y', /explicitly with \*/], ['x\'', /operator/], ['5!', /operator/], ['x % 2', /operator/],
  ['x mod 2', /operator/], ['x to cm', /operator|unknown symbol/], ['x & y', /operator/], ['x | y', /operator/], ['x << 2', /operator/],
  ['x ?? y', /operator|cannot be read/], ['1 < x < 2', /chained comparisons/], ['sqrt', /is a function/], ['unknownFn(x)', /not allowed/],
  ['sqrt(x, y)', /takes 1/], ['max(x)', /takes 2 to 10/], ['pow(x)', /takes 2/], ['i', /unknown symbol/], ['Infinity', /finite numbers/],
  ['NaN', /finite numbers/], ['1e400', /finite numbers/], ['', /empty/], ['   ', /empty/], ['(((x)', /cannot be read/], ['x +', /cannot be read/],
  ['x'.padEnd(2100, ' '), /too long/], [`${'('.repeat(60)}x${')'.repeat(60)}`, /nested too deeply/],
  [balanced(8), /too large/], [Array.from({ length: 60 }, () => 'x').join('+'), /nested too deeply/], ['x ? y', /cannot be read/], ['@x', /cannot be read/],
];

describe('safe expression language', () => {
  it(`refuses ${HOSTILE.length} kinds of hostile or malformed expressions with a clear message`, () => {
    expect(HOSTILE.length).toBeGreaterThanOrEqual(50);
    for (const [src, pattern] of HOSTILE) expect(refused(src), src.slice(0, 40)).toMatch(pattern);
  });

  it('accepts the trade\'s formulas and names the symbols they read', () => {
    const ok = checkExpression('0.3 + 0.62*Re_D^0.5*Pr^(1/3)/(1 + (0.4/Pr)^(2/3))^(1/4)*(1 + (Re_D/282000)^(5/8))^(4/5)', declared);
    expect(ok.symbols.sort()).toEqual(['Pr', 'Re_D']);
    expect(checkExpression('Re_D < 2300 ? 64/Re_D : 0.316*Re_D^-0.25', declared).symbols).toEqual(['Re_D']);
    expect(checkExpression('x > 0 and y > 0 ? max(x, y) : -abs(x) + pi + e', declared).symbols.sort()).toEqual(['x', 'y']);
  });

  it('generates code that reads only slots and whitelisted functions', () => {
    const slots = new Map([['Re_D', 0], ['Pr', 1], ['x', 2], ['y', 3]]);
    const js = toJs(checkExpression('sqrt(Re_D) * Pr^(1/3) + log10(x) - exp(-y)', declared).node, slots);
    const calls = [...js.matchAll(/F\.(\w+)\(/g)].map((m) => m[1]);
    expect(calls.every((name) => Object.hasOwn(FUNCTION_IMPLS, name))).toBe(true);
    expect(js.replace(/v\[\d+\]|F\.\w+\(|[\d.()+\-*/,\s]/g, '')).toBe('');
  });

  it('writes constant square and cube roots as sqrt and cbrt without changing what a negative base means', () => {
    const def = (expression: string): Definition => ({
      schemaVersion: 1, title: 'Roots', summary: 'constant roots', category: 'friction', situation: 'roots',
      inputs: [{ symbol: 'x', name: 'x', unit: '1' }], outputs: [{ symbol: 'y', name: 'y', unit: '1', expression }],
      references: [{ citation: 'IEEE 754-2019, sqrt and rootn' }],
    });
    const y = (expression: string, x: number) => compileDefinition(def(expression)).runMany(Float64Array.of(x), 1);
    for (const x of [1e-300, 2, 3.7, 1e5, 8e150]) {
      // IEEE 754 sqrt and cbrt are correctly rounded (common practice); Math.pow is within an ulp or so of the same root.
      expect(y('x^(1/2)', x).outputs[0]).toBe(Math.sqrt(x));
      expect(y('x^0.5', x).outputs[0]).toBe(Math.sqrt(x));
      expect(y('x^(1/3)', x).outputs[0]).toBe(Math.cbrt(x));
      // Math.pow(x, 1/3) takes the double nearest a third, 1/3 − 1.85e-17, so it differs from the root by
      // 1.85e-17·|ln x| relative, plus rounding.
      expect(Math.abs(y('x^(1/3)', x).outputs[0] / Math.pow(x, 1 / 3) - 1)).toBeLessThan(1.9e-17 * Math.abs(Math.log(x)) + 5e-16);
      expect(y('x^2', x).outputs[0]).toBe(x * x);
    }
    // A negative base under 1/3 stays outside the real numbers the engine answers in, as Math.pow has it.
    const negative = y('x^(1/3)', -8);
    expect(negative.errors.get(0)?.code).toBe('not-finite');
    expect(y('x^(1/2)', -4).errors.get(0)?.code).toBe('not-finite');
  });

  it('typesets the trade\'s symbols for KaTeX', () => {
    const tex = toTex(checkExpression('0.664*Re_D^(1/2)*Pr^(1/3)', declared).node);
    expect(tex).toContain('\\mathrm{Re}_{\\mathrm{D}}');
    expect(tex).toContain('\\mathrm{Pr}');
  });

  it('survives a fuzz of random expressions: every outcome is a result or an ExpressionError, quickly', () => {
    // A small deterministic generator (mulberry32) so a failure can be replayed.
    let seed = 0x5eed;
    const rand = () => { seed |= 0; seed = (seed + 0x6d2b79f5) | 0; let t = Math.imul(seed ^ (seed >>> 15), 1 | seed); t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t; return ((t ^ (t >>> 14)) >>> 0) / 4294967296; };
    const atoms = ['x', 'y', 'Re_D', 'Pr', '2', '0.5', '1e3', 'pi', 'zz', '"s"', '[1]', 'sqrt', 'log(', ')', '(', '+', '-', '*', '/', '^', '?', ':', '=', '.', ',', '<', '>=', ' and ', ' or ', 'not ', 'max(', 'evaluate(', 'a.b', ';', '!', '\'', '{', '}', '%'];
    let accepted = 0;
    for (let i = 0; i < 4000; i++) {
      const n = 1 + Math.floor(rand() * 14);
      const src = Array.from({ length: n }, () => atoms[Math.floor(rand() * atoms.length)]).join('');
      try {
        const checked = checkExpression(src, declared);
        const def: Definition = {
          schemaVersion: 1, title: 'Fuzz', summary: 'fuzzed expression', category: 'friction', situation: 'fuzz',
          inputs: ['x', 'y', 'Re_D', 'Pr'].map((s) => ({ symbol: s, name: s, unit: '1' })),
          outputs: [{ symbol: 'out', name: 'out', unit: '1', expression: src }], references: [{ citation: 'fuzz test' }],
        };
        const c = compileDefinition(def);
        // The one-row path and the table path are generated separately: they must agree on every outcome.
        const many = c.runMany(Float64Array.of(0.3, 2, 1e4, 0.7), 1);
        try {
          const one = c.run([0.3, 2, 1e4, 0.7]);
          expect(Object.is(one.outputs.out, many.outputs[0])).toBe(true);
          expect(many.warnings.get(0) ?? []).toEqual(one.warnings);
        } catch (err) {
          expect((err as Error).name).toBe('EvaluationError');
          expect(many.errors.get(0)?.code).toBe((err as { code: string }).code);
        }
        expect(checked.symbols.every((s) => declared.has(s))).toBe(true);
        accepted++;
      } catch (err) {
        expect(['ExpressionError', 'DefinitionError']).toContain((err as Error).name);
      }
    }
    // A hang would trip vitest's per-test timeout; no speed target is asserted here (see npm run bench).
    expect(accepted).toBeGreaterThan(50);
  });
});
