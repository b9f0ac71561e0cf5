import { parse, type MathNode } from 'mathjs';
import { besseli, besselk } from 'bessel';
import { symbolTex } from './tex-symbols';

export { symbolTex };

/**
 * The safe expression language: mathjs's parser, then a whitelist walk. Only numbers, declared
 * symbols, + - * / ^, unary minus, parentheses, comparisons, and/or/not, the conditional a ? b : c
 * and the functions below pass. Code is generated from the checked tree alone (numbers, slot
 * indices, names from FUNCTIONS), never from the expression text.
 */

export const MAX_EXPRESSION_LENGTH = 2000;
export const MAX_DEPTH = 40;
export const MAX_NODES = 600;

/** Whitelisted functions → their implementation and allowed argument counts. */
export const FUNCTIONS: Record<string, { impl: (...a: number[]) => number; min: number; max: number; tex?: string }> = {
  sqrt: { impl: Math.sqrt, min: 1, max: 1 },
  cbrt: { impl: Math.cbrt, min: 1, max: 1 },
  exp: { impl: Math.exp, min: 1, max: 1 },
  log: { impl: Math.log, min: 1, max: 1, tex: '\\ln' },
  log10: { impl: Math.log10, min: 1, max: 1, tex: '\\log_{10}' },
  abs: { impl: Math.abs, min: 1, max: 1 },
  min: { impl: Math.min, min: 2, max: 10 },
  max: { impl: Math.max, min: 2, max: 10 },
  pow: { impl: Math.pow, min: 2, max: 2 },
  sin: { impl: Math.sin, min: 1, max: 1 },
  cos: { impl: Math.cos, min: 1, max: 1 },
  tan: { impl: Math.tan, min: 1, max: 1 },
  asin: { impl: Math.asin, min: 1, max: 1 },
  acos: { impl: Math.acos, min: 1, max: 1 },
  atan: { impl: Math.atan, min: 1, max: 1 },
  sinh: { impl: Math.sinh, min: 1, max: 1 },
  cosh: { impl: Math.cosh, min: 1, max: 1 },
  tanh: { impl: Math.tanh, min: 1, max: 1 },
  sign: { impl: Math.sign, min: 1, max: 1 },
  hypot: { impl: Math.hypot, min: 2, max: 4 },
  // Modified Bessel functions of the first and second kind, orders 0 and 1 (fins of varying section,
  // annular fins, conduction in cylinders); polynomial approximations of the `bessel` package,
  // about 1e-7 relative (checked against an ODE solution in validation/reference/fins.test.ts).
  besselI0: { impl: (x) => besseli(x, 0), min: 1, max: 1, tex: 'I_0' },
  besselI1: { impl: (x) => besseli(x, 1), min: 1, max: 1, tex: 'I_1' },
  besselK0: { impl: (x) => (x > 0 ? besselk(x, 0) : NaN), min: 1, max: 1, tex: 'K_0' },
  besselK1: { impl: (x) => (x > 0 ? besselk(x, 1) : NaN), min: 1, max: 1, tex: 'K_1' },
};

/**
 * What generated code may call as F.<name>: the whitelisted functions, plus helpers the code generator alone emits
 * (never reachable from an expression's text, which is checked against FUNCTIONS).
 */
export const FUNCTION_IMPLS: Readonly<Record<string, (...a: number[]) => number>> = Object.freeze({
  ...Object.fromEntries(Object.entries(FUNCTIONS).map(([k, v]) => [k, v.impl])),
  sq: (x: number) => x * x,
  cbrtp: (x: number) => (x > 0 ? Math.cbrt(x) : Math.pow(x, 1 / 3)),
});

/** Named numeric constants usable without declaring them. */
export const BUILTIN_CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

const BINARY: Record<string, { js: string; tex: string; bool?: boolean }> = {
  add: { js: '+', tex: '+' },
  subtract: { js: '-', tex: '-' },
  multiply: { js: '*', tex: '\\cdot' },
  divide: { js: '/', tex: '/' },
  pow: { js: '', tex: '^' },
  larger: { js: '>', tex: '>', bool: true },
  smaller: { js: '<', tex: '<', bool: true },
  largerEq: { js: '>=', tex: '\\ge', bool: true },
  smallerEq: { js: '<=', tex: '\\le', bool: true },
  equal: { js: '===', tex: '=', bool: true },
  unequal: { js: '!==', tex: '\\ne', bool: true },
  and: { js: '&&', tex: '\\land', bool: true },
  or: { js: '||', tex: '\\lor', bool: true },
};

