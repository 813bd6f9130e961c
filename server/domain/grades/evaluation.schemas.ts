import { z } from '../../lib/zod.ts';
import { DecisionRuleSchema } from './grades.schemas.ts';

export const VerdictSchema = z.enum(['within', 'below_min', 'above_max', 'not_measured', 'undetermined']).openapi('Verdict', {
  description:
    '`undetermined`: a qualified value ("<0.05") allows both answers, so no verdict is possible; `not_measured`: the composition has no value for the element.',
});

const judgement = {
  verdict: VerdictSchema,
  value: z.string().nullable().openapi({ description: 'The value as given, e.g. "0.452" or "<0.002".' }),
  rounded: z.string().nullable().openapi({ description: 'Rounded half to even to the place of the limit (rounding rule only).' }),
  limit_min: z.string().nullable(),
  limit_max: z.string().nullable(),
  margin: z
    .string()
    .nullable()
    .openapi({ description: 'Distance to the nearest limit, ≥ 0 within and < 0 beyond; null for qualified values.' }),
};

export const ElementVerdictSchema = z.object({ element: z.string(), ...judgement }).openapi('ElementVerdict');

export const GradeEvaluationSchema = z
  .object({
    conforms: z
      .boolean()
      .nullable()
      .openapi({ description: 'true: every check passed; false: one failed; null: cannot decide (undetermined or not measured).' }),
    decision_rule: DecisionRuleSchema,
    grade: z.object({ code: z.string(), version: z.number().int() }),
    elements: z.array(ElementVerdictSchema),
    remainder: z
      .object({ element: z.string(), value: z.string(), by_difference: z.literal(true), approximate: z.boolean() })
      .optional()
      .openapi({ description: 'The balance element, 100 % minus every other value: computed, not measured.' }),
    others: z
      .object({ each: z.array(ElementVerdictSchema), total: z.object(judgement).optional() })
      .optional()
      .openapi({
        description:
          'Elements the grade does not list: each against `others_each`; the sum of those ≥ 0.010 %, each rounded to two decimals, against `others_total`.',
      }),
    aims: z.array(
      z.object({
        element: z.string(),
        value: z.string().nullable(),
        aim_min: z.string().nullable(),
        aim_max: z.string().nullable(),
        within: z.boolean().nullable(),
      }),
    ),
    warnings: z.array(z.string()),
  })
  .openapi('GradeEvaluation');

export const GradeMatchListSchema = z
  .object({
    matrix: z.string().nullable(),
    data: z.array(
      z.object({
        grade: z.object({ code: z.string(), version: z.number().int(), title: z.string() }),
        decision_rule: DecisionRuleSchema,
        smallest_margin: z.string().nullable(),
        warnings: z.array(z.string()),
      }),
    ),
  })
  .openapi('GradeMatchList');
