// Walking parsed JSON without recursion: the depth check and reserved keys of request bodies,
// the depth-bounded copy the request log keeps, and the Idempotency-Key fingerprint, at any depth.
import type { Request } from 'express';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fingerprintRequest } from '../../server/http/request-fingerprint.ts';
import { boundDepth, checkJsonShape } from '../../server/lib/json-shape.ts';

const nested = (depth: number) => JSON.parse(`${'['.repeat(depth)}${']'.repeat(depth)}`) as unknown;

describe('checkJsonShape', () => {
  it('counts a top-level object or array as level 1', () => {
    expect(checkJsonShape(nested(64), 64)).toBeUndefined();
    expect(checkJsonShape(nested(65), 64)).toEqual({ kind: 'too_deep' });
    expect(checkJsonShape(JSON.parse('{"a":{"b":1}}'), 2)).toBeUndefined();
    expect(checkJsonShape(JSON.parse('{"a":{"b":{}}}'), 2)).toEqual({ kind: 'too_deep' });
    expect(checkJsonShape('text', 0)).toBeUndefined();
  });

  it('walks 1,000,000 levels without overflowing the stack', () => {
    expect(checkJsonShape(nested(1_000_000), 64)).toEqual({ kind: 'too_deep' });
  });

  it('finds an own "__proto__" key with its path, and only that name', () => {
    const body = JSON.parse('{"samples":[{"fields":{"constructor":"a","__proto__":"x"}}]}');
    expect(checkJsonShape(body, 64)).toEqual({ kind: 'reserved_key', path: ['samples', 0, 'fields', '__proto__'] });
    expect(checkJsonShape(JSON.parse('{"constructor":{"toString":1,"valueOf":[],"hasOwnProperty":null}}'), 64)).toBeUndefined();
  });
});

describe('boundDepth', () => {
  it('copies what fits and replaces what is deeper', () => {
    expect(boundDepth(JSON.parse('{"a":[1,{"b":[2]}],"c":"d"}'), 3, '…')).toEqual({ value: { a: [1, { b: '…' }], c: 'd' }, cut: true });
    expect(boundDepth(JSON.parse('[1,[2,[3]]]'), 3, '…')).toEqual({ value: [1, [2, [3]]], cut: false });
    const { value, cut } = boundDepth(nested(200_000), 64, null);
    expect(cut).toBe(true);
    expect(JSON.stringify(value)).toBe(`${'['.repeat(63)}[null]${']'.repeat(63)}`);
  });

  it('keeps an own "__proto__" key as data', () => {
    const { value } = boundDepth(JSON.parse('{"__proto__":{"x":1}}'), 64, null);
    expect(Object.getPrototypeOf(value)).toBe(Object.prototype);
    expect(JSON.stringify(value)).toBe('{"__proto__":{"x":1}}');
  });

  it('is an exact copy of any JSON value that fits', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (json) => {
        expect(boundDepth(json, 1000, null)).toEqual({ value: json, cut: false });
      }),
    );
  });
});

describe('fingerprintRequest', () => {
  const fingerprint = (body: unknown, url = '/api/v1/samples') => fingerprintRequest({ method: 'POST', originalUrl: url, body } as Request);

  it('is the hash it always was (stored idempotency keys stay valid)', async () => {
    // Computed with the recursive implementation before it was rewritten without recursion.
    expect(await fingerprint({ b: [1, 'x', null, { d: true, c: -0.5 }], a: { z: [], y: {} }, u: undefined })).toBe(
      'e0ae8b1bd11f8b03855e35003b21fd27dfe446b0f4c2f51f3459d1c2d6482986',
    );
  });

  it('ignores key order and hashes 100,000 levels without overflowing the stack', async () => {
    expect(await fingerprint({ a: 1, b: [2, { c: 3, d: 4 }] })).toBe(await fingerprint({ b: [2, { d: 4, c: 3 }], a: 1 }));
    expect(await fingerprint(nested(100_000))).not.toBe(await fingerprint(nested(99_999)));
  });
});
