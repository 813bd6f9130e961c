import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { displayPrefix, generateKeySecret, isWellFormedKey, KEY_PREFIX } from '../../server/domain/api-keys/key-format.ts';

describe('API key format', () => {
  it('generates distinct, well-formed keys', () => {
    const keys = Array.from({ length: 200 }, generateKeySecret);
    expect(new Set(keys).size).toBe(200);
    for (const key of keys) {
      expect(key.startsWith(KEY_PREFIX)).toBe(true);
      expect(isWellFormedKey(key)).toBe(true);
      expect(displayPrefix(key)).toBe(key.slice(0, 14));
    }
  });

  it('detects any single-character change through the checksum (property)', () => {
    const alphabet = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';
    fc.assert(
      fc.property(
        fc.integer({ min: KEY_PREFIX.length, max: KEY_PREFIX.length + 37 }),
        fc.integer({ min: 1, max: 61 }),
        (position, shift) => {
          const key = generateKeySecret();
          const changed = alphabet[(alphabet.indexOf(key[position]) + shift) % 62];
          const mutated = key.slice(0, position) + changed + key.slice(position + 1);
          expect(isWellFormedKey(mutated)).toBe(false);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('rejects wrong prefixes and lengths', () => {
    const key = generateKeySecret();
    expect(isWellFormedKey(key.replace('mw_live_', 'mw_test_'))).toBe(false);
    expect(isWellFormedKey(key.slice(0, -1))).toBe(false);
    expect(isWellFormedKey(`${key}x`)).toBe(false);
  });
});