const REFUSED_NODE: Record<string, string> = {
  AssignmentNode: 'assignments (=) are not allowed; use == to compare',
  FunctionAssignmentNode: 'defining functions is not allowed',
  AccessorNode: 'property access (a.b or a[i]) is not allowed',
  IndexNode: 'indexing is not allowed',
  ArrayNode: 'matrices and arrays are not allowed',
  ObjectNode: 'objects are not allowed',
  RangeNode: 'ranges (a:b) are not allowed',
  BlockNode: 'several statements (; or new lines) are not allowed; write one expression',
  RelationalNode: 'chained comparisons (a < b < c) are not allowed; combine two comparisons with "and"',
};

export class ExpressionError extends Error {
  /** Set when the problem is an undeclared symbol: its name. */
  constructor(message: string, readonly unknownSymbol?: string) {
    super(message);
    this.name = 'ExpressionError';
  }
}

interface AnyNode {
  type: string;
  value?: unknown;
  name?: string;
  fn?: unknown;
  op?: string;
  implicit?: boolean;
  args?: AnyNode[];
  content?: AnyNode;
  condition?: AnyNode;
  trueExpr?: AnyNode;
  falseExpr?: AnyNode;
}

export interface CheckedExpression {
  source: string;
  node: MathNode;
  /** Declared symbols the expression reads. */
  symbols: string[];
  /** Size of the checked tree (nodes), the unit of the cost estimate. */
  nodes: number;
}

/**
 * The symbols a formula reads, in the order it first reads them (for a form that offers to declare them), or the
 * formula's problem if it has one other than undeclared symbols (at most 30 symbols are collected).
 */
export function symbolsRead(source: string): { symbols: string[]; error?: string } {
  const found: string[] = [];
  for (let k = 0; k < 30; k++) {
    try {
      checkExpression(source, new Set(found));
      return { symbols: found };
    } catch (err) {
      if (err instanceof ExpressionError && err.unknownSymbol && !found.includes(err.unknownSymbol)) { found.push(err.unknownSymbol); continue; }
      return { symbols: found, error: (err as Error).message };
    }
  }
  return { symbols: found, error: 'the formula reads more than 30 symbols' };
}

/** Parses and whitelists an expression; `declared` is every symbol it may read. */
export function checkExpression(source: string, declared: ReadonlySet<string>): CheckedExpression {
  if (typeof source !== 'string' || !source.trim()) throw new ExpressionError('the expression is empty');
  if (source.length > MAX_EXPRESSION_LENGTH) {
    throw new ExpressionError(`the expression is too long (${source.length} characters; at most ${MAX_EXPRESSION_LENGTH})`);
  }
  let node: MathNode;
  try {
    node = parse(source);
  } catch (err) {
    throw new ExpressionError(`cannot be read: ${(err as Error).message}`);
  }
  const symbols = new Set<string>();
  let count = 0;
  const walk = (n: AnyNode, depth: number): void => {
    if (depth > MAX_DEPTH) throw new ExpressionError(`the expression is nested too deeply (more than ${MAX_DEPTH} levels)`);
    if (++count > MAX_NODES) throw new ExpressionError(`the expression is too large (more than ${MAX_NODES} terms)`);
    switch (n.type) {
      case 'ConstantNode':
        if (typeof n.value !== 'number' || !Number.isFinite(n.value)) {
          throw new ExpressionError(`only finite numbers are allowed as constants, not ${typeof n.value === 'string' ? JSON.stringify(n.value) : String(n.value)}`);
        }
        return;
      case 'SymbolNode': {
        const name = n.name!;
        if (declared.has(name)) { symbols.add(name); return; }
        if (Object.hasOwn(BUILTIN_CONSTANTS, name)) return;
        if (Object.hasOwn(FUNCTIONS, name)) throw new ExpressionError(`"${name}" is a function; call it with parentheses, e.g. ${name}(x)`);
        throw new ExpressionError(`unknown symbol "${name}": declare it as an input, constant or step first`, name);
      }
      case 'ParenthesisNode':
        return walk(n.content!, depth + 1);
      case 'ConditionalNode':
        walk(n.condition!, depth + 1); walk(n.trueExpr!, depth + 1); walk(n.falseExpr!, depth + 1);
        return;
      case 'OperatorNode': {
        const fn = String(n.fn);
        if (n.implicit) throw new ExpressionError(`write multiplication explicitly with * (found implicit multiplication near "${n.args?.map((a) => (a as AnyNode).name ?? '').join(' ').trim() || '…'}")`);
        const allowed = Object.hasOwn(BINARY, fn) || fn === 'unaryMinus' || fn === 'unaryPlus' || fn === 'not';
        if (!allowed) throw new ExpressionError(`the operator "${n.op}" is not allowed`);
        for (const a of n.args ?? []) walk(a, depth + 1);
        return;
      }
      case 'FunctionNode': {
        const fnNode = n.fn as AnyNode;
        const name = fnNode?.type === 'SymbolNode' ? fnNode.name! : '';
        const spec = Object.hasOwn(FUNCTIONS, name) ? FUNCTIONS[name] : undefined;
        if (!name) throw new ExpressionError('calling a computed function (such as a.b()) is not allowed');
        if (!spec) throw new ExpressionError(`the function "${name}" is not allowed; allowed are ${Object.keys(FUNCTIONS).join(', ')}`);
        const argc = n.args?.length ?? 0;
        if (argc < spec.min || argc > spec.max) {
          throw new ExpressionError(`${name}() takes ${spec.min === spec.max ? spec.min : `${spec.min} to ${spec.max}`} argument${spec.max === 1 ? '' : 's'}, not ${argc}`);
        }
        for (const a of n.args ?? []) walk(a, depth + 1);
        return;
      }
      default:
        throw new ExpressionError((Object.hasOwn(REFUSED_NODE, n.type) ? REFUSED_NODE[n.type] : undefined) ?? `${n.type.replace(/Node$/, '').toLowerCase()} expressions are not allowed`);
    }
  };
  walk(node as unknown as AnyNode, 0);
  return { source, node, symbols: [...symbols], nodes: count };
}

