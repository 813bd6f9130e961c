import {
  ApiKeyIdParams,
  ApiKeyListQuerySchema,
  ApiKeyListSchema,
  ApiKeySchema,
  ApiKeyWithSecretSchema,
  CreateApiKeyRequestSchema,
  RollApiKeyRequestSchema,
  RolledApiKeySchema,
} from '../../domain/api-keys/api-keys.schemas.ts';
import { createApiKey, getApiKey, listApiKeysPage, revokeApiKey, rollApiKey } from '../../domain/api-keys/api-keys.service.ts';
import { defineRoute } from '../../http/route.ts';

export const apiKeyRoutes = [
  defineRoute({
    method: 'get',
    path: '/api-keys',
    operationId: 'listApiKeys',
    summary: 'List API keys',
    description: 'Admins see every key; other callers see the keys they created. Secrets are never shown again.',
    tag: 'API keys',
    access: { scope: 'api-keys:read' },
    query: ApiKeyListQuerySchema,
    responses: { 200: { description: 'A page of keys, newest first.', schema: ApiKeyListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listApiKeysPage(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api-keys',
    operationId: 'createApiKey',
    summary: 'Issue an API key',
    description: 'The response carries the secret once. You can grant only scopes you hold yourself.',
    tag: 'API keys',
    access: { scope: 'api-keys:write' },
    body: CreateApiKeyRequestSchema,
    secretInResponse: true,
    responses: {
      201: { description: 'Issued; copy the secret now.', schema: ApiKeyWithSecretSchema, headers: { Location: 'The new key.' } },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const key = await createApiKey(ctx, auth, body, req.requestId);
      reply(201, key, { Location: `/api/v1/api-keys/${key.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api-keys/{id}',
    operationId: 'getApiKey',
    summary: 'Get an API key (without its secret)',
    tag: 'API keys',
    access: { scope: 'api-keys:read' },
    params: ApiKeyIdParams,
    responses: { 200: { description: 'The key.', schema: ApiKeySchema }, 404: { description: 'No such key, or not yours.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getApiKey(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api-keys/{id}',
    operationId: 'revokeApiKey',
    summary: 'Revoke an API key at once',
    tag: 'API keys',
    access: { scope: 'api-keys:write' },
    params: ApiKeyIdParams,
    responses: { 204: { description: 'Revoked (also when it already was).' }, 404: { description: 'No such key, or not yours.' } },
    async handler({ params, auth, req, res, ctx }) {
      await revokeApiKey(ctx, auth, params.id, req.requestId);
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api-keys/{id}/roll',
    operationId: 'rollApiKey',
    summary: 'Replace a key, letting the old one live for an overlap',
    description:
      'Issues a new key with the same name, scopes and restrictions; the old key keeps working for `overlap_minutes` (never past its own expiry), then expires. `previous.expires_at` says when.',
    tag: 'API keys',
    access: { scope: 'api-keys:write' },
    params: ApiKeyIdParams,
    body: RollApiKeyRequestSchema,
    secretInResponse: true,
    responses: {
      201: {
        description: 'The replacement, with its secret shown once, and when the old key stops working.',
        schema: RolledApiKeySchema,
        headers: { Location: 'The new key.' },
      },
      404: { description: 'No such key, or not yours.' },
      409: { description: 'The key is revoked or expired.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      const key = await rollApiKey(ctx, auth, params.id, body.overlap_minutes, req.requestId);
      reply(201, key, { Location: `/api/v1/api-keys/${key.id}` });
    },
  }),
];
