import { defineRoute } from '../../http/route.ts';
import { buildOpenApiDocument } from '../../openapi/document.ts';
import { z } from '../../lib/zod.ts';
import type { AnyRoute } from '../../http/route.ts';

/** The document route; `routes` gives the operations it documents (itself included). */
export function openApiRoute(routes: () => AnyRoute[]): AnyRoute {
  let document: ReturnType<typeof buildOpenApiDocument> | undefined;
  return defineRoute({
    method: 'get',
    path: '/openapi.json',
    operationId: 'getOpenApiDocument',
    summary: 'This OpenAPI 3.1 document',
    description: 'Generated from the same zod schemas that validate requests.',
    tag: 'System',
    access: 'public',
    responses: { 200: { description: 'The document.', schema: z.looseObject({}).openapi({ description: 'An OpenAPI 3.1 document.' }) } },
    handler({ reply }) {
      // Built on first use: the route list it describes includes this route.
      document ??= buildOpenApiDocument(routes());
      reply(200, { ...document });
    },
  });
}
