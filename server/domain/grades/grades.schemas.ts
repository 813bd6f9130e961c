import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { ElementSymbolSchema } from '../methods/methods.schemas.ts';
import { isAbove } from '../chemistry/decimal-compare.ts';

export const DECISION_RULES = ['rounding', 'absolute'] as const;
export const DecisionRuleSchema = z.enum(DECISION_RULES).openapi('DecisionRule', {
  description:
    '`rounding` (ASTM E29, ISO 80000-1 rule A): the result is rounded half to even, once, to the last place written in the limit, then compared. `absolute`: any value beyond the limit fails.',
});

const DECIMAL = /^\d+(\.\d+)?$/;
/** Refinements run on values whose own checks may have failed: compare only what is a decimal. */
const isDecimal = (value: unknown): value is string => typeof value === 'string' && DECIMAL.test(value.trim());

/** A limit as written: a JSON number would lose the trailing zeros that set the rounding place. */
export const LimitValue = z
  .string({ error: 'write limits as decimal strings such as "0.40": their written decimals set the rounding place' })
  .trim()
  .regex(DECIMAL, 'must be a non-negative decimal written as a string, e.g. "0.40"')
  .openapi({ example: '0.40' });

const ElementLimitSchema = z
  .object({ element: ElementSymbolSchema, min: LimitValue.optional(), max: LimitValue.optional() })
  .refine((limit) => limit.min !== undefined || limit.max !== undefined, 'give min, max or both')
  .refine((limit) => !isDecimal(limit.min) || !isDecimal(limit.max) || !isAbove(limit.min, limit.max), {
    message: 'min must not be above max',
    path: ['max'],
  });

export const ElementLimitOutSchema = z
  .object({ element: z.string(), min: z.string().optional(), max: z.string().optional() })
  .openapi('ElementLimit');

function uniqueElements(limits: { element: string }[], ctx: z.RefinementCtx): void {
  const seen = new Set<string>();
  limits.forEach((limit, i) => {
    if (seen.has(limit.element)) ctx.addIssue({ code: 'custom', message: `${limit.element} is listed twice`, path: [i, 'element'] });
    seen.add(limit.element);
  });
}

const code = z
  .string()
  .trim()
  .min(1)
  .max(60)
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ._/-]*$/, 'use letters, digits, spaces, ".", "_", "/" and "-"')
  .openapi({ example: 'SAE 1045' });

const definitionFields = {
  title: z.string().trim().min(1).max(200).openapi({ example: 'Medium-carbon steel, long products' }),
  standard: z.string().trim().min(1).max(200).openapi({ example: 'SAE J403' }),
  edition: z
    .string()
    .trim()
    .max(60)
    .nullable()
    .default(null)
    .openapi({ description: 'Edition or year of the standard the limits were read from.' }),
  matrix: ElementSymbolSchema,
  decision_rule: DecisionRuleSchema,
  remainder_element: ElementSymbolSchema.optional().openapi({
    description: 'The balance element, computed by difference (100 % minus the others).',
  }),
  limits: z.array(ElementLimitSchema).min(1).max(60).superRefine(uniqueElements),
  others_each: LimitValue.optional().openapi({ description: 'Maximum for each element the grade does not list (aluminium practice).' }),
  others_total: LimitValue.optional().openapi({
    description: 'Maximum for the sum of unlisted elements present at ≥ 0.010 %, each first rounded to two decimals.',
  }),
  aims: z
    .array(ElementLimitSchema)
    .max(60)
    .superRefine(uniqueElements)
    .optional()
    .openapi({ description: "The melt shop's internal windows inside the limits: outside one is a warning, not a failure." }),
  source_note: z
    .string()
    .trim()
    .max(1000)
    .optional()
    .openapi({ description: 'Where the limits come from; verify them against your licensed copy of the standard.' }),
};

export const CreateGradeRequestSchema = z.object({ code, ...definitionFields }).openapi('CreateGradeRequest');
export const UpdateGradeRequestSchema = z.object(definitionFields).openapi('UpdateGradeRequest');

export const GradeSchema = z
  .object({
    code: z.string(),
    version: z.number().int().openapi({ description: 'Starts at 1; every PUT adds one and keeps the earlier versions.' }),
    title: z.string(),
    standard: z.string(),
    edition: z.string().nullable(),
    matrix: z.string(),
    decision_rule: DecisionRuleSchema,
    remainder_element: z.string().optional(),
    limits: z.array(ElementLimitOutSchema),
    others_each: z.string().optional(),
    others_total: z.string().optional(),
    aims: z.array(ElementLimitOutSchema).optional(),
    source_note: z.string().optional(),
    created_by: z.string(),
    created_at: z.string(),
  })
  .openapi('Grade');

export const GradeListSchema = listOf(GradeSchema, 'GradeList');
export const GradeListQuerySchema = paginationQuery.extend({ matrix: ElementSymbolSchema.optional() });
export const GradeCodeParams = z.object({ code: z.string().min(1).max(60) });
export const GradeVersionParams = GradeCodeParams.extend({ version: z.coerce.number().int().min(1) });

const CompositionValueSchema = z
  .union([z.number(), z.string().max(40)])
  .openapi({ description: 'A number, or a string: "0.45", "<0.002" (below), ">1.5" (above), "n.d." (not detected).', example: 0.45 });

export const CompositionSchema = z
  .record(z.string().min(1).max(10), CompositionValueSchema)
  .refine((composition) => Object.keys(composition).length > 0, 'give at least one element')
  .openapi({
    description: 'Element symbol → value in %: a number, or a string such as "0.45", "<0.002" or ">1.5".',
    example: { C: 0.45, Mn: '0.71', S: '<0.002' },
  });

export const EvaluateRequestSchema = z.object({ composition: CompositionSchema }).openapi('EvaluateGradeRequest');
export const MatchRequestSchema = z
  .object({
    composition: CompositionSchema,
    matrix: ElementSymbolSchema.optional().openapi({ description: 'Default: the largest element of the composition.' }),
  })
  .openapi('MatchGradesRequest');
