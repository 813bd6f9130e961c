import { describe, expect, it } from 'vitest';
import { formatTime, shortDecimal, toChartRows } from '../../../../src/features/drift/chart-data.ts';

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
    expect(formatTime('2026-03-02T05:10:00.000Z')).toBe('2026-03-02 05:10 UTC');
  });
});
