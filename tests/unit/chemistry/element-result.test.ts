import { sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  computeElementResult,
  RESULT_FLAGS,
  RESULT_RULE_LIST,
  RESULT_RULES,
  type BurnCell,
  type ElementSettings,
} from '../../../server/domain/chemistry/element-result.ts';

const num = (value: string): BurnCell => ({ value, qualifier: null });
const lt = (value: string | null): BurnCell => ({ value, qualifier: '<' });
const gt = (value: string | null): BurnCell => ({ value, qualifier: '>' });
const nd: BurnCell = { value: null, qualifier: 'nd' };

function result(cells: Array<BurnCell | undefined>, settings: Partial<ElementSettings> = {}) {
  return computeElementResult({ element: 'Mn', cells, settings: { decimals: 4, ...settings } });
}

describe('rule 1–2: numeric burns → mean, SD, RSD, n, min, max, reported', () => {
  it('averages the burns exactly and rounds half-even to the method decimals', () => {
    const r = result([num('0.752'), num('0.748'), num('0.751')], { decimals: 2 });
    expect(r).toMatchObject({
      element: 'Mn',
      mean: '0.7503333333333333333333333333333333',
      n: 3,
      min: '0.748',
      max: '0.752',
      reported: '0.75',
      qualifier: null,
      flags: [],
      n_qualified: 0,
    });
    // SD (n − 1) cross-checked with simple-statistics 7.12.1.
    expect(r.sd).toBeCloseTo(sampleStandardDeviation([0.752, 0.748, 0.751]), 14);
    expect(r.rsd).toBeCloseTo((100 * sampleStandardDeviation([0.752, 0.748, 0.751])) / 0.7503333333333333, 10);
  });

  it('rounds the exact tie of two burns to even (ASTM E29: 12.35 → 12.4)', () => {
    const r = result([num('12.3'), num('12.4')], { decimals: 1 });
    expect(r.mean).toBe('12.35');
    expect(r.reported).toBe('12.4');
    expect(result([num('12.2'), num('12.3')], { decimals: 1 }).reported).toBe('12.2'); // 12.25 → 12.2
  });

  it('writes trailing zeros to the method decimals', () => {
    expect(result([num('0.7')], { decimals: 2 }).reported).toBe('0.70');
  });

  it('skips burns that did not measure the element', () => {
    const r = result([num('0.50'), undefined, { value: null, qualifier: null }, num('0.52')], { decimals: 2 });
    expect(r).toMatchObject({ n: 2, mean: '0.51', reported: '0.51', flags: [] });
  });
});

describe('rule 3: n = 0 → no result', () => {
  it.each([
    ['no burns', []],
    ['only unmeasured burns', [undefined, undefined]],
    ['only blank cells', [{ value: null, qualifier: null }]],
  ])('%s', (_label, cells) => {
    expect(result(cells as BurnCell[])).toEqual({
      element: 'Mn',
      mean: null,
      sd: null,
      rsd: null,
      n: 0,
      min: null,
      max: null,
      reported: null,
      qualifier: null,
      flags: ['not_measured'],
      n_qualified: 0,
      repeatability: null,
    });
  });
});

describe('single burn', () => {
  it('has no SD, RSD or repeatability check', () => {
    const r = result([num('0.75'), undefined], { decimals: 2, repeatability_sd: '0.001' });
    expect(r).toMatchObject({ n: 1, sd: null, rsd: null, reported: '0.75', flags: ['single_burn'], repeatability: null });
  });
});

