import { z } from '../lib/zod.ts';

const FieldErrorSchema = z
  .object({
    location: z.string().openapi({ example: 'body.email' }),
    message: z.string().openapi({ example: 'email must be an e-mail address', description: 'What is wrong with the field, in words.' }),
    code: z.string().optional(),
  })
  .openapi('FieldError');

export const ProblemSchema = z
  .object({
    type: z.string().openapi({
      example: '/problems/validation-failed',
      description: 'A URI relative to the server; it opens a page that explains the problem and what to do (GET /problems lists them all).',
    }),
    title: z.string(),
    status: z.number().int(),
    detail: z.string().optional(),
    instance: z.string().optional(),
    request_id: z.string().optional(),
    errors: z.array(FieldErrorSchema).optional(),
  })
  .catchall(z.unknown())
  .openapi('Problem', { description: 'RFC 9457 problem details.' });
