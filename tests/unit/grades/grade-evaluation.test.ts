// Grade verdicts against outside references (docs/references.md#grade-limits and #rounding):
// the ASTM E29 half-even pairs and the JavaScript toFixed traps, boundary cases of SAE 1045,
// AA 6061 (others each / total), UNS S30400 and C36000 (zinc by difference), qualified values.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseComposition } from '../../../server/domain/grades/composition.ts';
import { evaluateComposition, type GradeDefinition } from '../../../server/domain/grades/grade-evaluation.ts';
import { judge } from '../../../server/domain/grades/limit-judgement.ts';
import { parseMeasuredValue } from '../../../server/domain/chemistry/measured-value.ts';

const evaluate = (grade: GradeDefinition, composition: Record<string, number | string>) =>
  evaluateComposition(grade, parseComposition(composition));
const verdictOf = (grade: GradeDefinition, composition: Record<string, number | string>, element: string) =>
  evaluate(grade, composition).elements.find((e) => e.element === element)!;

// SAE J403 (read in an excerpt): C 0.43–0.50, Mn 0.60–0.90, P 0.040, S 0.050.
const SAE_1045: GradeDefinition = {
  matrix: 'Fe',
  decision_rule: 'rounding',
  limits: [
    { element: 'C', min: '0.43', max: '0.50' },
    { element: 'Mn', min: '0.60', max: '0.90' },
    { element: 'P', max: '0.040' },
    { element: 'S', max: '0.050' },
  ],
};
// Aluminum Association registration (read in secondary reproductions).
const AA_6061: GradeDefinition = {
  matrix: 'Al',
  decision_rule: 'rounding',
  remainder_element: 'Al',
  limits: [
    { element: 'Si', min: '0.40', max: '0.8' },
    { element: 'Fe', max: '0.7' },
    { element: 'Cu', min: '0.15', max: '0.40' },
    { element: 'Mn', max: '0.15' },
    { element: 'Mg', min: '0.8', max: '1.2' },
    { element: 'Cr', min: '0.04', max: '0.35' },
    { element: 'Zn', max: '0.25' },
    { element: 'Ti', max: '0.15' },
  ],
  others_each: '0.05',
  others_total: '0.15',
};
// ASTM A240 (older edition, read; newer editions differ).
const UNS_S30400: GradeDefinition = {
  matrix: 'Fe',
  decision_rule: 'rounding',
  limits: [
    { element: 'C', max: '0.08' },
    { element: 'Mn', max: '2.00' },
    { element: 'P', max: '0.045' },
    { element: 'S', max: '0.030' },
    { element: 'Si', max: '0.75' },
    { element: 'Cr', min: '18.0', max: '20.0' },
    { element: 'Ni', min: '8.0', max: '10.5' },
    { element: 'N', max: '0.10' },
  ],
};
// ASTM B16 (read): Cu 60.0–63.0, Pb 2.5–3.0, Fe 0.35, Zn remainder.
const C36000: GradeDefinition = {
  matrix: 'Cu',
  decision_rule: 'rounding',
  remainder_element: 'Zn',
  limits: [
    { element: 'Cu', min: '60.0', max: '63.0' },
    { element: 'Pb', min: '2.5', max: '3.0' },
    { element: 'Fe', max: '0.35' },
  ],
};
const GOOD_1045 = { C: 0.45, Mn: 0.75, P: 0.012, S: 0.02 };

