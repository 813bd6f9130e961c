import {
  CreateReferenceMaterialRequestSchema,
  ReferenceMaterialIdParams,
  ReferenceMaterialListQuerySchema,
  ReferenceMaterialListSchema,
  ReferenceMaterialSchema,
} from '../../domain/drift/reference-materials.schemas.ts';
import { codeKey, listReferenceMaterials } from '../../domain/drift/reference-materials.repository.ts';
import { createReferenceMaterial, getReferenceMaterial, toReferenceMaterialView } from '../../domain/drift/reference-materials.service.ts';
import { decodeCursor, pageOf } from '../../http/pagination.ts';
import { defineRoute } from '../../http/route.ts';

export const referenceMaterialRoutes = [
  defineRoute({
    method: 'get',
    path: '/reference-materials',
    operationId: 'listReferenceMaterials',
    summary: 'List reference materials',
    description: 'Ordered by code (ignoring case).',
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    query: ReferenceMaterialListQuerySchema,
    responses: { 200: { description: 'A page of reference materials.', schema: ReferenceMaterialListSchema } },
    async handler({ query, res, ctx }) {
      const afterCode = query.cursor ? decodeCursor<{ code: string }>(query.cursor, ['code']).code : undefined;
      const rows = await listReferenceMaterials(ctx.db, { matrix: query.matrix, kind: query.kind, afterCode, limit: query.limit });
      res.json(pageOf(rows, query.limit, toReferenceMaterialView, (row) => ({ code: codeKey(row.code) })));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/reference-materials',
    operationId: 'createReferenceMaterial',
    summary: 'Register a reference material with its nominal values',
    description:
      'Nominal values are decimal strings in `unit` (default %), converted exactly to % and kept as given as well. A material is not edited afterwards: register a new one for a new certificate, so that past runs keep the values they used. Kinds `high`/`low` serve two-point standardizations, `type` type standardizations; `control` materials cannot standardize.',
    tag: 'Drift correction',
    access: { scope: 'standardizations:write' },
    body: CreateReferenceMaterialRequestSchema,
    responses: {
      201: { description: 'Registered.', schema: ReferenceMaterialSchema, headers: { Location: 'The new reference material.' } },
      409: { description: 'The code is taken (codes are compared ignoring case).' },
    },
    async handler({ body, auth, req, res, ctx }) {
      const material = await createReferenceMaterial(ctx, auth, body, req.requestId);
      res.status(201).location(`/api/v1/reference-materials/${material.id}`).json(toReferenceMaterialView(material));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/reference-materials/{id}',
    operationId: 'getReferenceMaterial',
    summary: 'Get a reference material',
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    params: ReferenceMaterialIdParams,
    responses: {
      200: { description: 'The reference material.', schema: ReferenceMaterialSchema },
      404: { description: 'No such reference material.' },
    },
    async handler({ params, res, ctx }) {
      res.json(toReferenceMaterialView(await getReferenceMaterial(ctx, params.id)));
    },
  }),
];
