// Encoding, delimiter and decimal-separator detection, and the burn-time formats.
import { describe, expect, it } from 'vitest';
import { decodeBytes } from '../../../server/domain/imports/parse/decode.ts';
import { detectDecimalSeparator } from '../../../server/domain/imports/parse/detect-decimal.ts';
import { detectDelimiter } from '../../../server/domain/imports/parse/detect-delimiter.ts';
import { parseBurnTime } from '../../../server/domain/imports/parse/times.ts';

describe('decodeBytes', () => {
  it('reads UTF-8 with and without BOM, and falls back to Windows-1252', () => {
    expect(decodeBytes(Buffer.from('\ufeffAl µg/kg', 'utf8'))).toEqual({ text: 'Al µg/kg', encoding: 'utf-8', bom: true });
    expect(decodeBytes(Buffer.from('Al µg/kg', 'utf8'))).toEqual({ text: 'Al µg/kg', encoding: 'utf-8', bom: false });
    // 0xB5 is µ and 0x80 is € in Windows-1252 (WHATWG Encoding Standard index).
    expect(decodeBytes(Buffer.from([0x41, 0x6c, 0x20, 0xb5, 0x67, 0x80]))).toEqual({
      text: 'Al µg€',
      encoding: 'windows-1252',
      bom: false,
    });
  });

  it("maps 0x80–0x9F as Windows-1252, not Latin-1 (Node's own decoder does not: nodejs/node#60888)", () => {
    const defined = [...Array(32).keys()].map((i) => 0x80 + i).filter((b) => ![0x81, 0x8d, 0x8f, 0x90, 0x9d].includes(b));
    // Expected characters produced by Python's cp1252 codec, which follows the same WHATWG index.
    expect(decodeBytes(Buffer.from([0xff, ...defined]), 'windows-1252').text).toBe('ÿ€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
  });

  it('honours an explicit Windows-1252 even for bytes that are valid UTF-8', () => {
    expect(decodeBytes(Buffer.from('Ã©', 'latin1'), 'windows-1252').text).toBe('Ã©');
    expect(decodeBytes(Buffer.from('Ã©', 'latin1'), 'auto').text).toBe('é');
  });
});

describe('detectDelimiter', () => {
  const lines = (text: string) => text.split('\n');
  it.each([
    ['Sample;C;Mn\nS1;0,4;0,7\nS2;0,5;0,8', ';'],
    ['Sample,C,Mn\nS1,0.4,0.7', ','],
    ['Sample\tC\tMn\nS1\t0,4\t0,7', '\t'],
    ['Sample;Customer, order;C\nS1;A, B;0,4\nS2;C, D;0,5', ';'],
    ['Sample,"Note; free",C\nS1,"a;b",0.4', ','],
  ])('%j → %j', (text, expected) => {
    expect(detectDelimiter(lines(text), 1)).toBe(expected);
  });

  it('starts at the header row', () => {
    expect(detectDelimiter(lines('Export; OES-1; 2024\nSample,C\nS1,0.4'), 2)).toBe(',');
  });
});

describe('detectDecimalSeparator', () => {
  it('uses "." for comma-delimited files and counts digit-comma-digit against digit-dot-digit otherwise', () => {
    expect(detectDecimalSeparator([['S1', '0,4']], [1], ',')).toBe('.');
    expect(
      detectDecimalSeparator(
        [
          ['S1', '0,4'],
          ['S2', '<0,001'],
          ['S3', '1.5'],
        ],
        [1],
        ';',
      ),
    ).toBe(',');
    expect(
      detectDecimalSeparator(
        [
          ['S1', '0.4'],
          ['S2', 'n.d.'],
          ['S3', '1'],
        ],
        [1],
        ';',
      ),
    ).toBe('.');
    expect(
      detectDecimalSeparator(
        [
          ['S1', '12'],
          ['S2', ''],
        ],
        [1],
        '\t',
      ),
    ).toBe('.');
  });
});

describe('parseBurnTime', () => {
  it.each([
    ['2024-03-04T06:00:00Z', 'auto', 'Z', '2024-03-04T06:00:00.000Z'],
    ['2024-03-04T07:00:00+01:00', 'iso8601', 'Z', '2024-03-04T06:00:00.000Z'],
    ['2024-03-04T07:00:00.250+0100', 'auto', 'Z', '2024-03-04T06:00:00.250Z'],
    ['2024-03-04T01:00-05', 'auto', 'Z', '2024-03-04T06:00:00.000Z'],
    ['2024-03-04 07:00', 'YYYY-MM-DD HH:mm[:ss]', '+01:00', '2024-03-04T06:00:00.000Z'],
    ['4.3.2024 07:00:30', 'DD.MM.YYYY HH:mm[:ss]', '+01:00', '2024-03-04T06:00:30.000Z'],
    ['2024-01-01 00:30', 'auto', '+02:00', '2023-12-31T22:30:00.000Z'],
  ])('%s (%s, offset %s) → %s', (text, format, offset, iso) => {
    expect(parseBurnTime(text, format as never, offset)).toMatchObject({ iso });
  });

  // In an IANA zone, daylight saving included. Change dates: EU summer time from 01:00 UTC on the
  // last Sunday of March to 01:00 UTC on the last Sunday of October (Directive 2000/84/EC); US from
  // 02:00 local on the second Sunday of March to 02:00 on the first Sunday of November (Energy Policy
  // Act of 2005). docs/references.md, "Time zones".
  it.each([
    ['2026-01-15 08:00', 'Europe/Berlin', '2026-01-15T07:00:00.000Z', false],
    ['2026-07-15 08:00', 'Europe/Berlin', '2026-07-15T06:00:00.000Z', false],
    ['2026-03-29 03:00', 'Europe/Berlin', '2026-03-29T01:00:00.000Z', false],
    ['2026-10-25 02:30', 'Europe/Berlin', '2026-10-25T00:30:00.000Z', true],
    ['2026-10-25 03:00', 'Europe/Berlin', '2026-10-25T02:00:00.000Z', false],
    ['2026-11-01 01:30', 'America/Chicago', '2026-11-01T06:30:00.000Z', true],
    ['2026-06-01 10:00', 'Asia/Kolkata', '2026-06-01T04:30:00.000Z', false],
    ['2026-07-15T08:00:00+01:00', 'Europe/Berlin', '2026-07-15T07:00:00.000Z', false],
  ])('%s in %s → %s (ambiguous: %s)', (text, zone, iso, ambiguous) => {
    const parsed = parseBurnTime(text, 'auto', zone) as { iso: string; ambiguous?: boolean };
    expect(parsed.iso).toBe(iso);
    expect(parsed.ambiguous === true).toBe(ambiguous);
  });

  it.each([
    ['2026-03-29 02:30', 'Europe/Berlin'],
    ['2026-03-08 02:30', 'America/Chicago'],
  ])('%s does not exist in %s (the clocks go forward over it)', (text, zone) => {
    expect(parseBurnTime(text, 'auto', zone)).toEqual({ skipped: true });
  });

  it.each([
    ['2024-13-01 10:00', 'auto'],
    ['2023-02-29 10:00', 'auto'],
    ['2024-03-04 24:00', 'auto'],
    ['2024-03-04T10:00+15:00', 'auto'],
    ['2024-03-04T10:00+05:99', 'auto'],
    ['04.03.2024 10:00', 'iso8601'],
    ['2024-03-04', 'auto'],
    ['0099-03-04 10:00', 'auto'],
  ])('refuses %s (%s)', (text, format) => {
    expect(parseBurnTime(text, format as never, 'Z')).toBeUndefined();
  });
});
