import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { OUTPUT_UNITS } from '../chemistry/units.ts';
import { unitInput } from '../chemistry/units.schemas.ts';
import { GradeEvaluationSchema } from '../grades/evaluation.schemas.ts';
import { RESULT_FLAG_NAMES, RESULT_FLAGS, type ResultFlag } from '../chemistry/result-rules.ts';
import { SAMPLE_TEXT_LIMITS } from './sample-limits.ts';

/** The flags a result can carry; `x-enum-descriptions` says what each means (the console shows these). */
const ResultFlagSchema = z
  .enum(RESULT_FLAG_NAMES as [ResultFlag, ...ResultFlag[]])
  .openapi('ResultFlag', { description: 'A flag on an element result.', 'x-enum-descriptions': RESULT_FLAGS });

export const SAMPLE_KINDS = ['preliminary', 'final', 'ladle', 'incoming', 'control'] as const;
const SampleKindSchema = z.enum(SAMPLE_KINDS).openapi('SampleKind');
const SampleStatusSchema = z.enum(['draft', 'released']).openapi('SampleStatus');
const OutputUnitSchema = z
  .enum(OUTPUT_UNITS)
  .openapi('OutputUnit', { description: '`%` (mass fraction in percent, the default), `ppm` (mg/kg) or `ppb` (µg/kg).' });

const text = (max: number) => z.string().trim().min(1).max(max);
const fieldsSchema = z
  .record(z.string().trim().min(1).max(SAMPLE_TEXT_LIMITS.fieldName), z.string().max(SAMPLE_TEXT_LIMITS.fieldValue))
  .refine((fields) => Object.keys(fields).length <= SAMPLE_TEXT_LIMITS.fields, `at most ${SAMPLE_TEXT_LIMITS.fields} identification fields`)
  .openapi({ description: 'Further identification fields (furnace, customer order …).', example: { furnace: 'EAF-2' } });

export const PushedValueSchema = z.union([z.number(), z.string().max(SAMPLE_TEXT_LIMITS.value)]).openapi({
  description:
    'A number, or a string: "0.75", "<0.0005" (below), ">1.5" (above), "n.d." (not detected). Finite, not negative and at most 100 % once converted to %. A JSON number is read at its shortest decimal form (0.145 is 0.145); a JSON number cannot carry more than about 17 significant digits, so send a string when every digit matters, e.g. "0.12345678901234567891" (20 digits, kept exactly).',
  example: 0.75,
});

export const PushedBurnSchema = z
  .object({
    measured_at: z.iso.datetime({ offset: true }).optional().openapi({ description: 'When the burn was sparked (ISO 8601).' }),
    values: z
      .record(z.string().min(1).max(10), PushedValueSchema)
      .openapi({ description: 'Element symbol → value. Symbols in any case (MN → Mn).', example: { C: 0.452, Mn: 0.71, S: '<0.002' } }),
  })
  .openapi('PushedBurn');

export const PushSampleRequestSchema = z
  .object({
    sample_code: text(SAMPLE_TEXT_LIMITS.identification).openapi({ example: 'K24-0412-F1' }),
    heat: text(SAMPLE_TEXT_LIMITS.identification).optional().openapi({ example: 'K24-0412' }),
    grade: text(SAMPLE_TEXT_LIMITS.identification).optional().openapi({ example: 'SAE 1045' }),
    kind: SampleKindSchema.optional(),
    control_sample_id: z.string().min(1).max(40).optional().openapi({
      description: 'The control sample this is a measurement of (kind must be `control`); it is then judged on that control chart.',
    }),
    instrument_id: z.string().min(1).max(40),
    method_id: z.string().min(1).max(40),
    fields: fieldsSchema.optional(),
    unit: unitInput(
      "Unit of every value in `burns`; defaults to the method's default unit. Every value must be at most 100 % once converted.",
    ).optional(),
    burns: z.array(PushedBurnSchema).min(1).max(50),
  })
  .openapi('PushSampleRequest');

