import { InstrumentControlSchema } from '../control/control.schemas.ts';
import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';

const code = z
  .string()
  .trim()
  .min(1)
  .max(40)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'use letters, digits, ".", "_" and "-"')
  .openapi({ example: 'OES-1' });

export const InstrumentSchema = z
  .object({
    id: z.string(),
    code: z.string(),
    name: z.string(),
    site: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('Instrument', { description: 'One spectrometer at a site.' });

export const InstrumentDetailSchema = InstrumentSchema.extend({
  control: z.array(InstrumentControlSchema).openapi({ description: 'Control status per method that has had a control violation.' }),
}).openapi('InstrumentDetail');

export const InstrumentListSchema = listOf(InstrumentSchema, 'InstrumentList');
export const InstrumentListQuerySchema = paginationQuery;
export const InstrumentIdParams = z.object({ id: z.string().min(1).max(40) });

export const CreateInstrumentRequestSchema = z
  .object({
    code,
    name: z.string().trim().min(1).max(200).openapi({ example: 'Melt shop spark stand' }),
    site: z.string().trim().min(1).max(200).openapi({ example: 'Foundry, Kestrel Bend' }),
  })
  .openapi('CreateInstrumentRequest');

export const UpdateInstrumentRequestSchema = CreateInstrumentRequestSchema.partial()
  .refine((value) => Object.keys(value).length > 0, 'give at least one of code, name, site')
  .openapi('UpdateInstrumentRequest');