describe('rule 4: numeric mean outside the limits', () => {
  const limits = { detection_limit: '0.0005', working_range_low: '0.0020', working_range_high: '2.0' };

  it('below the detection limit → "<" the lowest reportable value (larger of DL and range low)', () => {
    const r = result([num('0.0003'), num('0.0004')], limits);
    expect(r).toMatchObject({
      mean: '0.00035',
      reported: '0.0020',
      qualifier: '<',
      flags: ['below_detection_limit', 'below_working_range'],
    });
  });

  it('below the detection limit when no working range is set → "<" the detection limit', () => {
    const r = result([num('0.0003'), num('0.0004')], { detection_limit: '0.0005' });
    expect(r).toMatchObject({ reported: '0.0005', qualifier: '<', flags: ['below_detection_limit'] });
  });

  it('above the detection limit but below the working range → "<" range low', () => {
    const r = result([num('0.0010'), num('0.0012')], limits);
    expect(r).toMatchObject({ mean: '0.0011', reported: '0.0020', qualifier: '<', flags: ['below_working_range'] });
  });

  it('above the working range → ">" its upper end, written with the method decimals', () => {
    const r = result([num('2.10'), num('2.20')], { ...limits, decimals: 2 });
    expect(r).toMatchObject({ mean: '2.15', reported: '2.00', qualifier: '>', flags: ['above_working_range'] });
  });

  it('a mean equal to a limit is inside (compared at full precision, not rounded)', () => {
    expect(result([num('0.0020'), num('0.0020')], limits)).toMatchObject({ reported: '0.0020', qualifier: null, flags: [] });
    expect(result([num('2.0')], { ...limits, decimals: 1 })).toMatchObject({ reported: '2.0', qualifier: null });
    // 0.00199999 rounds to 0.0020 but is below the range: "<", not a number equal to the limit.
    expect(result([num('0.00199999')], limits)).toMatchObject({
      reported: '0.0020',
      qualifier: '<',
      flags: ['single_burn', 'below_working_range'],
    });
  });
});

describe('rule 4: a mean below 0 after an additive correction', () => {
  it('is reported as "<" one reporting step when the method sets no limit, the mean kept', () => {
    // (−0.001 − 0.003) / 2 = −0.002, by hand
    const r = result([num('-0.001'), num('-0.003')], { decimals: 3 });
    expect(r).toMatchObject({ mean: '-0.002', reported: '0.001', qualifier: '<', flags: ['below_zero'] });
  });

  it('is reported as "<" the detection limit when the method sets one', () => {
    const r = result([num('-0.001'), num('-0.003')], { decimals: 3, detection_limit: '0.002' });
    expect(r).toMatchObject({ reported: '0.002', qualifier: '<', flags: ['below_detection_limit', 'below_zero'] });
  });
});

describe('rule 5: "<" and n.d. burns → an upper bound', () => {
  it('all burns "<" → "<" the limit; no mean', () => {
    const r = result([lt('0.0005'), lt('0.0005'), lt('0.0005')], { detection_limit: '0.0005' });
    expect(r).toMatchObject({
      mean: null,
      sd: null,
      n: 0,
      n_qualified: 3,
      reported: '0.0005',
      qualifier: '<',
      flags: ['all_burns_qualified'],
    });
  });

  it('all burns "<" with different limits → "<" the mean of the limits', () => {
    expect(result([lt('0.0005'), lt('0.0007')])).toMatchObject({ reported: '0.0006', qualifier: '<' });
  });

  it('mixed numeric and "<" burns (usually a failed spark) are withheld by default: nothing reported', () => {
    // The case found in the audit: <0.001, 0.030, 0.034 once reported "<0.022" beside a mean of 0.032.
    const r = result([lt('0.001'), num('0.030'), num('0.034')], { decimals: 3, detection_limit: '0.001' });
    expect(r).toMatchObject({ mean: '0.032', n: 2, n_qualified: 1, reported: null, qualifier: null, flags: ['mixed_qualified_burns'] });
  });

  it('under treat_as_bound, mixed burns give "<" the mean with each "<" at its limit, and no mean', () => {
    // (0.0007 + 0.0006 + 0.0005) / 3 = 0.0006, by hand
    const r = result([num('0.0007'), num('0.0006'), lt('0.0005')], { detection_limit: '0.0005', mixed_qualified_burns: 'treat_as_bound' });
    expect(r).toMatchObject({
      mean: null,
      sd: null,
      rsd: null,
      n: 2,
      n_qualified: 1,
      reported: '0.0006',
      qualifier: '<',
      flags: ['mixed_qualified_burns'],
    });
    // (0.001 + 0.030 + 0.034) / 3 = 0.021666…, rounded up at 3 decimals: "<0.022", and no mean to contradict it.
    const audit = result([lt('0.001'), num('0.030'), num('0.034')], { decimals: 3, mixed_qualified_burns: 'treat_as_bound' });
    expect(audit).toMatchObject({ mean: null, reported: '0.022', qualifier: '<' });
  });

  it('an upper bound below the lowest reportable value is raised to it', () => {
    // (0.0001 + 0.0005) / 2 = 0.0003 < DL 0.0005
    const r = result([num('0.0001'), lt('0.0005')], { detection_limit: '0.0005', mixed_qualified_burns: 'treat_as_bound' });
    expect(r).toMatchObject({
      reported: '0.0005',
      qualifier: '<',
      flags: ['single_burn', 'below_detection_limit', 'mixed_qualified_burns'],
    });
  });

  it('a "<" bound below 0 (after an additive correction) is raised to one reporting step, never written negative', () => {
    expect(result([lt('-0.003'), lt('-0.003')], { decimals: 3 })).toMatchObject({ reported: '0.001', qualifier: '<' });
    expect(result([lt('-0.003')], { decimals: 3, detection_limit: '0.002' })).toMatchObject({ reported: '0.002', qualifier: '<' });
  });

  it('n.d. counts as "<" the detection limit', () => {
    const r = result([nd, nd], { detection_limit: '0.001', decimals: 3 });
    expect(r).toMatchObject({ n: 0, n_qualified: 2, reported: '0.001', qualifier: '<', flags: ['all_burns_qualified', 'not_detected'] });
  });

  it('"<" without a value counts as "<" the detection limit', () => {
    expect(result([lt(null)], { detection_limit: '0.002', decimals: 3 })).toMatchObject({ reported: '0.002', qualifier: '<' });
  });

  it('rounds the bound up so that it stays true (0.00045 at 3 decimals → < 0.001)', () => {
    expect(result([lt('0.00045')], { decimals: 3 })).toMatchObject({ reported: '0.001', qualifier: '<' });
  });
});

