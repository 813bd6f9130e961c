import { z } from '../../lib/zod.ts';

export const RecomputeSampleRequestSchema = z
  .object({
    correction_set_id: z
      .string()
      .min(1)
      .max(40)
      .nullable()
      .openapi({ description: "An activated standardization of the sample's instrument and method, or null for no correction." }),
    reason: z.string().trim().min(3, 'say why, in a few words').max(500),
  })
  .openapi('RecomputeSampleRequest');
