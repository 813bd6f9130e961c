// The benchmark's generated file: deterministic, shaped as promised, and parsed completely.
// How fast is the bench's question (bench/parse-wide-file.ts), never a unit test's.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { WIDE_FILE_ELEMENTS, wideCsv } from '../../../bench/generate-wide-file.ts';
import { parseResultFile } from '../../../server/domain/imports/parse/index.ts';

describe('bench/generate-wide-file.ts', () => {
  it('is deterministic: 3 burns per sample, 25 elements, heats like K24-0412', () => {
    const text = wideCsv(9);
    expect(wideCsv(9)).toBe(text);
    const lines = text.trimEnd().split('\n');
    expect(lines).toHaveLength(10);
    expect(WIDE_FILE_ELEMENTS).toHaveLength(25);
    expect(lines[0].split(',').slice(6)).toEqual(WIDE_FILE_ELEMENTS.map((symbol) => `${symbol} %`));
    expect(lines[1]).toMatch(/^K24-0412-P1,K24-0412,SAE 1045,preliminary,1,2024-03-04T06:00:00Z,/);
    expect(lines.slice(1).map((line) => line.split(',')[4])).toEqual(['1', '2', '3', '1', '2', '3', '1', '2', '3']);
    // Fe is the balance: the 25 values of a burn add up to 100 % within the written rounding.
    const sum = lines[1]
      .split(',')
      .slice(6)
      .reduce((total, cell) => total.plus(cell), new Decimal(0));
    expect(sum.minus(100).abs().lte('0.0005')).toBe(true);
  });

  it('20,000 burns parse into 500,000 values equal to the cells as written', () => {
    const text = wideCsv(20_000);
    const parsed = parseResultFile(Buffer.from(text));
    expect(parsed.counts).toEqual({ rows: 20_000, burns: 20_000, values: 500_000 });
    expect(parsed.samples).toHaveLength(6667);
    expect(parsed.rejected).toEqual([]);
    // Independent reading of one line: split on commas and compare with decimal.js.
    const line = text.split('\n')[12_346].split(',');
    const burn = parsed.samples.flatMap((s) => s.burns).find((b) => b.line === 12_347)!;
    WIDE_FILE_ELEMENTS.forEach((symbol, i) => expect(burn.values[symbol].value).toBe(new Decimal(line[6 + i]).toFixed()));
  });
});