describe('rule 6: ">" burns → a lower bound', () => {
  it('all ">" → ">" the limit', () => {
    expect(result([gt('1.5'), gt('1.5')], { decimals: 2 })).toMatchObject({
      reported: '1.50',
      qualifier: '>',
      flags: ['all_burns_qualified'],
    });
  });

  it('mixed numeric and ">" under treat_as_bound → ">" the mean with each ">" at its limit', () => {
    expect(result([num('1.40'), gt('1.5')], { decimals: 2 })).toMatchObject({ mean: '1.4', reported: null, qualifier: null });
    expect(result([num('1.40'), gt('1.5')], { decimals: 2, mixed_qualified_burns: 'treat_as_bound' })).toMatchObject({
      mean: null,
      reported: '1.45',
      qualifier: '>',
      flags: ['single_burn', 'mixed_qualified_burns'],
    });
  });

  it('a lower bound above the working range is capped at its upper end', () => {
    const r = result([num('1.60'), gt('1.5')], { decimals: 2, working_range_high: '1.5', mixed_qualified_burns: 'treat_as_bound' });
    expect(r).toMatchObject({ reported: '1.50', qualifier: '>', flags: ['single_burn', 'above_working_range', 'mixed_qualified_burns'] });
  });

  it('">" without a value stands for the working range high; rounded down to stay true', () => {
    expect(result([gt(null)], { decimals: 2, working_range_high: '1.4567' })).toMatchObject({ reported: '1.45', qualifier: '>' });
  });
});

describe('rule 7: nothing can be reported', () => {
  it('"<" and ">" burns together', () => {
    const r = result([lt('0.001'), gt('1.5'), num('0.5')], { decimals: 3 });
    expect(r).toMatchObject({
      reported: null,
      qualifier: null,
      mean: '0.5',
      n: 1,
      flags: ['single_burn', 'mixed_qualified_burns', 'conflicting_qualified_burns'],
    });
  });

  it('n.d. without a detection limit', () => {
    const r = result([nd, nd]);
    expect(r).toMatchObject({ reported: null, qualifier: null, flags: ['all_burns_qualified', 'not_detected', 'limit_missing'] });
  });

  it('">" without a value and without a working range', () => {
    expect(result([gt(null), num('1.2')])).toMatchObject({
      reported: null,
      qualifier: null,
      flags: ['single_burn', 'mixed_qualified_burns', 'limit_missing'],
    });
  });
});

