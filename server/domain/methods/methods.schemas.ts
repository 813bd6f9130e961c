import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { MIXED_BURNS_RULES } from '../chemistry/element-result.ts';
import { OUTPUT_UNITS } from '../chemistry/units.ts';

/** A non-negative decimal written as a string, so its digits are kept exactly. */
export const DecimalString = z
  .string()
  .trim()
  .regex(/^\d+(\.\d+)?$/, 'must be a non-negative decimal number written as a string, e.g. "0.0005"')
  .openapi({ example: '0.0005' });

export const ElementSymbolSchema = z
  .string()
  .transform((value, ctx) => {
    const symbol = normaliseElement(value);
    if (!symbol) ctx.addIssue({ code: 'custom', message: `"${value}" is not an element symbol` });
    return symbol ?? value;
  })
  .openapi({ type: 'string', example: 'Mn', description: 'Element symbol; any case is accepted and normalised (MN → Mn).' });

const MethodElementSchema = z
  .object({
    element: ElementSymbolSchema,
    decimals: z.number().int().min(0).max(6).openapi({ description: 'Reporting decimals in % (rounded half to even, ASTM E29).' }),
    working_range_low: DecimalString.nullable().default(null).openapi({ description: 'Lowest calibrated value, %.' }),
    working_range_high: DecimalString.nullable().default(null).openapi({ description: 'Highest calibrated value, %.' }),
    detection_limit: DecimalString.nullable().default(null).openapi({ description: 'Detection limit, %.' }),
    repeatability_sd: DecimalString.nullable()
      .default(null)
      .openapi({ description: 'Repeatability standard deviation σr, % (ISO 5725); enables the burn agreement check.' }),
  })
  .refine((e) => !e.working_range_low || !e.working_range_high || Number(e.working_range_low) < Number(e.working_range_high), {
    message: 'working_range_low must be below working_range_high',
    path: ['working_range_high'],
  })
  .openapi('MethodElement');

/** Limits on |slope − 1| of a standardization, and on the slope's move from the set before, as decimal strings. */
export interface DriftLimits {
  warn: string;
  fail: string;
  /** |α / α_previous − 1| above this → warn; null = not compared. */
  slope_change_warn: string | null;
  /** |α / α_previous − 1| above this → fail; null = not compared. */
  slope_change_fail: string | null;
  /** When true, a run is activated by someone other than the one who ran it. */
  second_person_activation: boolean;
}

/**
 * Common practice, no source: a slope more than 20 % from 1 deserves a look, more than 50 % is
 * trouble; between two runs an instrument in good order moves a few %, so a move of more than
 * 5 % deserves a look and more than 15 % is trouble.
 */
export const DEFAULT_DRIFT_LIMITS: DriftLimits = {
  warn: '0.2',
  fail: '0.5',
  slope_change_warn: '0.05',
  slope_change_fail: '0.15',
  second_person_activation: false,
};

const DriftLimitsSchema = z
  .object({
    warn: DecimalString.openapi({
      description: 'Flag an element `warn` when |slope − 1| is above this.',
      example: DEFAULT_DRIFT_LIMITS.warn,
    }),
    fail: DecimalString.openapi({
      description: 'Flag an element `fail` when |slope − 1| is above this; activation then needs an override reason.',
      example: DEFAULT_DRIFT_LIMITS.fail,
    }),
    slope_change_warn: DecimalString.nullable().default(DEFAULT_DRIFT_LIMITS.slope_change_warn).openapi({
      description:
        "Flag an element `warn` when its slope moved more than this fraction from the set in force at the run's measurement time: |α / α_previous − 1| (0.05 = 5 %). null: not compared.",
      example: DEFAULT_DRIFT_LIMITS.slope_change_warn,
    }),
    slope_change_fail: DecimalString.nullable().default(DEFAULT_DRIFT_LIMITS.slope_change_fail).openapi({
      description: 'Flag an element `fail` when its slope moved more than this fraction from the set before. null: not compared.',
      example: DEFAULT_DRIFT_LIMITS.slope_change_fail,
    }),
    second_person_activation: z.boolean().default(DEFAULT_DRIFT_LIMITS.second_person_activation).openapi({
      description:
        'When true, a standardization run of this method is activated by someone other than the person (or key) who ran it (409 otherwise): a second pair of eyes on every correction set. Default false.',
    }),
  })
  .refine(
    (limits) => !/^\d+(\.\d+)?$/.test(limits.warn) || !/^\d+(\.\d+)?$/.test(limits.fail) || Number(limits.warn) <= Number(limits.fail),
    {
      message: 'warn must not be above fail',
      path: ['fail'],
    },
  )
  .refine(
    (l) =>
      !l.slope_change_warn ||
      !l.slope_change_fail ||
      !/^\d+(\.\d+)?$/.test(l.slope_change_warn) ||
      !/^\d+(\.\d+)?$/.test(l.slope_change_fail) ||
      Number(l.slope_change_warn) <= Number(l.slope_change_fail),
    { message: 'slope_change_warn must not be above slope_change_fail', path: ['slope_change_fail'] },
  )
  .openapi('DriftLimits', {
    description: `Limits on the distance of a standardization slope from 1, as decimal strings. Defaults warn ${DEFAULT_DRIFT_LIMITS.warn}, fail ${DEFAULT_DRIFT_LIMITS.fail} (a slope outside 0.8–1.2 deserves a look, outside 0.5–1.5 signals trouble). And limits on how far the slope moved from the set before it: defaults ${DEFAULT_DRIFT_LIMITS.slope_change_warn} and ${DEFAULT_DRIFT_LIMITS.slope_change_fail} (5 % and 15 %). Common practice, no source — set them from your own validation data.`,
  });

