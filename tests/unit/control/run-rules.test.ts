// Each run rule on constructed series, at its edge counts. Rule definitions: Western Electric
// Statistical Quality Control Handbook (1956) and Nelson, J. Quality Technology 16(4), 1984
// (docs/references.md, "Control charts").
import { describe, expect, it } from 'vitest';
import { judgeSeries, movingRanges, type RunRule } from '../../../server/domain/control/run-rules.ts';

/** Points given as SDs from a centre line of 10 with SD 1. */
const series = (zs: number[]) => zs.map((z) => ({ value: 10 + z, centre: 10, sd: 1 }));
const flagged = (zs: number[], rule: RunRule) =>
  judgeSeries(series(zs), [rule])
    .map((v, i) => (v.length ? i : -1))
    .filter((i) => i >= 0);

describe('run rules', () => {
  it('beyond 3σ: 3.0 is not beyond, 3.01 is, on either side', () => {
    expect(flagged([3, -3, 0], 'beyond_3s')).toEqual([]);
    expect(flagged([0, 3.01, -3.5], 'beyond_3s')).toEqual([1, 2]);
  });

  it('2 of 3 beyond 2σ on the same side; opposite sides do not count', () => {
    expect(flagged([2.5, 0, 2.1], 'two_of_three_2s')).toEqual([2]);
    expect(flagged([2.5, 0, 0, 2.1], 'two_of_three_2s')).toEqual([]);
    expect(flagged([2.5, -2.5, 0], 'two_of_three_2s')).toEqual([]);
    expect(flagged([-2.2, -2.3], 'two_of_three_2s')).toEqual([1]);
  });

  it('4 of 5 beyond 1σ on the same side; 3 of 5 is not', () => {
    expect(flagged([1.5, 1.2, 0, 1.1, 1.3], 'four_of_five_1s')).toEqual([4]);
    expect(flagged([1.5, 1.2, 0, 0, 1.3], 'four_of_five_1s')).toEqual([]);
    expect(flagged([-1.5, -1.2, -1.1, -1.3], 'four_of_five_1s')).toEqual([3]);
  });

  it('8 in a row on one side: 7 is no violation, 8 is; a point on the line breaks the run', () => {
    expect(flagged([0.1, 0.2, 0.3, 0.1, 0.2, 0.5, 0.1], 'eight_one_side')).toEqual([]);
    expect(flagged([0.1, 0.2, 0.3, 0.1, 0.2, 0.5, 0.1, 0.4], 'eight_one_side')).toEqual([7]);
    expect(flagged([0.1, 0.2, 0.3, 0, 0.2, 0.5, 0.1, 0.4], 'eight_one_side')).toEqual([]);
    expect(flagged(Array(9).fill(-0.5), 'eight_one_side')).toEqual([7, 8]);
  });

  it('9 in a row on one side (Nelson): 8 is no violation, 9 is', () => {
    expect(flagged(Array(8).fill(0.3), 'nine_one_side')).toEqual([]);
    expect(flagged(Array(9).fill(0.3), 'nine_one_side')).toEqual([8]);
  });

  it('6 in a row rising or falling (Nelson): 5 is no violation, a tie breaks the trend', () => {
    expect(flagged([0, 0.1, 0.2, 0.3, 0.4], 'six_trend')).toEqual([]);
    expect(flagged([0, 0.1, 0.2, 0.3, 0.4, 0.5], 'six_trend')).toEqual([5]);
    expect(flagged([0.5, 0.4, 0.3, 0.2, 0.1, -2], 'six_trend')).toEqual([5]);
    expect(flagged([0, 0.1, 0.2, 0.2, 0.4, 0.5], 'six_trend')).toEqual([]);
  });

  it('judges each point with its own limits', () => {
    // 10.5 is beyond 3σ of centre 10 / SD 0.1, but not of centre 10.4 / SD 0.1.
    const points = [
      { value: 10.5, centre: 10, sd: 0.1 },
      { value: 10.5, centre: 10.4, sd: 0.1 },
    ];
    expect(judgeSeries(points, ['beyond_3s'])).toEqual([['beyond_3s'], []]);
  });

  it('switched-off rules are not applied', () => {
    expect(judgeSeries(series([4]), ['eight_one_side'])).toEqual([[]]);
  });

  it('moving ranges are |x_i − x_(i−1)|', () => {
    expect(movingRanges([1, 3, 2.5])).toEqual([null, 2, 0.5]);
  });
});