function numberLiteral(v: number): string {
  const s = Object.is(v, -0) ? '0' : String(v);
  return v < 0 ? `(${s})` : s;
}

/** The value of a subtree made of numbers and arithmetic only (undefined if it holds a symbol or a call). */
function constantValue(node: AnyNode): number | undefined {
  switch (node.type) {
    case 'ConstantNode': return typeof node.value === 'number' ? node.value : undefined;
    case 'ParenthesisNode': return constantValue(node.content!);
    case 'OperatorNode': {
      const a = node.args!.map(constantValue);
      if (a.some((x) => x === undefined)) return undefined;
      const [x, y] = a as number[];
      switch (String(node.fn)) {
        case 'unaryMinus': return -x;
        case 'unaryPlus': return x;
        case 'add': return x + y;
        case 'subtract': return x - y;
        case 'multiply': return x * y;
        case 'divide': return x / y;
        default: return undefined;
      }
    }
    default: return undefined;
  }
}

/**
 * JavaScript source for a checked tree. `slot(name)` gives the array index of a symbol; the code
 * reads only `v[...]` and `F.<whitelisted name>`.
 */
export function toJs(node: MathNode, slots: ReadonlyMap<string, number>): string {
  const gen = (n: AnyNode): string => {
    switch (n.type) {
      case 'ConstantNode': return numberLiteral(n.value as number);
      case 'SymbolNode': {
        const index = slots.get(n.name!);
        if (index !== undefined) return `v[${index}]`;
        if (Object.hasOwn(BUILTIN_CONSTANTS, n.name!)) return numberLiteral(BUILTIN_CONSTANTS[n.name!]);
        throw new ExpressionError(`unknown symbol "${n.name}"`);
      }
      case 'ParenthesisNode': return gen(n.content!);
      case 'ConditionalNode': return `(${gen(n.condition!)} ? ${gen(n.trueExpr!)} : ${gen(n.falseExpr!)})`;
      case 'OperatorNode': {
        const fn = String(n.fn);
        const args = n.args!.map(gen);
        if (fn === 'unaryMinus') return `(-${args[0]})`;
        if (fn === 'unaryPlus') return `(+${args[0]})`;
        if (fn === 'not') return `(+!${args[0]})`;
        const op = BINARY[fn];
        if (fn === 'pow') {
          // Constant exponents the hot loop meets most, as hand-written code would have them: 1/2 as sqrt, 1/3 as
          // cbrt for a positive base (both correctly rounded, closer to the true root than pow), 2 as a product.
          // Other exponents keep Math.pow, and so does a base ≤ 0 under 1/3 (NaN for a negative one, as before).
          const e = constantValue(n.args![1]);
          if (e === 0.5) return `F.sqrt(${args[0]})`;
          if (e === 1 / 3) return `F.cbrtp(${args[0]})`;
          if (e === 2) return `F.sq(${args[0]})`;
          return `F.pow(${args[0]}, ${args[1]})`;
        }
        // Comparisons yield 1 or 0 so that every value in the evaluator stays a number.
        return op.bool ? `(+(${args[0]} ${op.js} ${args[1]}))` : `(${args[0]} ${op.js} ${args[1]})`;
      }
      case 'FunctionNode': {
        const name = (n.fn as AnyNode).name!;
        if (!(Object.hasOwn(FUNCTIONS, name))) throw new ExpressionError(`function ${name} is not allowed`);
        return `F.${name}(${n.args!.map(gen).join(', ')})`;
      }
      default:
        throw new ExpressionError(`cannot compile a ${n.type}`);
    }
  };
  return gen(node as unknown as AnyNode);
}

