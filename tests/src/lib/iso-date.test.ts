import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { readIsoDate, readIsoDateTime, toIsoDateTimeText } from '../../../src/lib/iso-date.ts';

// Typed times are read in the reader's zone; the tests fix it to Europe/Berlin (IANA tzdata:
// UTC+1 in winter, UTC+2 from 01:00 UTC on the last Sunday of March).
beforeAll(() => {
  vi.stubEnv('TZ', 'Europe/Berlin');
});
afterAll(() => {
  vi.unstubAllEnvs();
});

describe('readIsoDate', () => {
  it('accepts a calendar day written yyyy-mm-dd', () => {
    expect(readIsoDate('2026-12-03')).toBe('2026-12-03');
    expect(readIsoDate(' 2028-02-29 ')).toBe('2028-02-29'); // 2028 is a leap year (Gregorian rule)
  });

  it('refuses days that do not exist and other orders', () => {
    expect(readIsoDate('2026-02-29')).toBeNull();
    expect(readIsoDate('2026-13-01')).toBeNull();
    expect(readIsoDate('12/03/2026')).toBeNull();
    expect(readIsoDate('2026-1-3')).toBeNull();
    expect(readIsoDate('')).toBeNull();
  });
});

describe('readIsoDateTime', () => {
  it('reads a typed time in the local zone, with a space or a T between date and time', () => {
    expect(readIsoDateTime('2026-12-03 06:00')?.toISOString()).toBe('2026-12-03T05:00:00.000Z');
    expect(readIsoDateTime('2026-07-03T06:00')?.toISOString()).toBe('2026-07-03T04:00:00.000Z');
  });

  it('moves a time the clocks skip on the spring-forward night forward by the gap', () => {
    expect(readIsoDateTime('2026-03-29 02:30')?.toISOString()).toBe('2026-03-29T01:30:00.000Z');
  });

  it('refuses impossible times and other formats', () => {
    expect(readIsoDateTime('2026-12-03 24:00')).toBeNull();
    expect(readIsoDateTime('2026-12-03 06:60')).toBeNull();
    expect(readIsoDateTime('2026-02-30 06:00')).toBeNull();
    expect(readIsoDateTime('12/03/2026 6:00 AM')).toBeNull();
  });

  it('writes a time back in the same form', () => {
    expect(toIsoDateTimeText(new Date('2026-12-03T05:07:00Z'))).toBe('2026-12-03 06:07');
  });
});
