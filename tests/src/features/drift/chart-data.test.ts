import { describe, expect, it } from 'vitest';
import type { DriftPoint } from '../../../../src/features/drift/api/standardizations.ts';
import { formatInstant } from '../../../../src/lib/timestamp.ts';
import { formatTime, roundTicks, shortDecimal, slopeBands, toChartRows } from '../../../../src/features/drift/chart-data.ts';

const points: DriftPoint[] = [
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
];

describe('drift chart data', () => {
  it('turns points into numeric rows, keeping null where a run did not correct the element', () => {
    const rows = toChartRows(points);
    expect(rows).toEqual([
      {
        id: 'std_a',
        time: Date.UTC(2026, 2, 2, 5, 10),
        slope: 1.0239520958083832,
        offset: -0.004233532934131736,
        draftSlope: null,
        draftOffset: null,
        flag: 'ok',
        status: 'activated',
        inForce: true,
      },
      // A draft never activated stands off the line: it corrected nothing.
      {
        id: 'std_b',
        time: Date.UTC(2026, 2, 3, 5, 10),
        slope: null,
        offset: null,
        draftSlope: null,
        draftOffset: null,
        flag: 'warn',
        status: 'draft',
        inForce: false,
      },
    ]);
    // Offsets of a trace element in ppm (×10 000).
    expect(toChartRows([{ ...points[0], offset: '-0.0000068265' }], 'ppm')[0].offset).toBeCloseTo(-0.068265, 10);
  });

  it('puts drafts off the line and gives round ticks covering the values and slope 1', () => {
    const [row] = toChartRows([{ ...points[0], status: 'draft', in_force: false, slope: '0.4498' }]);
    expect(row).toMatchObject({ slope: null, draftSlope: 0.4498 });
    // By hand: span 1.0661 − 0.9771 ≈ 0.089, /5 ≈ 0.018 → step 0.02; 0.96 … 1.08.
    expect(roundTicks([0.9771, 1.0661, null], [1])).toEqual({
      domain: [0.96, 1.08],
      ticks: [0.96, 0.98, 1, 1.02, 1.04, 1.06, 1.08],
      decimals: 2,
    });
    // Including a failed draft at 0.45: span 0.6166 → step 0.2 (0.12 rounds up to 0.2): 0.4 … 1.2.
    expect(roundTicks([0.45, 1.0661], [1]).ticks).toEqual([0.4, 0.6, 0.8, 1, 1.2]);
    // Nothing but 0 (offsets of a run read on the nominal values): ±1 around it, step 0.5.
    expect(roundTicks([], [0])).toEqual({ domain: [-1, 1], ticks: [-1, -0.5, 0, 0.5, 1], decimals: 1 });
  });

  it("shades the slope beyond the method's warn and fail limits, inside the axis only", () => {
    expect(slopeBands({ warn: '0.2', fail: '0.5' }, [0.4, 1.2])).toEqual(
      [
        { y1: 1.2, y2: 1.2, flag: 'warn' },
        { y1: 0.5, y2: 0.8, flag: 'warn' },
        { y1: 0.4, y2: 0.5, flag: 'fail' },
      ].filter((b) => b.y2 > b.y1),
    );
    expect(slopeBands({ warn: '0.2', fail: '0.5' }, [0.96, 1.08])).toEqual([]);
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