/** How a method turns results into a report beyond each element's own settings. */
export interface MethodReporting {
  mixed_qualified_burns: (typeof MIXED_BURNS_RULES)[number];
  balance_by_difference: boolean;
  sum_tolerance: string;
  unlisted_elements: 'keep_unreported' | 'report';
  min_included_burns: number;
}

/** Safe defaults: withhold mixed burns, no balance, 0.5 % over 100 % tolerated, unlisted elements not reported, two burns at least. */
export const DEFAULT_REPORTING: MethodReporting = {
  mixed_qualified_burns: 'withhold',
  balance_by_difference: false,
  sum_tolerance: '0.5',
  unlisted_elements: 'keep_unreported',
  min_included_burns: 2,
};

const MethodReportingSchema = z
  .object({
    mixed_qualified_burns: z.enum(MIXED_BURNS_RULES).default(DEFAULT_REPORTING.mixed_qualified_burns).openapi({
      description:
        'Numeric and "<", ">" or n.d. burns of one element together (usually a failed spark): `withhold` reports nothing (spark again); `treat_as_bound` reports the bound with the mean of every burn at its limit, `mean` null.',
    }),
    balance_by_difference: z.boolean().default(DEFAULT_REPORTING.balance_by_difference).openapi({
      description: 'Report the matrix element as 100 % minus the other reported elements (flag balance_by_difference).',
    }),
    sum_tolerance: DecimalString.default(DEFAULT_REPORTING.sum_tolerance).openapi({
      description: 'A sample whose reported elements add up to more than 100 % plus this (in %) is flagged sum_above_100.',
      example: DEFAULT_REPORTING.sum_tolerance,
    }),
    unlisted_elements: z.enum(['keep_unreported', 'report']).default(DEFAULT_REPORTING.unlisted_elements).openapi({
      description:
        'Elements measured but not listed in the method: `keep_unreported` keeps their burns and mean but reports nothing (flag not_in_method); `report` reports them with 4 decimals and no limits.',
    }),
    min_included_burns: z.number().int().min(1).max(10).default(DEFAULT_REPORTING.min_included_burns).openapi({
      description:
        'How many burns must stay included when a burn is excluded (PATCH /samples/{id}/burns/{n}, amendments): default 2, so that a result always rests on burns that can be compared; 1 lets a result rest on a single burn (flag single_burn). A sample stored with fewer burns keeps them; the rule only refuses exclusions. Repeat measurements on at least two burns: common practice, no source.',
      example: DEFAULT_REPORTING.min_included_burns,
    }),
  })
  .openapi('MethodReporting', {
    description:
      'Reporting rules of the method (see the result rules in GET /samples/{id}). Changing them affects results computed from then on.',
  });

const elementList = z
  .array(MethodElementSchema)
  .min(1)
  .max(80)
  .superRefine(
    (elements, ctx) => {
      const seen = new Set<string>();
      elements.forEach((e, i) => {
        // Runs even when other entries are invalid, so one 400 names every problem.
        const symbol = typeof e?.element === 'string' ? normaliseElement(e.element) : undefined;
        if (symbol && seen.has(symbol)) ctx.addIssue({ code: 'custom', message: `${symbol} is listed twice`, path: [i, 'element'] });
        if (symbol) seen.add(symbol);
      });
    },
    { when: (payload) => Array.isArray(payload.value) },
  );

export const MethodSchema = z
  .object({
    id: z.string(),
    code: z.string(),
    name: z.string(),
    matrix: z.string().openapi({ description: 'Base element of the alloys measured (Fe, Al, Cu, Ni, Zn …).', example: 'Fe' }),
    default_unit: z.enum(OUTPUT_UNITS).openapi({ description: 'Unit assumed for pushed values that do not say theirs.' }),
    elements: z.array(MethodElementSchema),
    drift_limits: DriftLimitsSchema,
    reporting: MethodReportingSchema,
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('Method', { description: 'An analytical method for one base matrix. Ranges, limits and σr are mass fractions in %.' });

export const MethodListSchema = listOf(MethodSchema, 'MethodList');
export const MethodListQuerySchema = paginationQuery.extend({ matrix: ElementSymbolSchema.optional() });
export const MethodIdParams = z.object({ id: z.string().min(1).max(40) });

export const CreateMethodRequestSchema = z
  .object({
    code: z
      .string()
      .trim()
      .min(1)
      .max(40)
      .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'use letters, digits, ".", "_" and "-"')
      .openapi({ example: 'FE-LA' }),
    name: z.string().trim().min(1).max(200),
    matrix: ElementSymbolSchema,
    default_unit: z.enum(OUTPUT_UNITS).default('%'),
    elements: elementList,
    drift_limits: DriftLimitsSchema.default(DEFAULT_DRIFT_LIMITS),
    reporting: MethodReportingSchema.default(DEFAULT_REPORTING),
  })
  .openapi('CreateMethodRequest');

export const UpdateMethodRequestSchema = z
  .object({
    name: z.string().trim().min(1).max(200).optional(),
    default_unit: z.enum(OUTPUT_UNITS).optional(),
    elements: elementList
      .optional()
      .openapi({ description: 'Replaces the element list. Stored results keep the settings they were computed with until recomputed.' }),
    drift_limits: DriftLimitsSchema.optional().openapi({
      description: 'Applies to standardizations run from now on; earlier runs keep their flags.',
    }),
    reporting: MethodReportingSchema.optional().openapi({
      description: 'Replaces the reporting rules; stored results keep the rules they were computed with until recomputed.',
    }),
  })
  .refine((value) => Object.keys(value).length > 0, 'give at least one of name, default_unit, elements, drift_limits, reporting')
  .openapi('UpdateMethodRequest');
