import { PutSampleFieldsRequestSchema, SampleFieldListSchema } from '../../domain/samples/sample-fields.schemas.ts';
import { listSampleFields, putSampleFields } from '../../domain/samples/sample-fields.service.ts';
import { defineRoute } from '../../http/route.ts';

export const sampleFieldRoutes = [
  defineRoute({
    method: 'get',
    path: '/sample-fields',
    operationId: 'listSampleFields',
    summary: "The lab's custom sample fields and their labels",
    description:
      'Labels for the keys samples carry in `fields` (`furnace` → "Furnace"), in the order the console lists them. A key without a definition is shown as it is.',
    tag: 'Samples',
    access: { scope: 'samples:read' },
    responses: { 200: { description: 'Every definition.', schema: SampleFieldListSchema } },
    async handler({ ctx, reply }) {
      reply(200, await listSampleFields(ctx.db));
    },
  }),
  defineRoute({
    method: 'put',
    path: '/sample-fields',
    operationId: 'putSampleFields',
    summary: 'Define the custom sample fields',
    description: 'Replaces every definition; audited with before and after. Samples keep their keys and values.',
    tag: 'Samples',
    access: { scope: 'methods:write', labWide: true },
    body: PutSampleFieldsRequestSchema,
    responses: { 200: { description: 'The definitions now stored.', schema: SampleFieldListSchema } },
    async handler({ body, auth, req, ctx, reply }) {
      reply(200, await putSampleFields(ctx, auth, body.fields, req.requestId));
    },
  }),
];
