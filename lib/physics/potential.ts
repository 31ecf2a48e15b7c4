// Safe compilation of a potential formula V(x, y): parsed by a restricted mathjs instance, then turned into a
// plain closure over Math (only x, y, pi, e, arithmetic, comparisons, ?: and a list of real functions are allowed).
import { all, create, type MathNode } from 'mathjs';
import { SpecError } from './errors';

/** The mathjs parser of an instance with the dangerous functions disabled (mathjs "Security" guide,
 * docs/expressions/security.md). Created on first use: building a mathjs instance takes a noticeable moment. */
let restrictedParse: ((expr: string) => MathNode) | null = null;

function parser(): (expr: string) => MathNode {
  if (restrictedParse) return restrictedParse;
  const math = create(all);
  const parse = math.parse;
  const disabled = (name: string) => () => {
    throw new Error(`function ${name} is disabled`);
  };
  math.import(
    Object.fromEntries(
      ['import', 'createUnit', 'evaluate', 'parse', 'simplify', 'derivative', 'compile', 'resolve', 'reviver', 'replacer', 'parser', 'chain', 'help'].map(
        (name) => [name, disabled(name)],
      ),
    ),
    { override: true },
  );
  restrictedParse = (expr: string) => parse(expr);
  return restrictedParse;
}

type Fn = (x: number, y: number) => number;

const FUNCTIONS: Record<string, (...args: number[]) => number> = {
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  asin: Math.asin,
  acos: Math.acos,
  atan: Math.atan,
  atan2: Math.atan2,
  sinh: Math.sinh,
  cosh: Math.cosh,
  tanh: Math.tanh,
  exp: Math.exp,
  log: (a, b) => (b === undefined ? Math.log(a) : Math.log(a) / Math.log(b)),
  log10: Math.log10,
  log2: Math.log2,
  sqrt: Math.sqrt,
  cbrt: Math.cbrt,
  abs: Math.abs,
  sign: Math.sign,
  min: Math.min,
  max: Math.max,
  pow: Math.pow,
  floor: Math.floor,
  ceil: Math.ceil,
  round: Math.round,
  hypot: Math.hypot,
  mod: (a, b) => a - b * Math.floor(a / b),
  square: (a) => a * a,
  cube: (a) => a * a * a,
};

const OPERATORS: Record<string, (a: number, b: number) => number> = {
  add: (a, b) => a + b,
  subtract: (a, b) => a - b,
  multiply: (a, b) => a * b,
  divide: (a, b) => a / b,
  pow: (a, b) => Math.pow(a, b),
  mod: (a, b) => a - b * Math.floor(a / b),
  smaller: (a, b) => (a < b ? 1 : 0),
  larger: (a, b) => (a > b ? 1 : 0),
  smallerEq: (a, b) => (a <= b ? 1 : 0),
  largerEq: (a, b) => (a >= b ? 1 : 0),
  equal: (a, b) => (a === b ? 1 : 0),
  unequal: (a, b) => (a !== b ? 1 : 0),
};

const SYMBOLS: Record<string, Fn> = {
  x: (x) => x,
  y: (_x, y) => y,
  pi: () => Math.PI,
  e: () => Math.E,
};

function refuse(message: string): never {
  throw new SpecError(message, 'potential');
}

/** Builds a closure from a parsed node, refusing anything outside the allowed grammar. */
function build(node: MathNode): Fn {
  switch (node.type) {
    case 'ConstantNode': {
      const value = (node as unknown as { value: unknown }).value;
      if (typeof value !== 'number' || !Number.isFinite(value)) refuse('only numbers may appear as constants');
      return () => value;
    }
    case 'SymbolNode': {
      const name = (node as unknown as { name: string }).name;
      const f = SYMBOLS[name];
      if (!f) refuse(`unknown symbol "${name}": use x, y, pi, e and the functions ${Object.keys(FUNCTIONS).join(', ')}`);
      return f;
    }
    case 'ParenthesisNode':
      return build((node as unknown as { content: MathNode }).content);
    case 'OperatorNode': {
      const { fn, args } = node as unknown as { fn: string; args: MathNode[] };
      if (args.length === 1) {
        const a = build(args[0]);
        if (fn === 'unaryMinus') return (x, y) => -a(x, y);
        if (fn === 'unaryPlus') return a;
        refuse(`operator "${(node as unknown as { op: string }).op}" is not allowed`);
      }
      const op = OPERATORS[fn];
      if (!op || args.length !== 2) refuse(`operator "${(node as unknown as { op: string }).op}" is not allowed`);
      const a = build(args[0]);
      const b = build(args[1]);
      return (x, y) => op(a(x, y), b(x, y));
    }
    case 'ConditionalNode': {
      const { condition, trueExpr, falseExpr } = node as unknown as { condition: MathNode; trueExpr: MathNode; falseExpr: MathNode };
      const c = build(condition);
      const t = build(trueExpr);
      const f = build(falseExpr);
      return (x, y) => (c(x, y) !== 0 ? t(x, y) : f(x, y));
    }
    case 'FunctionNode': {
      const { fn, args } = node as unknown as { fn: MathNode; args: MathNode[] };
      const name = fn.type === 'SymbolNode' ? (fn as unknown as { name: string }).name : '';
      const f = Object.hasOwn(FUNCTIONS, name) ? FUNCTIONS[name] : undefined;
      if (!f) refuse(`function "${name || fn.toString()}" is not allowed: use ${Object.keys(FUNCTIONS).join(', ')}`);
      if (args.length === 0 || args.length > 8) refuse(`function "${name}" needs between 1 and 8 arguments`);
      const parts = args.map(build);
      if (parts.length === 1) {
        const [a] = parts;
        return (x, y) => f(a(x, y));
      }
      return (x, y) => f(...parts.map((p) => p(x, y)));
    }
    default:
      return refuse(`"${node.toString()}" is not allowed in a potential (only arithmetic in x and y)`);
  }
}

/**
 * Compiles a potential formula into V(x, y) (energy units hbar^2/(2 m L^2), lengths in L).
 *
 * The formula is parsed by a mathjs instance whose import, createUnit, evaluate, parse, simplify, derivative,
 * compile, resolve and reviver functions are disabled; the tree is then checked node by node and evaluated with
 * plain Math functions, so no mathjs evaluation (and no unit, matrix, string or assignment) ever runs.
 *
 * @param formula - e.g. "10 * (x^2 + y^2)" or "x > 0 ? 50 : 0"
 * @returns V(x, y); it throws SpecError naming the point when the value is not a finite real number
 * @throws SpecError (path "potential") for syntax errors, unknown symbols or disallowed constructs
 * @see https://mathjs.org/docs/expressions/security.html
 * @example
 * compilePotential('x^2 + y^2')(1, 2); // 5
 */
export function compilePotential(formula: string): (x: number, y: number) => number {
  let tree: MathNode;
  try {
    tree = parser()(formula);
  } catch (error) {
    return refuse(`cannot read the formula: ${(error as Error).message}`);
  }
  const f = build(tree);
  return (x, y) => {
    const v = f(x, y);
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new SpecError(`the potential is not a finite real number at (${x}, ${y}) (got ${v})`, 'potential');
    }
    return v;
  };
}
