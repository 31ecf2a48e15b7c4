// The safe-MDX gate: a remark plugin that walks a note's syntax tree BEFORE any JavaScript is generated and refuses imports,
// exports, expressions, elements outside the allow-list, spread or undeclared props, literal-less props, bad URLs, huge math.
import type { Root } from 'mdast';
import type { Node } from 'unist';
import { visit } from 'unist-util-visit';
import {
  ALLOWED_COMPONENT_NAMES,
  allowedComponentProps,
  componentTakesChildren,
  declaredProps,
  isAllowedComponent,
} from './allowed-components';
import { formulaProblem, MAX_FORMULAS, MAX_MATH_CHARS } from './math-limits';

/** One refusal, with the 1-based line and column of the offending syntax. */
export interface MdxSafetyIssue {
  line: number;
  column: number;
  message: string;
}

/**
 * Thrown by the gate: `message` names the line of the first refusal ("line 3: imports are not allowed in figure notes");
 * `issues` lists every refusal found in the note, in document order.
 */
export class MdxSafetyError extends Error {
  readonly line: number;
  readonly column: number;
  readonly issues: MdxSafetyIssue[];
  constructor(issues: MdxSafetyIssue[]) {
    const first = issues[0] ?? { line: 1, column: 1, message: 'line 1: the note was refused' };
    super(first.message);
    this.name = 'MdxSafetyError';
    this.line = first.line;
    this.column = first.column;
    this.issues = issues;
  }
}

// Minimal shapes of the MDX and estree nodes the gate reads (mdast-util-mdx-jsx / estree), declared here so the gate depends
// only on what it inspects.
interface Positioned {
  type: string;
  position?: { start: { line: number; column: number } };
}
interface EstreeNode {
  type: string;
  [key: string]: unknown;
}
interface ExpressionValue {
  type: 'mdxJsxAttributeValueExpression';
  value: string;
  data?: { estree?: { body?: EstreeNode[] } | null };
}
interface JsxAttribute extends Positioned {
  type: 'mdxJsxAttribute' | 'mdxJsxExpressionAttribute';
  name?: string;
  value?: string | null | ExpressionValue;
}
interface JsxElement extends Positioned {
  type: 'mdxJsxFlowElement' | 'mdxJsxTextElement';
  name: string | null;
  attributes: JsxAttribute[];
  children: unknown[];
}

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** Result of reading an estree expression as a pure literal. */
type LiteralRead = { ok: true; value: unknown } | { ok: false };

/**
 * Read an estree expression as a JSON-like literal: strings, numbers (also negated), booleans, null, templates without
 * substitutions, and arrays/objects made only of those. Anything else (calls, identifiers, functions, regexes…) is refused.
 */
export function readLiteral(node: EstreeNode | null | undefined): LiteralRead {
  if (!node) return { ok: false };
  switch (node.type) {
    case 'Literal': {
      if ('regex' in node || 'bigint' in node) return { ok: false };
      const v = node.value;
      if (v === null || ['string', 'number', 'boolean'].includes(typeof v)) return { ok: true, value: v };
      return { ok: false };
    }
    case 'UnaryExpression': {
      const arg = node.argument as EstreeNode;
      if ((node.operator === '-' || node.operator === '+') && arg?.type === 'Literal' && typeof arg.value === 'number') {
        return { ok: true, value: node.operator === '-' ? -arg.value : arg.value };
      }
      return { ok: false };
    }
    case 'TemplateLiteral': {
      const quasis = node.quasis as { value: { cooked: string | null } }[];
      const expressions = node.expressions as unknown[];
      if (expressions.length !== 0 || quasis.length !== 1 || quasis[0].value.cooked === null) return { ok: false };
      return { ok: true, value: quasis[0].value.cooked };
    }
    case 'ArrayExpression': {
      const out: unknown[] = [];
      for (const el of node.elements as (EstreeNode | null)[]) {
        const r = readLiteral(el);
        if (!r.ok) return r;
        out.push(r.value);
      }
      return { ok: true, value: out };
    }
    case 'ObjectExpression': {
      const out: Record<string, unknown> = {};
      for (const prop of node.properties as EstreeNode[]) {
        if (prop.type !== 'Property' || prop.kind !== 'init' || prop.computed || prop.method || prop.shorthand) return { ok: false };
        const key = prop.key as EstreeNode;
        const name = key.type === 'Identifier' ? (key.name as string) : key.type === 'Literal' ? String(key.value) : null;
        if (name === null || FORBIDDEN_KEYS.has(name)) return { ok: false };
        const r = readLiteral(prop.value as EstreeNode);
        if (!r.ok) return r;
        out[name] = r.value;
      }
      return { ok: true, value: out };
    }
    default:
      return { ok: false };
  }
}

