import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Method } from '../../../server/domain/methods/methods.repository.ts';
import { DEFAULT_DRIFT_LIMITS, DEFAULT_REPORTING } from '../../../server/domain/methods/methods.schemas.ts';
import { decodeResults, encodeResults } from '../../../server/domain/samples/results-codec.ts';
import { computeSampleResults } from '../../../server/domain/samples/sample-results.ts';

const method: Method = {
  id: 'mth_x',
  code: 'X',
  name: 'x',
  matrix: 'Fe',
  default_unit: '%',
  drift_limits: DEFAULT_DRIFT_LIMITS,
  reporting: DEFAULT_REPORTING,
  created_at: '',
  updated_at: '',
  elements: [
    {
      element: 'Mn',
      decimals: 2,
      working_range_low: '0.01',
      working_range_high: '2.0',
      detection_limit: '0.003',
      repeatability_sd: '0.008',
    },
    { element: 'S', decimals: 3, working_range_low: '0.002', working_range_high: '0.1', detection_limit: '0.001', repeatability_sd: null },
  ],
};

const cell = fc.oneof(
  fc.record({ v: fc.integer({ min: 0, max: 30000 }).map((n) => (n / 10000).toString()), q: fc.constant(null) }),
  fc.record({ v: fc.constantFrom('0.002', '0.0005'), q: fc.constantFrom('<' as const, '>' as const) }),
  fc.constant({ v: null, q: 'nd' as const }),
);
const burn = fc.record({
  excluded: fc.boolean(),
  values: fc.dictionary(fc.constantFrom('Mn', 'S', 'Pb'), cell, { minKeys: 1 }),
  corrected: fc.option(fc.dictionary(fc.constantFrom('Mn', 'S', 'Pb'), cell), { nil: undefined }),
});

describe('results codec', () => {
  it('restores every field of computed results exactly (property)', () => {
    fc.assert(
      fc.property(fc.array(burn, { minLength: 1, maxLength: 5 }), (burns) => {
        const { results } = computeSampleResults(burns, method);
        expect(decodeResults(encodeResults(results))).toEqual(results);
      }),
      { numRuns: 500 },
    );
  });

  it('leaves out fields at their usual value', () => {
    const { results } = computeSampleResults([{ excluded: false, values: { Mn: { v: '0.75', q: null } } }], method);
    expect(JSON.parse(encodeResults(results))).toEqual([
      { element: 'Mn', n: 1, decimals: 2, mean: '0.75', min: '0.75', max: '0.75', reported: '0.75', flags: ['single_burn'] },
    ]);
  });
});
