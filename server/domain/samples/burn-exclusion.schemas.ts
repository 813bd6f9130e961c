// What excluding (or including) one burn would change, before anything is stored.
import { z } from '../../lib/zod.ts';
import { OUTPUT_UNITS } from '../chemistry/units.ts';
import { RESULT_FLAG_NAMES, type ResultFlag } from '../chemistry/result-rules.ts';

const flagList = z.array(z.enum(RESULT_FLAG_NAMES as [ResultFlag, ...ResultFlag[]]));
const verdict = z.enum(['true', 'false', 'undecided']).nullable();

export const BurnExclusionPreviewQuerySchema = z.object({
  excluded: z
    .enum(['true', 'false'])
    .transform((value) => value === 'true')
    .openapi({ type: 'string', enum: ['true', 'false'], description: '`true`: preview excluding the burn; `false`: including it again.' }),
  unit: z.enum(OUTPUT_UNITS).default('%').openapi({ description: 'Unit of the reported values in the preview.' }),
});

export const BurnExclusionPreviewSchema = z
  .object({
    burn: z.number().int(),
    excluded: z.boolean().openapi({ description: 'The state previewed.' }),
    allowed: z.boolean().openapi({ description: 'Whether PATCH /samples/{id}/burns/{n} with this state would be accepted now.' }),
    refusal: z
      .string()
      .nullable()
      .openapi({ description: 'Why it would be refused (released sample, too few included burns); null when allowed.' }),
    min_included_burns: z.number().int().openapi({ description: "The method's `reporting.min_included_burns`." }),
    included_burns_after: z.number().int(),
    unit: z.enum(OUTPUT_UNITS),
    changes: z
      .array(
        z.object({
          element: z.string(),
          reported_before: z.string().nullable().openapi({ description: 'Reported value with its qualifier ("<0.002"), as stored now.' }),
          reported_after: z.string().nullable(),
          flags_cleared: flagList.openapi({ description: 'Flags on the element now that the change would clear.' }),
          flags_raised: flagList,
        }),
      )
      .openapi({ description: 'Only the elements whose reported value or flags would change.' }),
    sample_flags_cleared: flagList,
    sample_flags_raised: flagList,
    conforms_before: verdict.openapi({
      description: 'The verdict against the grade now (`undecided`: could not be judged); null without a grade.',
    }),
    conforms_after: verdict,
  })
  .openapi('BurnExclusionPreview', {
    description:
      'The results the sample would have after the change, computed exactly as PATCH /samples/{id}/burns/{n} would, compared with the results stored now. Nothing is stored or audited.',
  });