describe('ASTM E29 rounding to the place of the limit (docs/references.md#rounding)', () => {
  it.each([
    ['56.748', '56.7'],
    ['2.146', '2.15'],
    ['21.4501', '21.5'],
    ['21.350', '21.4'],
    ['21.45', '21.4'],
    ['42.85', '42.8'],
    ['42.35', '42.4'],
    ['12.25', '12.2'],
    ['12.35', '12.4'],
    ['12.45', '12.4'],
  ])('%s rounds to %s', (value, rounded) => {
    const place = rounded; // a limit written with the same decimals
    expect(judge(parseMeasuredValue(value), { max: place }, 'rounding').rounded).toBe(rounded);
    expect(judge(parseMeasuredValue(Number(value)), { max: place }, 'rounding').rounded).toBe(rounded);
  });

  it('avoids the toFixed traps: 12.35 against max 12.3 fails, 42.85 against max 42.8 passes', () => {
    expect((12.35).toFixed(1)).toBe('12.3'); // the trap itself, as JavaScript has it
    expect((42.85).toFixed(1)).toBe('42.9');
    expect(judge(parseMeasuredValue(12.35), { max: '12.3' }, 'rounding').verdict).toBe('above_max');
    expect(judge(parseMeasuredValue(42.85), { max: '42.8' }, 'rounding').verdict).toBe('within');
  });
});

describe('SAE 1045 at its boundaries', () => {
  it.each([
    [0.425, 'below_min'], // 0.42
    [0.435, 'within'], // 0.44
    [0.505, 'within'], // 0.50: half to even
    [0.515, 'above_max'], // 0.52
  ])('C %s → %s under the rounding rule', (c, verdict) => {
    expect(verdictOf(SAE_1045, { ...GOOD_1045, C: c }, 'C').verdict).toBe(verdict);
  });

  it('fails C 0.505 under the absolute rule and says the rule', () => {
    const result = evaluate({ ...SAE_1045, decision_rule: 'absolute' }, { ...GOOD_1045, C: 0.505 });
    expect(result.decision_rule).toBe('absolute');
    expect(result.elements[0]).toMatchObject({ verdict: 'above_max', rounded: null, margin: '-0.005' });
    expect(result.conforms).toBe(false);
  });

  it('conforms with every element within, and gives each margin', () => {
    const result = evaluate(SAE_1045, GOOD_1045);
    expect(result.conforms).toBe(true);
    expect(result.elements.map((e) => [e.element, e.rounded, e.margin])).toEqual([
      ['C', '0.45', '0.02'],
      ['Mn', '0.75', '0.15'],
      ['P', '0.012', '0.028'],
      ['S', '0.020', '0.03'],
    ]);
  });
});

describe('qualified and missing values', () => {
  it('"<0.002" against max 0.050 is within; "<0.06" against max 0.050 cannot be decided', () => {
    expect(verdictOf(SAE_1045, { ...GOOD_1045, S: '<0.002' }, 'S').verdict).toBe('within');
    const undecided = evaluate(SAE_1045, { ...GOOD_1045, S: '<0.06' });
    expect(undecided.elements[3]).toMatchObject({ verdict: 'undetermined', value: '<0.06', rounded: '<0.060', margin: null });
    expect(undecided.conforms).toBeNull();
  });

  it('a ">" bound beyond the max fails; below the min of a two-sided limit "<" fails', () => {
    expect(verdictOf(SAE_1045, { ...GOOD_1045, P: '>0.05' }, 'P').verdict).toBe('above_max');
    expect(verdictOf(SAE_1045, { ...GOOD_1045, C: '<0.40' }, 'C').verdict).toBe('below_min');
  });

  it('an element not measured gives not_measured and conforms null — but a failure still wins', () => {
    const { S: _s, ...withoutS } = GOOD_1045;
    expect(evaluate(SAE_1045, withoutS).conforms).toBeNull();
    expect(evaluate(SAE_1045, { ...withoutS, C: 0.6 }).conforms).toBe(false);
  });
});

