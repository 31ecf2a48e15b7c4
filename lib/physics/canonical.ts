// Canonical JSON (sorted keys, no undefined, -0 as 0, typed arrays as arrays) and the SHA-256 result hash.
// Identical results give identical bytes, so results can be stored content-addressed and compared byte for byte.
import { createHash } from 'node:crypto';

function isTypedArray(value: unknown): value is ArrayLike<number> {
  return ArrayBuffer.isView(value) && !(value instanceof DataView);
}

function serialise(value: unknown, path: string): string | undefined {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new TypeError(`canonicalJson: non-finite number at ${path || '(root)'}`);
      return Object.is(value, -0) ? '0' : JSON.stringify(value);
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'bigint':
      return value.toString();
    case 'undefined':
    case 'function':
    case 'symbol':
      return undefined;
    default:
      break;
  }
  if (isTypedArray(value)) {
    const parts: string[] = [];
    for (let i = 0; i < value.length; i++) parts.push(serialise(Number(value[i]), `${path}[${i}]`) as string);
    return `[${parts.join(',')}]`;
  }
  if (Array.isArray(value)) {
    return `[${value.map((v, i) => serialise(v, `${path}[${i}]`) ?? 'null').join(',')}]`;
  }
  const obj = value as Record<string, unknown>;
  if (typeof (obj as { toJSON?: unknown }).toJSON === 'function') return serialise((obj as { toJSON: () => unknown }).toJSON(), path);
  const keys = Object.keys(obj).sort();
  const parts: string[] = [];
  for (const key of keys) {
    const v = serialise(obj[key], path ? `${path}.${key}` : key);
    if (v !== undefined) parts.push(`${JSON.stringify(key)}:${v}`);
  }
  return `{${parts.join(',')}}`;
}

/**
 * Canonical JSON text: object keys sorted by code unit, undefined / functions dropped (in arrays they become null),
 * typed arrays written as arrays, -0 written as 0, numbers in JavaScript's shortest round-trip form.
 * Non-finite numbers are refused (TypeError), since JSON cannot hold them.
 *
 * @example
 * canonicalJson({ b: 1, a: [-0, new Float64Array([0.1])] }); // '{"a":[0,[0.1]],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  return serialise(value, '') ?? 'null';
}

/**
 * SHA-256 (hex) of the canonical JSON of a result without its `diagnostics` field (timings and platform vary).
 * @example
 * resultHash({ task: 'spectrum', levels: [1], diagnostics: { wallMs: 3 } }) === resultHash({ task: 'spectrum', levels: [1] }); // true
 */
export function resultHash(result: unknown): string {
  let body = result;
  if (result && typeof result === 'object' && !Array.isArray(result) && 'diagnostics' in (result as object)) {
    const { diagnostics: _omit, ...rest } = result as Record<string, unknown>;
    body = rest;
  }
  return createHash('sha256').update(canonicalJson(body)).digest('hex');
}
