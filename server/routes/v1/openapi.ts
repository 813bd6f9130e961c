import { defineRoute } from '../../http/route.ts';
import { buildOpenApiDocument } from '../../openapi/document.ts';
import { z } from '../../openapi/zod.ts';
import { v1Routes } from './index.ts';

let document: ReturnType<typeof buildOpenApiDocument> | undefined;

export const openApiRoutes = [
  defineRoute({
    method: 'get',
    path: '/openapi.json',
    operationId: 'getOpenApiDocument',
    summary: 'This OpenAPI 3.1 document',
    description: 'Generated from the same zod schemas that validate requests.',
    tag: 'System',
    access: 'public',
    responses: { 200: { description: 'The document.', schema: z.looseObject({}).openapi({ description: 'An OpenAPI 3.1 document.' }) } },
    handler({ res }) {
      // Built on first use: the route list it describes includes this route.
      document ??= buildOpenApiDocument(v1Routes);
      res.json(document);
    },
  }),
];