export const PushSampleBatchRequestSchema = z
  .object({ samples: z.array(PushSampleRequestSchema).min(1).max(500) })
  .openapi('PushSampleBatchRequest', { description: 'Up to 500 samples, stored in one transaction: all or none.' });

const ResultSchema = z
  .object({
    element: z.string().openapi({ example: 'Mn' }),
    mean: z.number().nullable().openapi({ description: 'Mean of the included burns after drift correction, in `unit`.' }),
    sd: z.number().nullable().openapi({ description: 'Sample standard deviation (n − 1); null when n < 2.' }),
    rsd: z.number().nullable().openapi({ description: 'Relative standard deviation, %; null when n < 2 or the mean is 0.' }),
    n: z.number().int().openapi({ description: 'Number of numeric burn values averaged.' }),
    min: z.number().nullable(),
    max: z.number().nullable(),
    unit: OutputUnitSchema,
    raw_mean: z.number().nullable().openapi({ description: 'Mean before drift correction.' }),
    reported: z.string().nullable().openapi({
      description:
        "The mean rounded half to even (ASTM E29), in one step from the full-precision mean in `unit`, to `decimals` places (the reporting step), as a string; with `qualifier` when qualified. In % the step is the method's (2 decimals → 0.01 %); in ppm and ppb it is whole ppm (ppb), or the method's step when that is finer — the value is rounded from the mean in that unit, never the % value scaled (a mean of 5943 ppm is reported 5943, not 5900). The method's repeatability, not the step, says how far the value can be relied on.",
      example: '0.71',
    }),
    qualifier: z
      .enum(['<', '>'])
      .nullable()
      .openapi({ description: '`<` below the detection limit or working range, `>` above the working range.' }),
    decimals: z.number().int().openapi({
      description:
        "Decimal places of `reported` in `unit` (the reporting step is 10^−decimals): the method's decimals in %; in ppm max(0, decimals in % − 4), in ppb max(0, decimals in % − 7), so ppm and ppb are never rounded coarser than a whole unit.",
    }),
    flags: z.array(ResultFlagSchema).openapi({ description: 'See the result flags in the operation description.' }),
    repeatability: z.object({ range: z.number(), critical_range: z.number(), exceeded: z.boolean() }).nullable().openapi({
      description: "ISO 5725-6 check of the burns' range against f(n)·σr, when the method sets σr and there are at least two burns.",
    }),
  })
  .openapi('ElementResult');

const BurnValueSchema = z
  .object({
    value: z.number().nullable().openapi({ description: 'Canonical value in the requested unit; null for "n.d.".' }),
    qualifier: z.enum(['<', '>', 'nd']).nullable(),
    raw: z.string().openapi({ description: 'The value exactly as received.' }),
    raw_unit: z.string().openapi({ description: 'The unit it was received in.' }),
    corrected: z
      .object({ value: z.number().nullable(), qualifier: z.enum(['<', '>', 'nd']).nullable() })
      .nullable()
      .openapi({
        description:
          'The value after drift correction (slope·value + offset), in the requested unit; null when no correction set applied to this burn.',
      }),
  })
  .openapi('BurnValue');

const BurnSchema = z
  .object({
    number: z.number().int(),
    measured_at: z.string().nullable().openapi({ format: 'date-time' }),
    excluded: z.boolean(),
    exclusion: z.object({ reason: z.string(), by: z.string(), at: z.string() }).nullable(),
    source_line: z.number().int().nullable().openapi({ description: 'Line of the imported file this burn came from.' }),
    correction_set_id: z
      .string()
      .nullable()
      .openapi({ description: 'The correction set (standardization) applied to this burn; null when none.' }),
    values: z.record(z.string(), BurnValueSchema),
  })
  .openapi('Burn');

const ref = z.object({ id: z.string(), code: z.string() });

