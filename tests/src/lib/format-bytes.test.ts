import { describe, expect, it } from 'vitest';
import { formatBytes, formatBytesExactly } from '../../../src/lib/format-bytes.ts';

// Binary multiples as IEC 80000-13 defines them: 1 KiB = 1024 B, 1 MiB = 1024² B.
describe('formatBytes', () => {
  it('writes sizes in bytes, KiB and MiB with one decimal at most', () => {
    expect(formatBytes(1)).toBe('1 byte');
    expect(formatBytes(277)).toBe('277 bytes');
    expect(formatBytes(1536)).toBe('1.5 KiB');
    expect(formatBytes(200_000)).toBe('195.3 KiB');
    expect(formatBytes(20 * 1024 * 1024)).toBe('20 MiB');
    expect(formatBytes(5 * 1024 ** 3)).toBe('5 GiB');
  });

  it('states a limit with its exact byte count', () => {
    expect(formatBytesExactly(20 * 1024 * 1024)).toBe('20 MiB (20,971,520 bytes)');
    expect(formatBytesExactly(512)).toBe('512 bytes');
  });
});
