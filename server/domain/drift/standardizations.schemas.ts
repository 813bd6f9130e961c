import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { unitInput } from '../chemistry/units.schemas.ts';
import { ElementSymbolSchema } from '../methods/methods.schemas.ts';
import { PushedValueSchema } from '../samples/samples.schemas.ts';
import { CORRECTION_MODES } from './correction-math.ts';
import { CORRECTION_FLAGS } from './correction-flags.ts';
import { ReferenceKindSchema } from './reference-materials.schemas.ts';

const CorrectionModeSchema = z.enum(CORRECTION_MODES).openapi('CorrectionMode', {
  description:
    "`two_point`: a `high` and a `low` reference; slope α = (H⁰ − L⁰)/(H − L), offset β = L⁰ − α·L. `one_point_factor`: one reference; α = N/M, β = 0. `one_point_offset`: one reference; α = 1, β = N − M. `type`: one reference of kind `type` (similar composition to the samples), multiplicative, on top of the set in force: t = N/(α₀·M + β₀), stored as α = t·α₀, β = t·β₀. (H⁰, L⁰, N nominal; H, L, M the mean of the reference's burns.)",
});
const CorrectionFlagSchema = z
  .enum(CORRECTION_FLAGS)
  .openapi('CorrectionFlag', { description: '`ok`, `warn` (look before activating) or `fail` (activation needs an override reason).' });
const StandardizationStatusSchema = z.enum(['draft', 'activated']).openapi('StandardizationStatus');

const ref = z.object({ id: z.string(), code: z.string() });

const SourceFileSchema = z
  .object({
    name: z.string().trim().min(1).max(255),
    sha256: z
      .string()
      .regex(/^[0-9a-f]{64}$/, 'the SHA-256 of the file as 64 lowercase hex digits')
      .openapi({ description: 'As answered by `POST /instruments/{id}/standardizations/file`.' }),
  })
  .openapi('StandardizationSourceFile');

const ElementLevelSchema = z
  .object({
    reference_material_id: z.string(),
    code: z.string(),
    kind: ReferenceKindSchema,
    nominal: z.string().nullable().openapi({ description: 'Certified value, %; null when the reference gives none.' }),
    measured: z
      .string()
      .nullable()
      .openapi({ description: "Exact mean of the reference's numeric burns, %; null when none measured the element." }),
    n: z.number().int().openapi({ description: 'Numeric burns behind `measured`.' }),
  })
  .openapi('ElementLevel');

const ElementCorrectionSchema = z
  .object({
    element: z.string().openapi({ example: 'Mn' }),
    slope: z.string().nullable().openapi({
      description: 'α as a decimal string (20 significant digits); null when this set does not correct the element (see reasons).',
      example: '1.0213',
    }),
    offset: z.string().nullable().openapi({ description: 'β in %, decimal string (20 decimal places at most).', example: '-0.0041' }),
    previous_slope: z
      .string()
      .nullable()
      .openapi({ description: "α of the set in force at the run's measurement time; null when none corrected the element." }),
    previous_offset: z.string().nullable(),
    slope_change: z.string().nullable().openapi({
      description:
        'How far the slope moved from the set before: α / previous_slope − 1 (0.08 = +8 %), 20 significant digits; null without both.',
      example: '0.0123',
    }),
    offset_change: z
      .string()
      .nullable()
      .openapi({ description: 'offset − previous_offset, %, exact; null without both.', example: '-0.0004' }),
    flag: CorrectionFlagSchema,
    reasons: z.array(z.string()).openapi({ description: 'One sentence per finding, each explaining itself; empty when `ok`.' }),
    levels: z.array(ElementLevelSchema).openapi({ description: 'Nominal and measured value of each reference for this element.' }),
  })
  .openapi('ElementCorrection');

const MeasuredCellSchema = z.object({
  value: z.string().nullable().openapi({ description: 'Canonical value, %, exact decimal string; null for n.d.' }),
  qualifier: z.enum(['<', '>', 'nd']).nullable(),
  raw: z.string(),
  raw_unit: z.string(),
});

const StandardizationMeasurementSchema = z
  .object({
    reference_material: z.object({ id: z.string(), code: z.string(), name: z.string(), kind: ReferenceKindSchema }),
    burns: z.array(z.object({ values: z.record(z.string(), MeasuredCellSchema) })),
    means: z.record(z.string(), z.string()).openapi({ description: 'Exact mean of the numeric burns per element, %.' }),
  })
  .openapi('StandardizationMeasurement');