/** Read the literal held by an attribute's `{…}` value, from the estree that MDX's parser attached. */
function readExpressionValue(value: ExpressionValue): LiteralRead {
  const body = value.data?.estree?.body;
  if (!body || body.length !== 1 || body[0].type !== 'ExpressionStatement') return { ok: false };
  return readLiteral(body[0].expression as EstreeNode);
}

/**
 * Whether a link or image URL is allowed: http(s), mailto, relative paths, and #anchors. Control characters and spaces are
 * removed before the scheme is read, as browsers do (so "java\tscript:" is caught).
 *
 * @example isSafeUrl('https://doi.org/10.1103/PhysRev.115.485') // returns true
 * @example isSafeUrl('javascript:alert(1)') // returns false
 */
export function isSafeUrl(url: string): boolean {
  // eslint-disable-next-line no-control-regex
  const cleaned = url.replace(/[\u0000-\u0020\u007f]/g, '').toLowerCase();
  const scheme = /^([a-z][a-z0-9+.-]*):/.exec(cleaned);
  if (!scheme) return true;
  return scheme[1] === 'http' || scheme[1] === 'https' || scheme[1] === 'mailto';
}

function where(node: Positioned | undefined, fallback?: Positioned): { line: number; column: number } {
  const start = node?.position?.start ?? fallback?.position?.start;
  return { line: start?.line ?? 1, column: start?.column ?? 1 };
}

function describeValue(text: string): string {
  const short = text.length > 40 ? `${text.slice(0, 37)}...` : text;
  return JSON.stringify(short);
}

function checkElement(node: JsxElement, report: (at: Positioned | undefined, text: string) => void): void {
  const allowedList = ALLOWED_COMPONENT_NAMES.join(', ');
  if (node.name === null) {
    report(node, 'fragments (<>…</>) are not allowed in figure notes');
    return;
  }
  if (!isAllowedComponent(node.name)) {
    report(node, `<${node.name}> is not an allowed component in figure notes; use one of ${allowedList}`);
    return;
  }
  const name = node.name;
  const declared = declaredProps(name);
  const props: Record<string, unknown> = {};
  let propsOk = true;
  for (const attr of node.attributes) {
    if (attr.type === 'mdxJsxExpressionAttribute') {
      report(attr.position ? attr : node, `spread props ({...}) are not allowed on <${name}>`);
      propsOk = false;
      continue;
    }
    const prop = attr.name ?? '';
    if (!declared.includes(prop)) {
      const list = declared.length ? `its props are ${declared.join(', ')}` : 'it takes no props';
      report(attr.position ? attr : node, `<${name}> has no prop "${prop}"; ${list}`);
      propsOk = false;
      continue;
    }
    if (Object.prototype.hasOwnProperty.call(props, prop)) {
      report(attr.position ? attr : node, `<${name}> sets "${prop}" twice`);
      propsOk = false;
      continue;
    }
    const value = attr.value;
    if (value === null || value === undefined) props[prop] = true;
    else if (typeof value === 'string') props[prop] = value;
    else {
      const read = readExpressionValue(value);
      if (!read.ok) {
        report(
          attr.position ? attr : node,
          `the value of "${prop}" on <${name}> must be a literal (a "string", a number, true or false), not ${describeValue(`{${value.value}}`)}`,
        );
        propsOk = false;
        continue;
      }
      props[prop] = read.value;
    }
  }
  if (propsOk) {
    const parsed = allowedComponentProps[name].strict().safeParse(props);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path.join('.');
        const missing = issue.code === 'invalid_type' && props[key] === undefined;
        report(node, missing ? `<${name}> needs the prop "${key}"` : `<${name} ${key}>: ${issue.message}`);
      }
    }
  }
  if (!componentTakesChildren[name] && node.children.length > 0) {
    report(node, `<${name}> takes no children; write it as <${name} … />`);
  }
}

