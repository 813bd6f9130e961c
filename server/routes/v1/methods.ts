import {
  CreateMethodRequestSchema,
  MethodIdParams,
  MethodListQuerySchema,
  MethodListSchema,
  MethodSchema,
  UpdateMethodRequestSchema,
} from '../../domain/methods/methods.schemas.ts';
import { createMethod, getMethod, listMethodsPage, updateMethod } from '../../domain/methods/methods.service.ts';
import { defineRoute } from '../../http/route.ts';

export const methodRoutes = [
  defineRoute({
    method: 'get',
    path: '/methods',
    operationId: 'listMethods',
    summary: 'List analytical methods',
    tag: 'Methods',
    access: { scope: 'samples:read' },
    query: MethodListQuerySchema,
    responses: { 200: { description: 'A page of methods, ordered by code.', schema: MethodListSchema } },
    async handler({ query, reply, ctx }) {
      reply(200, await listMethodsPage(ctx, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/methods',
    operationId: 'createMethod',
    summary: 'Define an analytical method',
    tag: 'Methods',
    access: { scope: 'methods:write', labWide: true },
    body: CreateMethodRequestSchema,
    responses: {
      201: { description: 'Defined.', schema: MethodSchema, headers: { Location: 'The new method.' } },
      409: { description: 'The code is taken (codes are compared ignoring case).' },
    },
    async handler({ body, auth, req, reply, ctx }) {
      const method = await createMethod(ctx, auth, body, req.requestId);
      reply(201, method, { Location: `/api/v1/methods/${method.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/methods/{id}',
    operationId: 'getMethod',
    summary: 'Get a method with its element settings',
    tag: 'Methods',
    access: { scope: 'samples:read' },
    params: MethodIdParams,
    responses: { 200: { description: 'The method.', schema: MethodSchema }, 404: { description: 'No such method.' } },
    async handler({ params, reply, ctx }) {
      reply(200, await getMethod(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/methods/{id}',
    operationId: 'updateMethod',
    summary: "Change a method's name, default unit or element settings",
    description: 'Results already stored keep the settings they were computed with.',
    tag: 'Methods',
    access: { scope: 'methods:write', labWide: true },
    params: MethodIdParams,
    body: UpdateMethodRequestSchema,
    responses: { 200: { description: 'The updated method.', schema: MethodSchema }, 404: { description: 'No such method.' } },
    async handler({ params, body, auth, req, reply, ctx }) {
      reply(200, await updateMethod(ctx, auth, params.id, body, req.requestId));
    },
  }),
];
