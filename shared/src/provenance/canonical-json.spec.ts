import { describe, expect, it } from 'vitest';
import { canonicalJson } from './canonical-json.js';

describe('canonicalJson', () => {
  it('sorts keys at every depth and leaves out whitespace', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: 1, y: 2 }], c: 'x' } })).toBe('{"a":{"c":"x","d":[3,{"y":2,"z":1}]},"b":1}');
  });

  it('gives the same text whatever order the keys were written in', () => {
    expect(canonicalJson({ method: 'exact', axes: [{ to: 2, from: 1 }] })).toBe(canonicalJson({ axes: [{ from: 1, to: 2 }], method: 'exact' }));
  });

  it('writes numbers and strings as JSON.stringify does (RFC 8785 for these values)', () => {
    expect(canonicalJson([1e-6, 0.1, 1e21, -0, 'é\n"'])).toBe('[0.000001,0.1,1e+21,0,"é\\n\\""]');
  });

  it('leaves out undefined members and writes undefined array items as null', () => {
    expect(canonicalJson({ a: undefined, b: [undefined, null] })).toBe('{"b":[null,null]}');
  });

  it('refuses a value without a JSON form', () => {
    expect(() => canonicalJson(undefined)).toThrow(/no JSON form/);
  });
});