const PRECEDENCE: Record<string, number> = { or: 1, and: 2, larger: 3, smaller: 3, largerEq: 3, smallerEq: 3, equal: 3, unequal: 3, add: 4, subtract: 4, multiply: 5, divide: 5, unaryMinus: 6, unaryPlus: 6, not: 6, pow: 7 };

/** TeX from the checked tree, for typesetting with KaTeX. */
export function toTex(node: MathNode): string {
  const prec = (n: AnyNode): number => {
    const inner = n.type === 'ParenthesisNode' ? n.content! : n;
    return inner.type === 'OperatorNode' ? PRECEDENCE[String(inner.fn)] ?? 9 : inner.type === 'ConditionalNode' ? 0 : 9;
  };
  const gen = (n: AnyNode): string => {
    switch (n.type) {
      case 'ConstantNode': {
        const v = n.value as number;
        const s = String(v);
        const m = /^(-?[\d.]+)e([+-]?\d+)$/.exec(s);
        return m ? `${m[1]}\\times10^{${Number(m[2])}}` : s;
      }
      case 'SymbolNode': return symbolTex(n.name!);
      case 'ParenthesisNode': {
        const c = n.content!;
        // Fractions and powers already group visually; keep other parentheses.
        return c.type === 'OperatorNode' && String(c.fn) === 'divide' ? gen(c) : `\\left(${gen(c)}\\right)`;
      }
      case 'ConditionalNode':
        return `\\begin{cases} ${gen(n.trueExpr!)} & \\text{if } ${gen(n.condition!)} \\\\ ${gen(n.falseExpr!)} & \\text{otherwise} \\end{cases}`;
      case 'OperatorNode': {
        const fn = String(n.fn);
        const [a, b] = n.args!;
        const wrap = (x: AnyNode, min: number) => (prec(x) < min ? `\\left(${gen(x)}\\right)` : gen(x));
        if (fn === 'unaryMinus') return `-${wrap(a, 6)}`;
        if (fn === 'unaryPlus') return wrap(a, 6);
        if (fn === 'not') return `\\lnot ${wrap(a, 6)}`;
        if (fn === 'divide') return `\\frac{${gen(strip(a))}}{${gen(strip(b))}}`;
        if (fn === 'pow') {
          const base = a.type === 'SymbolNode' || (a.type === 'ConstantNode' && (a.value as number) >= 0) ? gen(a) : `\\left(${gen(strip(a))}\\right)`;
          return `{${base}}^{${gen(strip(b))}}`;
        }
        const p = PRECEDENCE[fn];
        return `${wrap(a, p)} ${BINARY[fn].tex} ${wrap(b, fn === 'subtract' ? p + 1 : p)}`;
      }
      case 'FunctionNode': {
        const name = (n.fn as AnyNode).name!;
        const args = n.args!.map((x) => gen(strip(x)));
        if (name === 'sqrt') return `\\sqrt{${args[0]}}`;
        if (name === 'cbrt') return `\\sqrt[3]{${args[0]}}`;
        if (name === 'abs') return `\\left|${args[0]}\\right|`;
        if (name === 'exp') return `\\exp\\left(${args[0]}\\right)`;
        if (name === 'pow') return `{\\left(${args[0]}\\right)}^{${args[1]}}`;
        const head = FUNCTIONS[name]?.tex ?? `\\operatorname{${name}}`;
        return `${head}\\left(${args.join(',\\,')}\\right)`;
      }
      default: return '?';
    }
  };
  const strip = (n: AnyNode): AnyNode => (n.type === 'ParenthesisNode' ? strip(n.content!) : n);
  return gen(node as unknown as AnyNode);
}
