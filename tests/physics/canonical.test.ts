// Tests of canonical JSON (sorted keys, -0, typed arrays, undefined, shortest numbers) and the result hash.
// Expected strings are written out by hand from the rules in lib/physics/canonical.ts.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, resultHash } from '@/lib/physics/canonical';

describe('canonicalJson', () => {
  it('sorts keys at every depth and drops undefined', () => {
    expect(canonicalJson({ b: 1, a: { d: [1, { z: 0, y: undefined }], c: 'x' }, e: undefined })).toBe('{"a":{"c":"x","d":[1,{"z":0}]},"b":1}');
  });

  it('writes typed arrays as arrays, -0 as 0, shortest round-trip numbers', () => {
    expect(canonicalJson({ v: new Float64Array([0.1, -0, 1e21, 5e-324]) })).toBe('{"v":[0.1,0,1e+21,5e-324]}');
    expect(canonicalJson(new Int32Array([3, -2]))).toBe('[3,-2]');
    expect(canonicalJson(-0)).toBe('0');
    expect(canonicalJson([undefined, null, true])).toBe('[null,null,true]');
    expect(canonicalJson(0.1 + 0.2)).toBe('0.30000000000000004');
  });

  it('refuses non-finite numbers, naming the place', () => {
    expect(() => canonicalJson({ a: [1, NaN] })).toThrow(/a\[1\]/);
    expect(() => canonicalJson(Infinity)).toThrow(TypeError);
  });

  it('escapes strings like JSON', () => {
    expect(canonicalJson({ 'k"ey': 'line\nbreak' })).toBe('{"k\\"ey":"line\\nbreak"}');
  });
});

describe('resultHash', () => {
  it('is the SHA-256 of the canonical JSON without diagnostics', () => {
    const result = { task: 'spectrum', levels: [1, 2], diagnostics: { wallMs: 12 } };
    const expected = createHash('sha256').update('{"levels":[1,2],"task":"spectrum"}').digest('hex');
    expect(resultHash(result)).toBe(expected);
    expect(resultHash({ ...result, diagnostics: { wallMs: 99 } })).toBe(expected);
    expect(resultHash({ levels: [1, 2], task: 'spectrum' })).toBe(expected);
    expect(resultHash({ ...result, levels: [1, 2.0000000001] })).not.toBe(expected);
  });
});