/**
 * Collect every refusal in a parsed note (an mdast tree produced with the MDX syntax extensions), in document order.
 * Pure: does not throw.
 */
export function findUnsafeNodes(tree: Root): MdxSafetyIssue[] {
  const issues: MdxSafetyIssue[] = [];
  const report = (at: Positioned | undefined, text: string, fallback?: Positioned) => {
    const { line, column } = where(at, fallback);
    issues.push({ line, column, message: `line ${line}: ${text}` });
  };
  let formulas = 0;
  let mathChars = 0;
  visit(tree as Node, (node: Node) => {
    const n = node as Positioned & { value?: string; url?: string; data?: { estree?: { body?: EstreeNode[] } } };
    switch (node.type) {
      case 'math':
      case 'inlineMath': {
        formulas += 1;
        if (formulas === MAX_FORMULAS + 1) report(n, `a note may hold at most ${MAX_FORMULAS} formulas`);
        const before = mathChars;
        mathChars += (n.value ?? '').length;
        if (before <= MAX_MATH_CHARS && mathChars > MAX_MATH_CHARS) {
          report(n, `the note holds more than ${MAX_MATH_CHARS} characters of math; split it into several notes`);
        }
        const problem = formulaProblem(n.value ?? '');
        if (problem) report(n, problem);
        return 'skip';
      }
      case 'mdxjsEsm': {
        const body = n.data?.estree?.body ?? [];
        const isImport = body.some((s) => s.type === 'ImportDeclaration') || /^\s*import\b/.test(n.value ?? '');
        report(n, isImport ? 'imports are not allowed in figure notes' : 'exports are not allowed in figure notes');
        return 'skip';
      }
      case 'mdxFlowExpression':
      case 'mdxTextExpression':
        report(n, 'JavaScript expressions in braces ({…}) are not allowed in figure notes; write math as $…$ and braces as \\{ \\}');
        return 'skip';
      case 'mdxJsxFlowElement':
      case 'mdxJsxTextElement':
        checkElement(node as unknown as JsxElement, report);
        return undefined;
      case 'link':
      case 'image':
      case 'definition':
        if (typeof n.url === 'string' && !isSafeUrl(n.url)) {
          const what = node.type === 'image' ? 'image' : 'link';
          report(n, `${what} URL ${describeValue(n.url)} is not allowed; use http(s), mailto, a relative path or a #anchor`);
        }
        return undefined;
      default:
        return undefined;
    }
  });
  issues.sort((a, b) => a.line - b.line || a.column - b.column);
  return issues;
}

/**
 * Remark plugin: refuse unsafe MDX by throwing `MdxSafetyError` (first refusal in the message, all of them in `issues`).
 * Put it in `remarkPlugins` of every compile of user-written MDX.
 *
 * @example
 * await compile('import fs from "node:fs"', { remarkPlugins: [remarkSafe] })
 * // throws MdxSafetyError: 'line 1: imports are not allowed in figure notes'
 * @see /work/shared/STACK.md §4 "MDX from the database, safely"
 */
export function remarkSafe() {
  return (tree: Root) => {
    const issues = findUnsafeNodes(tree);
    if (issues.length > 0) throw new MdxSafetyError(issues);
  };
}
