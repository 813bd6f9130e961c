// The control chart's plain logic: scales, the value range that holds ±3σ, and the words a point is
// described with (common practice, no source: z = (x − centre) / SD).
import { describe, expect, it } from 'vitest';
import type { ChartPoint } from '../../../../src/features/control/api/control-samples.ts';
import {
  describePoint,
  linearScale,
  runSpans,
  sigmaOffset,
  timeDomain,
  valueDomain,
} from '../../../../src/features/control/chart-geometry.ts';

const point = (over: Partial<ChartPoint> = {}): ChartPoint => ({
  sample_id: 'smp_1',
  sample_code: 'CTRL-1',
  measured_at: '2026-11-30T06:40:00.000Z',
  value: 0.4285,
  burns_n: 2,
  centre: 0.412,
  sd: 0.0045,
  provisional: false,
  violations: [],
  ...over,
});

describe('control chart geometry', () => {
  it('maps a domain onto the box linearly, the y axis upside down', () => {
    const y = linearScale([0, 10], [300, 20]);
    expect(y(0)).toBe(300);
    expect(y(10)).toBe(20);
    expect(y(5)).toBe(160);
  });

  it('widens the time axis around a single point, and keeps ±3σ inside the value axis', () => {
    const t = Date.parse('2026-11-30T06:40:00.000Z');
    expect(timeDomain(['2026-11-30T06:40:00.000Z'])).toEqual([t - 86_400_000, t + 86_400_000]);
    const [low, high] = valueDomain({
      points: [point({ value: 0.412 })],
      sigma: { upper_1: 0.4165, upper_2: 0.421, upper_3: 0.4255, lower_1: 0.4075, lower_2: 0.403, lower_3: 0.3985 },
    });
    expect(low).toBeLessThan(0.3985);
    expect(high).toBeGreaterThan(0.4255);
  });

  it('tells the distance from the centre line in σ and names the rules broken in words', () => {
    // (0.4285 − 0.412) / 0.0045 = 3.67 → "+3.7σ"
    expect(sigmaOffset(point())).toBe('+3.7σ');
    expect(sigmaOffset(point({ value: 0.4075 }))).toBe('−1.0σ');
    expect(sigmaOffset(point({ centre: null, sd: null }))).toBe('—');
    const broken = point({
      violations: [
        { rule: 'beyond_3s', title: 'One point beyond 3σ', source: 'Western Electric Statistical Quality Control Handbook (1956), test 1' },
      ],
    });
    expect(describePoint(broken)).toBe(
      'CTRL-1, measured 2026-11-30 06:40 UTC, value 0.4285 %, 2 burns, +3.7σ, breaks: One point beyond 3σ',
    );
    expect(describePoint(point({ provisional: true }))).toContain('provisional (limits not established yet), no rule broken');
  });

  it('outlines the eight points of a run that breaks the rule, ending at the point that completes it', () => {
    const run = {
      rule: 'eight_one_side' as const,
      title: 'Eight successive points on the same side of the centre line',
      source: 'WE test 4',
    };
    const points = Array.from({ length: 12 }, (_, i) => point({ violations: i === 10 ? [run] : [] }));
    expect(runSpans(points)).toEqual([[3, 10]]);
  });
});
