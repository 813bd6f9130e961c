import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { RUN_RULE_NAMES, RUN_RULES, type RunRule } from './run-rules.ts';

const RULE_LIST = RUN_RULE_NAMES.map((r) => `\`${r}\`: ${RUN_RULES[r].title} (${RUN_RULES[r].source})`).join('; ');

export const RunRuleSchema = z
  .enum(RUN_RULE_NAMES as [RunRule, ...RunRule[]])
  .openapi('RunRule', { description: `A control chart run rule: ${RULE_LIST}.` });

const decimal = z.string().regex(/^\d+(\.\d+)?$/, 'a decimal number such as "0.452"');
const positiveDecimal = decimal.refine((v) => Number(v) > 0, 'must be above 0');

export const ControlLimitInputSchema = z
  .object({
    element: z.string().trim().min(1).max(3).openapi({ example: 'C' }),
    centre: decimal
      .optional()
      .openapi({ description: 'Centre line in %; omit (with sd) to establish it from the first N points.', example: '0.452' }),
    sd: positiveDecimal.optional().openapi({ description: 'Standard deviation in %.', example: '0.004' }),
    source: z.string().trim().min(1).max(500).optional().openapi({
      description: 'Where centre and SD came from (certificate, earlier chart).',
      example: 'certificate CRM 12-3, repeatability from 2025 chart',
    }),
    valid_from: z.iso.datetime({ offset: true }).optional().openapi({ description: 'When these limits start to apply (default now).' }),
  })
  .refine((v) => (v.centre === undefined) === (v.sd === undefined), 'give centre and sd together, or neither')
  .refine((v) => v.centre === undefined || v.source !== undefined, 'say where entered limits came from in source')
  .openapi('ControlLimitInput');

const kind = z.enum(['reference_material', 'in_house']).openapi('ControlSampleKind');

export const CreateControlSampleRequestSchema = z
  .object({
    instrument_id: z.string().min(1).max(40),
    method_id: z.string().min(1).max(40),
    code: z
      .string()
      .trim()
      .min(1)
      .max(100)
      .openapi({ description: 'Matched (ignoring case) against the sample code of imported control samples.', example: 'CTRL-FE-1' }),
    description: z.string().trim().max(2000).default(''),
    kind,
    elements: z.array(ControlLimitInputSchema).min(1).max(60),
    rules: z.array(RunRuleSchema).optional().openapi({ description: 'Run rules switched on (default all but nine_one_side).' }),
    baseline_n: z
      .number()
      .int()
      .min(2)
      .max(1000)
      .default(20)
      .openapi({ description: 'Points that establish limits not entered (20 or more recommended).' }),
  })
  .openapi('CreateControlSampleRequest');

export const UpdateControlSampleRequestSchema = z
  .object({
    description: z.string().trim().max(2000).optional(),
    rules: z.array(RunRuleSchema).optional(),
    limits: z
      .array(ControlLimitInputSchema)
      .max(60)
      .optional()
      .openapi({ description: 'New limits; the old ones are kept and apply until valid_from.' }),
  })
  .refine((v) => Object.keys(v).length > 0, 'give at least one of description, rules, limits')
  .openapi('UpdateControlSampleRequest');

const LimitPeriodSchema = z
  .object({
    centre: z.number(),
    sd: z.number(),
    source: z.string(),
    established: z.boolean().openapi({ description: 'Computed from the first N points rather than entered.' }),
    provisional: z.boolean().openapi({ description: 'Established from fewer than N points: points are not judged yet.' }),
    valid_from: z.string().nullable(),
    valid_to: z.string().nullable(),
  })
  .openapi('ControlLimitPeriod');

const StatusSchema = z.enum(['in_control', 'verify']).openapi('ControlStatus');

export const ControlSampleSchema = z
  .object({
    id: z.string(),
    instrument_id: z.string(),
    method_id: z.string(),
    code: z.string(),
    description: z.string(),
    kind,
    elements: z.array(z.string()),
    rules: z.array(RunRuleSchema),
    baseline_n: z.number().int(),
    limits: z.array(z.object({ element: z.string(), centre: z.string(), sd: z.string(), source: z.string(), valid_from: z.string() })),
    status: StatusSchema.openapi({ description: 'The control status of its instrument for its method.' }),
    latest_point_at: z.string().nullable(),
    created_at: z.string(),
    updated_at: z.string(),
  })
  .openapi('ControlSample');

export const ControlSampleListSchema = listOf(ControlSampleSchema, 'ControlSampleList');
export const ControlSampleListQuerySchema = paginationQuery.extend({ instrument_id: z.string().max(40).optional() });
export const ControlSampleIdParams = z.object({ id: z.string().min(1).max(40) });

export const ChartQuerySchema = z.object({
  element: z.string().trim().min(1).max(3),
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
});

const ViolationSchema = z.object({ rule: RunRuleSchema, title: z.string(), source: z.string() }).openapi('RunRuleViolation');

export const ChartSchema = z
  .object({
    control_sample_id: z.string(),
    element: z.string(),
    unit: z.literal('%'),
    provisional: z.boolean(),
    centre: z.number().nullable().openapi({ description: 'Centre line of the limits in force now.' }),
    sigma: z
      .object({
        upper_1: z.number(),
        upper_2: z.number(),
        upper_3: z.number(),
        lower_1: z.number(),
        lower_2: z.number(),
        lower_3: z.number(),
      })
      .nullable(),
    limits: z.array(LimitPeriodSchema),
    points: z.array(
      z.object({
        sample_id: z.string(),
        sample_code: z.string(),
        measured_at: z.string(),
        value: z.number(),
        burns_n: z.number().int(),
        centre: z.number().nullable(),
        sd: z.number().nullable(),
        provisional: z.boolean(),
        violations: z.array(ViolationSchema),
      }),
    ),
    moving_ranges: z.array(z.object({ sample_id: z.string(), measured_at: z.string(), value: z.number() })),
    rules: z.array(ViolationSchema.omit({ rule: true }).extend({ rule: RunRuleSchema, enabled: z.boolean() })),
  })
  .openapi('ControlChart', { description: `Rules: ${RULE_LIST}.` });

export const DispositionRequestSchema = z
  .object({
    method_id: z.string().min(1).max(40),
    cause: z.string().trim().min(1).max(2000).openapi({ example: 'electrode worn' }),
    action: z.string().trim().min(1).max(2000).openapi({ example: 'electrode re-gapped, control re-run in control' }),
  })
  .openapi('ControlDispositionRequest');

export const ControlStatusChangeSchema = z
  .object({
    id: z.string(),
    method_id: z.string(),
    status: StatusSchema,
    control_sample_id: z.string().nullable(),
    sample_id: z.string().nullable(),
    measured_at: z.string().nullable(),
    violations: z.array(z.object({ element: z.string(), rule: RunRuleSchema, title: z.string(), source: z.string() })),
    cause: z.string().nullable(),
    action: z.string().nullable(),
    created_by: z.string(),
    created_at: z.string(),
  })
  .openapi('ControlStatusChange');

export const InstrumentControlSchema = z
  .object({
    method_id: z.string(),
    status: StatusSchema,
    reason: ControlStatusChangeSchema.nullable(),
    history: z.array(ControlStatusChangeSchema),
  })
  .openapi('InstrumentControlStatus');