describe('AA 6061: remainder and others (docs/references.md#grade-limits)', () => {
  const good = { Si: 0.62, Fe: 0.3, Cu: 0.28, Mn: 0.08, Mg: 1.0, Cr: 0.2, Zn: 0.05, Ti: 0.03 };

  it('reads Si 0.85 as 0.8 (within) and 0.395 as 0.40 (within), 0.86 as 0.9 (above)', () => {
    expect(verdictOf(AA_6061, { ...good, Si: 0.85 }, 'Si')).toMatchObject({ verdict: 'within', rounded: '0.8' });
    expect(verdictOf(AA_6061, { ...good, Si: 0.395 }, 'Si').verdict).toBe('within');
    expect(verdictOf(AA_6061, { ...good, Si: 0.86 }, 'Si').verdict).toBe('above_max');
  });

  it('judges each unlisted element against 0.05 and their total, each ≥ 0.010 % rounded to two decimals, against 0.15', () => {
    const result = evaluate(AA_6061, { ...good, Ni: 0.04, Pb: 0.045, Sn: 0.044, Ga: 0.008 });
    expect(result.others!.each.map((e) => [e.element, e.verdict])).toEqual([
      ['Ni', 'within'],
      ['Pb', 'within'],
      ['Sn', 'within'],
      ['Ga', 'within'],
    ]);
    expect(result.others!.total).toMatchObject({ value: '0.12', verdict: 'within' }); // 0.04 + 0.04 + 0.04; Ga below 0.010 is not counted
    expect(result.conforms).toBe(true);
    const over = evaluate(AA_6061, { ...good, Ni: 0.05, Pb: 0.05, Sn: 0.055 });
    expect(over.others!.each.find((e) => e.element === 'Sn')!.verdict).toBe('above_max'); // 0.055 → 0.06
    expect(over.others!.total).toMatchObject({ value: '0.16', verdict: 'above_max' });
    expect(over.conforms).toBe(false);
  });

  it('states aluminium by difference', () => {
    expect(evaluate(AA_6061, good).remainder).toEqual({ element: 'Al', value: '97.44', by_difference: true, approximate: false });
  });
});

describe('UNS S30400 and C36000', () => {
  const steel = { C: 0.05, Mn: 1.5, P: 0.03, S: 0.01, Si: 0.5, Cr: 18.2, Ni: 8.1, N: 0.05 };
  it('reads Cr 17.95 as 18.0 (within) and Ni 10.55 as 10.6 (above)', () => {
    expect(verdictOf(UNS_S30400, { ...steel, Cr: 17.95 }, 'Cr')).toMatchObject({ verdict: 'within', rounded: '18.0' });
    expect(verdictOf(UNS_S30400, { ...steel, Ni: 10.55 }, 'Ni')).toMatchObject({ verdict: 'above_max', rounded: '10.6' });
  });

  it('computes zinc by difference for C36000 and marks it approximate when a value is a bound', () => {
    expect(evaluate(C36000, { Cu: 61.5, Pb: 2.8, Fe: 0.2 }).remainder).toMatchObject({ element: 'Zn', value: '35.5', approximate: false });
    const bounded = evaluate(C36000, { Cu: 61.5, Pb: 2.8, Fe: '<0.05' });
    expect(bounded.remainder).toMatchObject({ approximate: true });
    expect(bounded.warnings.join(' ')).toMatch(/approximate/);
  });
});

describe('aims', () => {
  it('warn outside the aim without failing the grade', () => {
    const result = evaluate({ ...SAE_1045, aims: [{ element: 'C', min: '0.44', max: '0.47' }] }, { ...GOOD_1045, C: 0.48 });
    expect(result.conforms).toBe(true);
    expect(result.aims).toEqual([{ element: 'C', value: '0.48', aim_min: '0.44', aim_max: '0.47', within: false }]);
    expect(result.warnings[0]).toMatch(/outside the aim/);
  });
});

describe('a number and its shortest decimal string', () => {
  it('always get the same verdict (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_000_000 }), fc.integer({ min: 0, max: 6 }), (units, places) => {
        const text = (units / 10 ** places).toString();
        const fromNumber = evaluate(SAE_1045, { ...GOOD_1045, C: Number(text) }).elements[0];
        const fromString = evaluate(SAE_1045, { ...GOOD_1045, C: text }).elements[0];
        expect(fromNumber).toEqual(fromString);
      }),
      { numRuns: 2000 },
    );
  });
});