const SampleCorrectionSchema = z
  .object({
    set_id: z.string().nullable().openapi({
      description:
        'The correction set applied to every corrected burn; null when none was (recomputed without correction) or when burns measured across an activation used different sets (see `set_ids`).',
    }),
    set_ids: z.array(z.string()).openapi({ description: 'Every correction set applied to the burns, in burn order.' }),
    applied_to: z.literal('concentration').openapi({
      description:
        'Result files and pushes carry concentrations, not intensity ratios, so slope·x + offset is applied to the concentration of each burn (valid where the analytical curve is linear).',
    }),
    selection: z.enum(['measurement_time', 'requested']).openapi({
      description:
        "`measurement_time`: at ingest, each burn got the set in force for the instrument and method at its measurement time (else the sample's creation time). `requested`: recomputed on request against the set named (or none), with a reason.",
    }),
    reason: z.string().nullable().openapi({ description: 'Why the sample was recomputed (selection `requested`).' }),
    recomputed_by: z.string().nullable(),
    recomputed_at: z.string().nullable().openapi({ format: 'date-time' }),
  })
  .openapi('SampleCorrection', {
    description: 'Which drift correction produced the results. Raw values and `raw_mean` are always kept, so results can be recomputed.',
  });

const SampleSummarySchema = z
  .object({
    id: z.string(),
    sample_code: z.string(),
    heat: z.string().nullable(),
    grade: z.string().nullable(),
    kind: SampleKindSchema.nullable(),
    status: SampleStatusSchema,
    instrument: ref,
    method: ref,
    fields: z.record(z.string(), z.string()),
    source: z.enum(['push', 'import']),
    import_id: z.string().nullable(),
    burn_count: z.number().int(),
    flags: z.array(ResultFlagSchema).openapi({ description: 'Every flag raised on any element result.' }),
    results: z.array(ResultSchema),
    correction: SampleCorrectionSchema.nullable().openapi({
      description: 'The drift correction behind `results`; null when no correction set was in force for any burn.',
    }),
    conformance: GradeEvaluationSchema.nullable().openapi({
      description:
        'The verdict against the grade the sample names (GET /grades/{code}), judged from the corrected mean of each element at full precision, and the grade version used. Draft samples follow the latest version; null when the sample names no grade defined here. A verdict supports, and never replaces, release under your laboratory’s accredited procedures.',
    }),
    revision: z.number().int().openapi({ description: '1 as first stored and released; each amendment adds one.' }),
    release: z
      .object({
        by: z.string(),
        at: z.string().openapi({ format: 'date-time' }),
        comment: z.string().nullable(),
        concession: z.boolean().openapi({ description: 'Released although it did not conform to its grade, or could not be judged.' }),
      })
      .nullable()
      .openapi({ description: 'Who authorised the results and when; null while the sample is a draft.' }),
    created_by: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('SampleSummary');

export const SampleSchema = SampleSummarySchema.extend({
  burns: z.array(BurnSchema),
  provenance: z.object({
    source: z.enum(['push', 'import']),
    import_id: z.string().nullable(),
    file_sha256: z.string().nullable(),
    file_name: z.string().nullable(),
    lines: z.array(z.number().int()).openapi({ description: 'File lines of the burns, for imported samples.' }),
  }),
}).openapi('Sample');

export const SampleListSchema = listOf(SampleSummarySchema, 'SampleList');
export const SampleBatchResponseSchema = z.object({ data: z.array(SampleSchema) }).openapi('SampleBatch');

export const UnitQuerySchema = z.object({ unit: OutputUnitSchema.default('%') });
export const SampleIdParams = z.object({ id: z.string().min(1).max(40) });
export const BurnParams = z.object({ id: z.string().min(1).max(40), n: z.coerce.number().int().min(1).max(1000) });

export const SetBurnExclusionRequestSchema = z
  .object({
    excluded: z.boolean(),
    reason: z.string().trim().min(3, 'say why, in a few words').max(500),
  })
  .openapi('SetBurnExclusionRequest', {
    description: 'Exclude a burn from the statistics (it is never deleted), or include it again. The reason is recorded either way.',
  });

/** A time with any offset, turned into the stored form (ISO 8601 UTC) so text comparison is time comparison. */
const utcTime = z.iso
  .datetime({ offset: true })
  .transform((value) => new Date(value).toISOString())
  .openapi({ type: 'string', format: 'date-time' });

export const SampleListQuerySchema = paginationQuery.extend({
  heat: z.string().max(100).optional(),
  grade: z.string().max(100).optional(),
  sample_code: z.string().max(100).optional(),
  instrument_id: z.string().max(40).optional(),
  method_id: z.string().max(40).optional(),
  import_id: z.string().max(40).optional(),
  status: SampleStatusSchema.optional(),
  kind: SampleKindSchema.optional(),
  exclude_kind: SampleKindSchema.optional().openapi({
    description:
      'Leave out samples of this kind (samples without a kind stay), e.g. `control` for a list of heats and lots without control-sample points.',
  }),
  flag: z.string().max(60).optional().openapi({ description: 'Only samples with this flag on some element.' }),
  conforms: z.enum(['true', 'false', 'undecided']).optional().openapi({
    description: 'Only samples whose verdict against their grade is this (`undecided`: a value could not be judged or was not measured).',
  }),
  created_from: utcTime.optional(),
  created_to: utcTime.optional(),
  updated_since: utcTime.optional().openapi({
    description:
      'Samples changed at or after this time; the list is then ordered oldest change first, so a client can resume from its last `updated_at`.',
  }),
  unit: OutputUnitSchema.default('%'),
});

export const ReleaseRequestSchema = z
  .object({
    comment: z.string().trim().min(1).max(2000).optional(),
    accept_nonconforming: z
      .boolean()
      .default(false)
      .openapi({ description: 'Release a sample that does not conform (or could not be judged) as a concession; needs a comment.' }),
    acknowledge_control: z
      .object({ comment: z.string().trim().min(1).max(2000) })
      .optional()
      .openapi({
        description:
          'Needed while the instrument is `verify` for the method (a control point broke a run rule) and the sample was measured after that point: say how the result was checked. Recorded in the audit trail with the release.',
      }),
  })
  .openapi('ReleaseRequest');

export const ReleaseBatchRequestSchema = ReleaseRequestSchema.extend({
  sample_ids: z
    .array(z.string().min(1).max(40))
    .min(1)
    .max(200)
    .refine((ids) => new Set(ids).size === ids.length, 'list each sample once'),
}).openapi('ReleaseBatchRequest');

const burnNumbers = z.array(z.number().int().min(1).max(1000)).max(50);

export const AmendmentRequestSchema = z
  .object({
    reason: z.string().trim().min(3, 'say why, in a few words').max(2000),
    exclude_burns: burnNumbers.optional(),
    include_burns: burnNumbers.optional(),
    heat: text(SAMPLE_TEXT_LIMITS.identification).nullable().optional(),
    grade: text(SAMPLE_TEXT_LIMITS.identification)
      .nullable()
      .optional()
      .openapi({ description: 'Regrading: the verdict is judged again against this grade.' }),
    fields: fieldsSchema.optional().openapi({ description: 'Replaces every custom field.' }),
  })
  .refine(
    (a) => [a.exclude_burns?.length, a.include_burns?.length, a.heat, a.grade, a.fields].some((v) => v !== undefined && v !== 0),
    'change at least one thing',
  )
  .refine((a) => !(a.exclude_burns ?? []).some((n) => (a.include_burns ?? []).includes(n)), {
    message: 'a burn cannot be excluded and included at once',
    path: ['include_burns'],
  })
  .openapi('AmendmentRequest');

export const RevisionParams = SampleIdParams.extend({ n: z.coerce.number().int().min(1).max(100_000) });

export const RevisionListSchema = z
  .object({
    data: z.array(
      z.object({
        revision: z.number().int(),
        reason: z.string().nullable().openapi({ description: 'Why it was amended; null for revision 1, the release.' }),
        by: z.string(),
        at: z.string().openapi({ format: 'date-time' }),
        changed_elements: z.array(z.object({ element: z.string(), before: z.string().nullable(), after: z.string().nullable() })),
      }),
    ),
  })
  .openapi('SampleRevisionList');
