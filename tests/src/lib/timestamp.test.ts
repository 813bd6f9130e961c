import { describe, expect, it } from 'vitest';
import { formatAge, formatInstant, instantTitle, viewInstant } from '../../../src/lib/timestamp.ts';

// Reference offsets from the IANA time zone database (tzdata, zones "Europe/Berlin", "Asia/Kolkata",
// "America/New_York"): the EU changes clocks at 01:00 UTC on the last Sunday of March and October
// (Directive 2000/84/EC); India keeps UTC+5:30 all year; the US changes at 02:00 local on the second
// Sunday in March (Energy Policy Act of 2005).
describe('viewInstant', () => {
  it('shows local time year-first with the zone as its UTC offset, and UTC for the hover text', () => {
    const view = viewInstant('2026-12-03T06:15:42Z', { timeZone: 'Europe/Berlin' });
    expect(view).toEqual({
      local: '2026-12-03 07:15',
      zone: 'UTC+1',
      timeZone: 'Europe/Berlin',
      utc: '2026-12-03 06:15:42 UTC',
      iso: '2026-12-03T06:15:42.000Z',
    });
    expect(instantTitle(view!)).toBe('2026-12-03 06:15:42 UTC (shown in Europe/Berlin, UTC+1)');
  });

  it('follows the spring-forward change in Europe: 00:59 UTC is 01:59 CET, 01:00 UTC is 03:00 CEST', () => {
    expect(formatInstant('2026-03-29T00:59:00Z', { timeZone: 'Europe/Berlin' })).toBe('2026-03-29 01:59 UTC+1');
    expect(formatInstant('2026-03-29T01:00:00Z', { timeZone: 'Europe/Berlin' })).toBe('2026-03-29 03:00 UTC+2');
  });

  it('tells apart the two 02:30s of the autumn night by their offsets', () => {
    expect(formatInstant('2026-10-25T00:30:00Z', { timeZone: 'Europe/Berlin' })).toBe('2026-10-25 02:30 UTC+2');
    expect(formatInstant('2026-10-25T01:30:00Z', { timeZone: 'Europe/Berlin' })).toBe('2026-10-25 02:30 UTC+1');
  });

  it('follows the US change in New York (EST to EDT)', () => {
    expect(formatInstant('2026-03-08T06:59:00Z', { timeZone: 'America/New_York' })).toBe('2026-03-08 01:59 UTC-5');
    expect(formatInstant('2026-03-08T07:00:00Z', { timeZone: 'America/New_York' })).toBe('2026-03-08 03:00 UTC-4');
  });

  it('keeps a zone without DST at one offset all year, half hours included', () => {
    expect(formatInstant('2026-01-15T00:00:00Z', { timeZone: 'Asia/Kolkata' })).toBe('2026-01-15 05:30 UTC+5:30');
    expect(formatInstant('2026-07-15T00:00:00Z', { timeZone: 'Asia/Kolkata' })).toBe('2026-07-15 05:30 UTC+5:30');
  });

  it('names UTC itself as UTC and writes midnight as 00, not 24', () => {
    expect(formatInstant('2026-12-03T00:00:05Z', { timeZone: 'UTC', seconds: true })).toBe('2026-12-03 00:00:05 UTC');
  });

  it('crosses the date line into the next local day', () => {
    expect(formatInstant('2026-12-31T23:30:00Z', { timeZone: 'Asia/Kolkata' })).toBe('2027-01-01 05:00 UTC+5:30');
  });

  it('accepts epoch milliseconds and Date objects as well as ISO text', () => {
    const ms = Date.UTC(2026, 11, 3, 6, 0);
    expect(formatInstant(ms, { timeZone: 'UTC' })).toBe('2026-12-03 06:00 UTC');
    expect(formatInstant(new Date(ms), { timeZone: 'UTC' })).toBe('2026-12-03 06:00 UTC');
  });

  it('shows a dash for a missing or unreadable instant', () => {
    expect(viewInstant(null)).toBeNull();
    expect(viewInstant('')).toBeNull();
    expect(viewInstant('not a time')).toBeNull();
    expect(formatInstant(undefined)).toBe('—');
  });
});

describe('formatAge', () => {
  const now = Date.parse('2026-12-03T12:00:00Z');
  it('says how long ago in minutes, then hours up to two days, then days (whole units, rounded down)', () => {
    expect(formatAge('2026-12-03T11:59:30Z', now)).toBe('0 min');
    expect(formatAge('2026-12-03T11:15:00Z', now)).toBe('45 min');
    expect(formatAge('2026-12-02T13:00:00Z', now)).toBe('23 h');
    expect(formatAge('2026-12-01T12:30:00Z', now)).toBe('47 h');
    expect(formatAge('2026-11-30T12:00:00Z', now)).toBe('3 d');
  });
  it('does not count backwards for an instant after now', () => {
    expect(formatAge('2026-12-03T12:05:00Z', now)).toBe('in the future');
  });
});
