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
        columns: z.array(
          z.object({
            header: z.string(),
            role: z.string(),
            element: z.string().optional(),
            unit: z.string().optional(),
            field: z.string().optional().openapi({ description: 'Role `field`: the key the column is stored under in `fields`.' }),
            source: z
              .enum(['profile', 'auto'])
              .optional()
              .openapi({ description: '`profile`: the import profile says how to read it; `auto`: recognised from the header.' }),
            kept: z.boolean().optional().openapi({ description: "True when the profile's `keep_columns` confirms the automatic reading." }),
            attention: z
              .object({ code: z.enum(['computed_index', 'balance_element', 'not_in_method']), message: z.string() })
              .optional()
              .openapi({
                description:
                  "This reading is often wrong and no profile decides it: `computed_index` (`CE` read as cerium, usually the carbon equivalent), `balance_element` (the method's base element, usually printed as the balance), `not_in_method` (an element the method does not list). The same text is in `warnings` (code = attention code). Decide in an import profile: `ignore_columns`, `element_columns`, `columns.fields` or `keep_columns`.",
              }),
          }),
        ),
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
    flag_summary: z
      .array(
        z.object({
          element: z.string().nullable().openapi({ description: 'Null for a flag of the whole sample (such as sum_above_100).' }),
          flag: z.string().openapi({ description: 'A result flag (see GET /samples/{id}).', example: 'repeatability_exceeded' }),
          samples: z.number().int().openapi({ description: 'How many of the created samples carry it.' }),
        }),
      )
      .optional()
      .openapi({
        description:
          'Result flags of the created samples, per element (method order, then by flag): how many samples carry each. Absent in reports stored before it was added.',
      }),
    warnings: z.array(ImportIssueSchema),
    rejected: z.array(ImportIssueSchema).openapi({
      description:
        'Lines that were not imported, with the reason (per-sample mode only; in all-or-nothing mode any of them stops the import).',
    }),
  })
  .openapi('ImportReport');

export type ImportReport = z.infer<typeof ImportReportSchema>;
export type ImportIssue = z.infer<typeof ImportIssueSchema>;
