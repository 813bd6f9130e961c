import {
  CreateReferenceMaterialRequestSchema,
  ReferenceMaterialIdParams,
  ReferenceMaterialListQuerySchema,
  ReferenceMaterialListSchema,
  ReferenceMaterialSchema,
} from '../../domain/drift/reference-materials.schemas.ts';
import {
  createReferenceMaterial,
  getReferenceMaterial,
  listReferenceMaterialsPage,
  toReferenceMaterialView,
} from '../../domain/drift/reference-materials.service.ts';
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
    async handler({ query, ctx, reply }) {
      reply(200, await listReferenceMaterialsPage(ctx, query));
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
    access: { scope: 'standardizations:write', labWide: true },
    body: CreateReferenceMaterialRequestSchema,
    responses: {
      201: { description: 'Registered.', schema: ReferenceMaterialSchema, headers: { Location: 'The new reference material.' } },
      409: { description: 'The code is taken (codes are compared ignoring case).' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const material = await createReferenceMaterial(ctx, auth, body, req.requestId);
      reply(201, toReferenceMaterialView(material), { Location: `/api/v1/reference-materials/${material.id}` });
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
    async handler({ params, ctx, reply }) {
      reply(200, toReferenceMaterialView(await getReferenceMaterial(ctx, params.id)));
    },
  }),
];
