import { describe, expect, it } from 'vitest';
import { parseBurnsJson } from '../../../../src/features/drift/burns-json.ts';
import { formatTime, shortDecimal, toChartRows } from '../../../../src/features/drift/chart-data.ts';
import { formatInstant } from '../../../../src/lib/timestamp.ts';

describe('drift chart data', () => {
  it('turns points into numeric rows, keeping null where a run did not correct the element', () => {
    const rows = toChartRows([
      {
        standardization_id: 'std_a',
        method: { id: 'm', code: 'FE-LA' },
        mode: 'two_point',
        measured_at: '2026-03-02T05:10:00.000Z',
        slope: '1.0239520958083832335',
        offset: '-0.00423353293413173653',
        flag: 'ok',
        reasons: [],
        status: 'activated',
        effective_from: '2026-03-02T05:35:00.000Z',
        in_force: true,
      },
      {
        standardization_id: 'std_b',
        method: { id: 'm', code: 'FE-LA' },
        mode: 'two_point',
        measured_at: '2026-03-03T05:10:00.000Z',
        slope: null,
        offset: null,
        flag: 'warn',
        reasons: ['…'],
        status: 'draft',
        effective_from: null,
        in_force: false,
      },
    ]);
    expect(rows).toEqual([
      {
        id: 'std_a',
        time: Date.UTC(2026, 2, 2, 5, 10),
        slope: 1.0239520958083832,
        offset: -0.004233532934131736,
        flag: 'ok',
        status: 'activated',
        inForce: true,
      },
      { id: 'std_b', time: Date.UTC(2026, 2, 3, 5, 10), slope: null, offset: null, flag: 'warn', status: 'draft', inForce: false },
    ]);
  });

  it('shortens long decimals to 5 significant digits for reading, never in exponent notation', () => {
    expect(shortDecimal('1.0239520958083832335')).toBe('1.024');
    expect(shortDecimal('-0.00423353293413173653')).toBe('-0.0042335');
    expect(shortDecimal('-0.00000004')).toBe('-0.00000004');
    expect(shortDecimal('1')).toBe('1');
    expect(shortDecimal(null)).toBe('—');
    // formatTime is kept for older callers and shows the console's one clock (tests/src/lib/timestamp.test.ts).
    expect(formatTime('2026-03-02T05:10:00.000Z')).toBe(formatInstant('2026-03-02T05:10:00.000Z'));
  });
});

describe('burns typed as JSON', () => {
  it('accepts an array of element → value objects and explains what is wrong otherwise', () => {
    expect(parseBurnsJson('[{"C": 0.8, "Mn": "1.47"}]')).toEqual({ burns: [{ C: 0.8, Mn: '1.47' }] });
    expect(parseBurnsJson('[{"C": 0.8,}]').error).toMatch(/^Not valid JSON/);
    expect(parseBurnsJson('[]').error).toBe('Write an array with at least one burn.');
    expect(parseBurnsJson('[{"C": 0.8}, 3]').error).toBe('Burn 2 is not an object of element → value.');
    expect(parseBurnsJson('[{"C": [1]}]').error).toBe('Burn 1: the value of C must be a number or a string such as "<0.002".');
  });
});
