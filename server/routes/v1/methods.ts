import { listMethods } from '../../domain/methods/methods.repository.ts';
import {
  CreateMethodRequestSchema,
  MethodIdParams,
  MethodListQuerySchema,
  MethodListSchema,
  MethodSchema,
  UpdateMethodRequestSchema,
} from '../../domain/methods/methods.schemas.ts';
import { createMethod, getMethod, updateMethod } from '../../domain/methods/methods.service.ts';
import { decodeCursor, pageOf } from '../../http/pagination.ts';
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
    async handler({ query, res, ctx }) {
      const afterCode = query.cursor ? decodeCursor<{ code: string }>(query.cursor, ['code']).code : undefined;
      const methods = await listMethods(ctx.db, { matrix: query.matrix, afterCode, limit: query.limit });
      res.json(
        pageOf(
          methods,
          query.limit,
          (m) => m,
          (m) => ({ code: m.code }),
        ),
      );
    },
  }),
  defineRoute({
    method: 'post',
    path: '/methods',
    operationId: 'createMethod',
    summary: 'Define an analytical method',
    tag: 'Methods',
    access: { scope: 'methods:write' },
    body: CreateMethodRequestSchema,
    responses: {
      201: { description: 'Defined.', schema: MethodSchema, headers: { Location: 'The new method.' } },
      409: { description: 'The code is taken (codes are compared ignoring case).' },
    },
    async handler({ body, auth, req, res, ctx }) {
      const method = await createMethod(ctx, auth, body, req.requestId);
      res.status(201).location(`/api/v1/methods/${method.id}`).json(method);
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
    async handler({ params, res, ctx }) {
      res.json(await getMethod(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/methods/{id}',
    operationId: 'updateMethod',
    summary: "Change a method's name, default unit or element settings",
    description: 'Results already stored keep the settings they were computed with.',
    tag: 'Methods',
    access: { scope: 'methods:write' },
    params: MethodIdParams,
    body: UpdateMethodRequestSchema,
    responses: { 200: { description: 'The updated method.', schema: MethodSchema }, 404: { description: 'No such method.' } },
    async handler({ params, body, auth, req, res, ctx }) {
      res.json(await updateMethod(ctx, auth, params.id, body, req.requestId));
    },
  }),
];
