import { z } from '../../lib/zod.ts';

const ImportIssueSchema = z
  .object({
    line: z.number().int().optional().openapi({ description: 'Physical line of the file (1 = first line, the header counts).' }),
    column: z.string().optional().openapi({ description: 'Header of the column concerned.' }),
    message: z.string(),
    code: z.string().openapi({ example: 'bad_value' }),
  })
  .openapi('ImportIssue');

export const ImportReportSchema = z
  .object({
    layout: z
      .object({
        encoding: z.string(),
        delimiter: z.string(),
        decimal_separator: z.string(),
        layout: z.enum(['wide', 'long']),
        time_zone: z.string().nullable().openapi({
          description:
            "What times written without a UTC offset were read in: the profile's `time.time_zone` or `time.utc_offset`, else `UTC` (with a warning); null when the file has no time column.",
          example: 'Europe/Berlin',
        }),
        columns: z.array(z.object({ header: z.string(), role: z.string(), element: z.string().optional(), unit: z.string().optional() })),
      })
      .openapi({ description: 'How the file was read.' }),
    counts: z.object({
      rows: z.number().int(),
      samples_created: z.number().int(),
      samples_rejected: z.number().int().openapi({
        description:
          'Samples left out because a line of theirs was rejected (a sample whose every line was rejected counts in lines_rejected only).',
      }),
      lines_rejected: z.number().int(),
      burns: z.number().int(),
      values: z.number().int(),
    }),
    sample_ids: z.array(z.string()),
    warnings: z.array(ImportIssueSchema),
    rejected: z.array(ImportIssueSchema).openapi({
      description:
        'Lines that were not imported, with the reason (per-sample mode only; in all-or-nothing mode any of them stops the import).',
    }),
  })
  .openapi('ImportReport');

export type ImportReport = z.infer<typeof ImportReportSchema>;
export type ImportIssue = z.infer<typeof ImportIssueSchema>;
