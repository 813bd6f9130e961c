import { z } from '../../lib/zod.ts';
import { SAMPLE_TEXT_LIMITS } from './sample-limits.ts';

const SampleFieldSchema = z
  .object({
    key: z.string().trim().min(1).max(SAMPLE_TEXT_LIMITS.fieldName).openapi({
      description: 'The key as samples carry it in `fields` (matched exactly, e.g. `furnace`).',
      example: 'cast_station',
    }),
    label: z.string().trim().min(1).max(100).openapi({ description: 'What the console shows for it.', example: 'Casting station' }),
    description: z.string().trim().max(500).nullable().default(null).openapi({ description: 'What the field holds, for people.' }),
  })
  .openapi('SampleField');

export const SampleFieldListSchema = z
  .object({ data: z.array(SampleFieldSchema.extend({ updated_at: z.string().openapi({ format: 'date-time' }) })) })
  .openapi('SampleFieldList');

export const PutSampleFieldsRequestSchema = z
  .object({
    fields: z
      .array(SampleFieldSchema)
      .max(SAMPLE_TEXT_LIMITS.fields * 2)
      .refine((fields) => new Set(fields.map((f) => f.key)).size === fields.length, 'list each key once'),
  })
  .openapi('PutSampleFieldsRequest', {
    description: 'Every definition, in the order the console lists them; replaces the stored ones. Samples are not changed.',
  });
