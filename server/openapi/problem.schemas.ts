import { z } from '../lib/zod.ts';

const FieldErrorSchema = z
  .object({
    location: z.string().openapi({ example: 'body.email' }),
    message: z.string(),
    code: z.string().optional(),
  })
  .openapi('FieldError');

export const ProblemSchema = z
  .object({
    type: z.string().openapi({ example: '/problems/validation-failed' }),
    title: z.string(),
    status: z.number().int(),
    detail: z.string().optional(),
    instance: z.string().optional(),
    request_id: z.string().optional(),
    errors: z.array(FieldErrorSchema).optional(),
  })
  .catchall(z.unknown())
  .openapi('Problem', { description: 'RFC 9457 problem details.' });