describe('rule 9: burns outside the working range while the mean is inside', () => {
  it('flags, does not change the result', () => {
    const r = result([num('0.95'), num('1.05')], { decimals: 2, working_range_low: '0.10', working_range_high: '1.00' });
    expect(r).toMatchObject({ mean: '1', reported: '1.00', qualifier: null, flags: ['burns_outside_working_range'] });
  });
});

describe('rule 10: repeatability (ISO 5725-6)', () => {
  it('flags a range above f(3)·σr = 3.31 × 0.005', () => {
    const r = result([num('0.750'), num('0.770'), num('0.752')], { decimals: 3, repeatability_sd: '0.005' });
    expect(r.flags).toEqual(['repeatability_exceeded']);
    expect(r.repeatability).toEqual({ range: '0.02', critical_range: '0.01655', exceeded: true });
    expect(r.reported).toBe('0.757'); // still the mean: the analyst decides
  });

  it('passes a range within it', () => {
    const r = result([num('0.750'), num('0.755'), num('0.752')], { decimals: 3, repeatability_sd: '0.005' });
    expect(r.flags).toEqual([]);
    expect(r.repeatability?.exceeded).toBe(false);
  });

  it('counts a "<" burn at its bound: the range is at least the highest numeric burn minus it', () => {
    // 0.0030 − 0.0005 = 0.0025 over three burns; f(3)·σr = 3.31 × 0.0005 = 0.001655 (ISO 5725-6 Table 1)
    const r = result([num('0.0007'), num('0.0030'), lt('0.0005')], { repeatability_sd: '0.0005' });
    expect(r.repeatability).toEqual({ range: '0.0025', critical_range: '0.001655', exceeded: true });
    expect(r.flags).toContain('repeatability_exceeded');
    // The audit's case: 0.034 − 0.001 = 0.033 > 3.31 × 0.002 = 0.00662: not repeatable, and withheld.
    const audit = result([lt('0.001'), num('0.030'), num('0.034')], { decimals: 3, repeatability_sd: '0.002' });
    expect(audit.flags).toEqual(['repeatability_exceeded', 'mixed_qualified_burns']);
  });

  it('a ">" burn above every numeric burn widens the range the same way; one below them does not', () => {
    const wide = result([num('1.40'), num('1.41'), gt('1.50')], { decimals: 2, repeatability_sd: '0.01' });
    expect(wide.repeatability).toEqual({ range: '0.1', critical_range: '0.0331', exceeded: true });
    const inside = result([num('1.40'), num('1.41'), gt('1.20')], { decimals: 2, repeatability_sd: '0.01' });
    expect(inside.repeatability).toEqual({ range: '0.01', critical_range: '0.0331', exceeded: false });
  });

  it('more than 20 burns → repeatability_unchecked', () => {
    const r = result(
      Array.from({ length: 21 }, () => num('0.75')),
      { decimals: 2, repeatability_sd: '0.005' },
    );
    expect(r.flags).toEqual(['repeatability_unchecked']);
  });

  it('no σr (or σr 0) → no check, no flag', () => {
    expect(result([num('0.1'), num('0.9')], { decimals: 1 })).toMatchObject({ repeatability: null, flags: [] });
    expect(result([num('0.1'), num('0.9')], { decimals: 1, repeatability_sd: '0' })).toMatchObject({ repeatability: null, flags: [] });
  });
});

describe('documentation exports', () => {
  it('lists flags in the documented order, so equal results serialise identically', () => {
    const names = Object.keys(RESULT_FLAGS);
    const flags = result([num('0.0001'), lt('0.0005')], { detection_limit: '0.0005' }).flags;
    expect(flags).toEqual([...flags].sort((a, b) => names.indexOf(a) - names.indexOf(b)));
  });

  it('describes every flag in one line, with snake_case names', () => {
    for (const [flag, description] of Object.entries(RESULT_FLAGS)) {
      expect(flag).toMatch(/^[a-z]+(_[a-z0-9]+)*$/);
      expect(description.length).toBeGreaterThan(10);
      expect(description).not.toContain('\n');
    }
  });

  it('states a basis for every rule, and RESULT_RULES carries them all', () => {
    for (const [index, rule] of RESULT_RULE_LIST.entries()) {
      expect(rule.basis.length).toBeGreaterThan(5);
      expect(RESULT_RULES).toContain(`${index + 1}. ${rule.rule}`);
    }
  });
});
