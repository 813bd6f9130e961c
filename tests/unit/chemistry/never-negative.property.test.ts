// Property: whatever the burns and whatever correction set corrected them (slopes near 1, offsets
// of either sign, as standardization gives), no reported value and no "<" or ">" bound is ever
// negative, and a numeric reported value never contradicts the mean it was rounded from. The
// corrections are applied by the production code (correctCell); the checks use decimal.js.
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type BurnCell, computeElementResult, MIXED_BURNS_RULES } from '../../../server/domain/chemistry/element-result.ts';
import { correctCell } from '../../../server/domain/drift/correction-math.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

const raw = decimalString({ maxDigits: 200_000n, maxScale: 5 }); // 0 … 2 %, up to 5 decimals
const cell = fc.oneof(
  { arbitrary: raw.map((v) => ({ v, q: null as BurnCell['qualifier'] })), weight: 6 },
  { arbitrary: raw.map((v) => ({ v, q: '<' as const })), weight: 2 },
  { arbitrary: raw.map((v) => ({ v, q: '>' as const })), weight: 1 },
  { arbitrary: fc.constant({ v: null, q: 'nd' as const }), weight: 1 },
);
const correction = fc.record({
  slope: decimalString({ maxDigits: 40_000n, maxScale: 4 }).map((d) => new Decimal(d).plus('0.8').toFixed()), // 0.8 … 4.8
  offset: decimalString({ maxDigits: 5_000n, maxScale: 4, signs: ['', '-', '-'] }), // −0.5 … 0.5 %
});
const settings = fc.record({
  decimals: fc.integer({ min: 0, max: 5 }),
  detection_limit: fc.option(decimalString({ maxDigits: 50n, maxScale: 4 }), { nil: null }),
  mixed_qualified_burns: fc.constantFrom(...MIXED_BURNS_RULES),
});

describe('reported values after any correction', () => {
  it('are never negative, bounds included, and a numeric one is its mean rounded', () => {
    fc.assert(
      fc.property(fc.array(cell, { minLength: 1, maxLength: 5 }), correction, settings, (cells, set, rules) => {
        const corrected = cells.map((c) => correctCell(c, set));
        const r = computeElementResult({
          element: 'Mn',
          cells: corrected.map((c) => ({ value: c.v, qualifier: c.q })),
          settings: rules,
        });
        if (r.reported !== null) {
          expect(new Decimal(r.reported).isNegative()).toBe(false);
          if (r.qualifier === null && r.mean !== null && !new Decimal(r.mean).isNegative()) {
            const step = new Decimal(10).pow(-rules.decimals);
            expect(new Decimal(r.reported).minus(r.mean).abs().lte(step.div(2))).toBe(true);
          }
        }
      }),
      { numRuns: 2000 },
    );
  });
});
