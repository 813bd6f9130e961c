import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { ImportReportSchema } from './import-report.ts';

const IMPORT_MODES = ['all_or_nothing', 'per_sample'] as const;

export const ImportSchema = z
  .object({
    id: z.string(),
    instrument_id: z.string(),
    method_id: z.string(),
    profile_id: z.string().nullable(),
    file: z.object({
      name: z.string(),
      content_type: z.string(),
      size_bytes: z.number().int(),
      sha256: z.string().openapi({ description: 'SHA-256 of the raw bytes, hex.' }),
    }),
    mode: z.enum(IMPORT_MODES),
    report: ImportReportSchema,
    created_by: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('Import');

export const ImportListSchema = listOf(ImportSchema, 'ImportList');
export const ImportListQuerySchema = paginationQuery.extend({ instrument_id: z.string().max(40).optional() });
export const ImportIdParams = z.object({ id: z.string().min(1).max(40) });

/** Multer puts the file on req.file; copyUploadedFile() moves it onto the body so one schema checks all. */
const uploadedFile = z
  .custom<Express.Multer.File>(
    (value) => typeof value === 'object' && value !== null && 'buffer' in value,
    'attach the result file as the multipart field "file"',
  )
  .openapi({ type: 'string', format: 'binary', description: 'The result file (CSV or other delimited text).' });

const uploadFields = {
  file: uploadedFile,
  instrument_id: z.string().min(1).max(40),
  method_id: z.string().min(1).max(40),
  profile_id: z
    .string()
    .min(1)
    .max(40)
    .optional()
    .openapi({ description: 'An import profile describing the layout; without it the layout is detected.' }),
};

export const ImportUploadSchema = z
  .object({
    ...uploadFields,
    mode: z.enum(IMPORT_MODES).default('all_or_nothing').openapi({
      description:
        '`all_or_nothing` (default): any broken value rejects the whole file (422 naming line and column). `per_sample`: samples with a broken line are left out and listed in `report.rejected`; the rest is imported.',
    }),
  })
  .openapi('ImportUpload');

export const ImportPreviewRequestSchema = z.object(uploadFields).openapi('ImportPreviewRequest');

export const ImportPreviewSchema = z
  .object({
    layout: ImportReportSchema.shape.layout,
    counts: z.object({
      rows: z.number().int(),
      samples: z.number().int(),
      burns: z.number().int(),
      values: z.number().int(),
      samples_with_rejected_lines: z.number().int().openapi({
        description:
          'Samples with at least one line that cannot be read: an all-or-nothing import refuses the file, a per-sample import leaves them out.',
      }),
    }),
    samples: z
      .array(
        z.object({
          sample_code: z.string(),
          heat: z.string().nullable(),
          grade: z.string().nullable(),
          kind: z.string().nullable(),
          first_line: z.number().int(),
          burns: z.array(
            z.object({
              line: z.number().int(),
              burn_number: z.number().int(),
              measured_at: z.string().nullable(),
              values: z.record(z.string(), z.string()),
            }),
          ),
        }),
      )
      .openapi({ description: 'The first 20 samples as they would be stored (values as written, with their qualifier).' }),
    warnings: ImportReportSchema.shape.warnings,
    rejected: ImportReportSchema.shape.rejected,
    duplicate_of: z
      .string()
      .nullable()
      .openapi({ description: 'An earlier import of exactly these bytes; uploading them again would return it and create nothing.' }),
  })
  .openapi('ImportPreview');
