// Reading the result file in which reference materials were sparked: the request (multipart) and
// what comes back — each sample of the file with its burns in %, the reference material its code
// matches, and when it was measured. Nothing is stored; the run is then created from these burns.
import { z } from '../../lib/zod.ts';
import { ImportReportSchema } from '../imports/import-report.ts';
import { ReferenceKindSchema } from './reference-materials.schemas.ts';

/** A standardization file holds a few references' burns; anything larger is not one. */
export const STANDARDIZATION_FILE_MAX_BYTES = 1024 * 1024;

export const ReadStandardizationFileRequestSchema = z
  .object({
    file: z
      .custom<Express.Multer.File>(
        (value) => typeof value === 'object' && value !== null && 'buffer' in value,
        'attach the result file as the multipart field "file"',
      )
      .openapi({
        type: 'string',
        format: 'binary',
        description: 'The result file (CSV or other delimited text), as the instrument wrote it.',
      }),
    method_id: z.string().min(1).max(40),
    profile_id: z.string().min(1).max(40).optional().openapi({
      description: 'An import profile describing the layout (the same profiles the sample import uses); without it the layout is detected.',
    }),
  })
  .openapi('ReadStandardizationFileRequest');

const FileBurnSchema = z.object({
  line: z.number().int().openapi({ description: 'Physical line of the file the burn was read from.' }),
  burn_number: z.number().int(),
  measured_at: z.string().nullable().openapi({ format: 'date-time' }),
  values: z.record(z.string(), z.string()).openapi({
    description:
      'Element → value in %, written as a burn value of a standardization request accepts it: "0.452", "<0.002", ">1.5" or "n.d.". Only the method\'s elements.',
    example: { C: '0.452', Mn: '1.498', S: '<0.002' },
  }),
});

const FileSampleSchema = z
  .object({
    sample_code: z.string(),
    first_line: z.number().int(),
    measured_at: z
      .string()
      .nullable()
      .openapi({ format: 'date-time', description: 'The latest burn time of the sample; null when the file gives no times.' }),
    reference_material: z.object({ id: z.string(), code: z.string(), name: z.string(), kind: ReferenceKindSchema }).nullable().openapi({
      description:
        'The reference material whose code matches the sample code (ignoring case, spaces, "-", "_", "." and "/"), of the method\'s matrix; null when none does (map it yourself).',
    }),
    burns: z.array(FileBurnSchema),
    rejected: z.number().int().openapi({ description: 'Lines of this sample that could not be read (listed in `rejected`).' }),
  })
  .openapi('StandardizationFileSample');

export const StandardizationFileReadingSchema = z
  .object({
    file: z.object({ name: z.string(), size_bytes: z.number().int(), sha256: z.string() }),
    method: z.object({ id: z.string(), code: z.string() }),
    measured_at: z.string().nullable().openapi({
      format: 'date-time',
      description: 'The latest burn time among the samples matched to a reference material (else among all samples); null without times.',
    }),
    samples: z.array(FileSampleSchema),
    elements_not_in_method: z
      .array(z.string())
      .openapi({ description: 'Element columns of the file the method does not measure: left out of the burns.' }),
    missing_elements: z
      .array(z.string())
      .openapi({ description: 'Elements of the method the file has no column for: they will not be corrected from this file.' }),
    time_zone: ImportReportSchema.shape.layout.shape.time_zone,
    warnings: ImportReportSchema.shape.warnings,
    rejected: ImportReportSchema.shape.warnings.openapi({ description: 'Lines that could not be read; their burns are left out.' }),
  })
  .openapi('StandardizationFileReading');
