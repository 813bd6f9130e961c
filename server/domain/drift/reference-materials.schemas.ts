import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { UNITS } from '../chemistry/units.ts';
import { unitInput } from '../chemistry/units.schemas.ts';
import { DecimalString, ElementSymbolSchema } from '../methods/methods.schemas.ts';
import { REFERENCE_KINDS } from './reference-materials.repository.ts';

export const ReferenceKindSchema = z.enum(REFERENCE_KINDS).openapi('ReferenceKind', {
  description:
    '`high` and `low`: the two levels of a two-point standardization. `type`: a material of similar composition to the samples, for a type standardization. `control`: a control sample (not used to standardize).',
});

const NominalValueInput = z
  .object({
    element: ElementSymbolSchema,
    nominal: DecimalString.openapi({
      description: 'Certified value, written as a decimal string so every digit is kept.',
      example: '0.742',
    }),
    unit: unitInput('Unit of `nominal`, `%` when not given.').default('%'),
  })
  .openapi('NominalValueInput');

const NominalValueSchema = z
  .object({
    element: z.string().openapi({ example: 'Mn' }),
    nominal: z.string().openapi({ description: 'Certified value in %, exact decimal string.', example: '0.742' }),
    given: z.string().openapi({ description: 'The value as given.' }),
    unit: z.enum(UNITS).openapi({ description: 'The unit it was given in.' }),
  })
  .openapi('NominalValue');

export const CreateReferenceMaterialRequestSchema = z
  .object({
    code: z
      .string()
      .trim()
      .min(1)
      .max(60)
      .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]*$/, 'use letters, digits, ".", "_", "/" and "-"')
      .openapi({ example: 'KB-FE-HI' }),
    name: z.string().trim().min(1).max(200).openapi({ example: 'Kestrel Bend high-level steel setting-up sample' }),
    matrix: ElementSymbolSchema,
    kind: ReferenceKindSchema,
    values: z
      .array(NominalValueInput)
      .min(1)
      .max(80)
      .superRefine(
        (values, ctx) => {
          const seen = new Set<string>();
          values.forEach((v, i) => {
            const symbol = typeof v?.element === 'string' ? normaliseElement(v.element) : undefined;
            if (symbol && seen.has(symbol)) ctx.addIssue({ code: 'custom', message: `${symbol} is listed twice`, path: [i, 'element'] });
            if (symbol) seen.add(symbol);
          });
        },
        { when: (payload) => Array.isArray(payload.value) },
      ),
    certificate: z
      .string()
      .trim()
      .max(500)
      .nullable()
      .default(null)
      .openapi({ description: 'Certificate number, issuer or link.', example: 'In-house, lot 2026-03, see QA file RM-114' }),
  })
  .openapi('CreateReferenceMaterialRequest');

export const ReferenceMaterialSchema = z
  .object({
    id: z.string(),
    code: z.string(),
    name: z.string(),
    matrix: z.string().openapi({ example: 'Fe' }),
    kind: ReferenceKindSchema,
    values: z.array(NominalValueSchema),
    certificate: z.string().nullable(),
    created_by: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('ReferenceMaterial', {
    description:
      'A reference material with its nominal (certified) values, in %. Values are not edited once created: register a new material for a new certificate, so that runs keep the values they used.',
  });

export const ReferenceMaterialListSchema = listOf(ReferenceMaterialSchema, 'ReferenceMaterialList');
export const ReferenceMaterialListQuerySchema = paginationQuery.extend({
  matrix: ElementSymbolSchema.optional(),
  kind: ReferenceKindSchema.optional(),
});
export const ReferenceMaterialIdParams = z.object({ id: z.string().min(1).max(40) });