export const StandardizationSchema = z
  .object({
    id: z.string().openapi({ description: 'Also the id of the correction set once activated.' }),
    instrument: ref,
    method: ref,
    mode: CorrectionModeSchema,
    status: StandardizationStatusSchema,
    flag: CorrectionFlagSchema.openapi({ description: 'The worst element flag.' }),
    in_force: z.boolean().openapi({ description: 'True when this is the set in force now for its instrument and method.' }),
    measured_at: z.string().openapi({ format: 'date-time' }),
    note: z.string().nullable(),
    source_file: SourceFileSchema.nullable().openapi({
      description: 'The result file the burns were read from; null when they were typed.',
    }),
    base_set_id: z.string().nullable().openapi({ description: 'For `type`: the set in force that this one was computed on top of.' }),
    activation: z
      .object({
        activated_at: z.string().openapi({ format: 'date-time' }),
        activated_by: z.string(),
        effective_from: z.string().openapi({ format: 'date-time' }),
        override_reason: z.string().nullable().openapi({ description: 'Given when an element was flagged `fail`.' }),
      })
      .nullable(),
    measurements: z.array(StandardizationMeasurementSchema),
    corrections: z.array(ElementCorrectionSchema),
    created_by: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('Standardization', { description: 'A standardization run and the correction set it computed, element by element.' });

export const CreatedStandardizationSchema = StandardizationSchema.extend({
  warnings: z.array(z.object({ code: z.enum(['control_in_control']), message: z.string() }).openapi('StandardizationWarning')).openapi({
    description: 'Advice, never a block: `control_in_control` when the control of this instrument and method is in control (ASTM E1329).',
  }),
}).openapi('CreatedStandardization');

export const StandardizationListSchema = listOf(StandardizationSchema, 'StandardizationList');

const MeasurementInput = z
  .object({
    reference_material_id: z.string().min(1).max(40),
    burns: z
      .array(z.object({ values: z.record(z.string().min(1).max(10), PushedValueSchema).openapi({ example: { C: 0.452, Mn: 1.498 } }) }))
      .min(1)
      .max(20)
      .openapi({ description: "The reference's burns, as measured (uncorrected)." }),
  })
  .openapi('StandardizationMeasurementInput');

export const CreateStandardizationRequestSchema = z
  .object({
    method_id: z.string().min(1).max(40),
    mode: CorrectionModeSchema,
    measured_at: z.iso
      .datetime({ offset: true })
      .optional()
      .openapi({ description: 'When the references were sparked; defaults to now. Not in the future.' }),
    unit: unitInput("Unit of every burn value; defaults to the method's default unit.").optional(),
    note: z.string().trim().max(500).optional(),
    source_file: SourceFileSchema.optional().openapi({
      description: 'The result file the burns were read from (name and SHA-256), recorded with the run and in the audit trail.',
    }),
    measurements: z.array(MeasurementInput).min(1).max(2),
  })
  .openapi('CreateStandardizationRequest');

export const ActivateStandardizationRequestSchema = z
  .object({
    effective_from: z.iso.datetime({ offset: true }).optional().openapi({
      description:
        'When the set takes effect; defaults to the activation time. A later time schedules it; an earlier one is refused (422): results already stored are never changed by an activation.',
    }),
    override_reason: z
      .string()
      .trim()
      .min(3, 'say why, in a few words')
      .max(1000)
      .optional()
      .openapi({ description: 'Required when an element is flagged `fail`; recorded with the activation and in the audit trail.' }),
  })
  .openapi('ActivateStandardizationRequest');

export const StandardizationListQuerySchema = paginationQuery.extend({
  method_id: z.string().max(40).optional(),
  status: StandardizationStatusSchema.optional(),
  flag: CorrectionFlagSchema.optional(),
});
export const InstrumentStandardizationParams = z.object({ id: z.string().min(1).max(40) });
export const StandardizationIdParams = z.object({ id: z.string().min(1).max(40) });

const DriftPointSchema = z
  .object({
    standardization_id: z.string(),
    method: ref,
    mode: CorrectionModeSchema,
    measured_at: z.string().openapi({ format: 'date-time' }),
    slope: z.string().nullable(),
    offset: z.string().nullable(),
    flag: CorrectionFlagSchema,
    reasons: z.array(z.string()),
    status: StandardizationStatusSchema,
    effective_from: z.string().nullable().openapi({ format: 'date-time' }),
    in_force: z.boolean(),
  })
  .openapi('DriftPoint');

export const DriftHistorySchema = z
  .object({
    instrument: ref,
    element: z.string(),
    points: z.array(DriftPointSchema).openapi({ description: 'One point per standardization run, oldest first.' }),
  })
  .openapi('DriftHistory');

export const DriftQuerySchema = z.object({
  element: ElementSymbolSchema,
  method_id: z
    .string()
    .max(40)
    .optional()
    .openapi({ description: 'Only runs of this method (recommended: slopes of different methods are not comparable).' }),
  since: z.iso.datetime({ offset: true }).optional(),
  until: z.iso.datetime({ offset: true }).optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200).openapi({ description: 'The latest runs, at most this many (1–1000).' }),
});

export const CorrectionsInForceSchema = z
  .object({
    instrument: ref,
    at: z.string().openapi({ format: 'date-time', description: 'The time the sets are in force at.' }),
    data: z.array(z.object({ method: ref, set: StandardizationSchema })).openapi({
      description: 'One entry per method that has a set in force; methods without one are left out (their results are not corrected).',
    }),
  })
  .openapi('CorrectionsInForce');

export const CorrectionsQuerySchema = z.object({
  at: z.iso.datetime({ offset: true }).optional().openapi({ description: 'Defaults to now.' }),
});
