import {
  CreateWebhookEndpointRequestSchema,
  RotateWebhookSecretRequestSchema,
  UpdateWebhookEndpointRequestSchema,
  WebhookEndpointIdParams,
  WebhookEndpointListQuerySchema,
  WebhookEndpointListSchema,
  WebhookEndpointSchema,
  WebhookEndpointWithSecretSchema,
} from '../../domain/webhooks/webhooks.schemas.ts';
import {
  createEndpoint,
  deleteEndpoint,
  getEndpoint,
  listEndpointsPage,
  rotateEndpointSecret,
  updateEndpoint,
} from '../../domain/webhooks/webhooks.service.ts';
import { defineRoute } from '../../http/route.ts';

const TAG = 'Webhooks';
const NOT_FOUND = { description: 'No such endpoint.' };
const URL_REFUSED = {
  description:
    'The URL is refused: plain http in production, credentials in it, or it resolves to a loopback, private, link-local, CGNAT or metadata address.',
};

export const webhookEndpointRoutes = [
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints',
    operationId: 'listWebhookEndpoints',
    summary: 'List webhook endpoints, newest first',
    tag: TAG,
    access: { scope: 'webhooks:read' },
    query: WebhookEndpointListQuerySchema,
    responses: { 200: { description: 'A page of endpoints (never their secrets).', schema: WebhookEndpointListSchema } },
    async handler({ query, ctx, reply }) {
      reply(200, await listEndpointsPage(ctx, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints',
    operationId: 'createWebhookEndpoint',
    summary: 'Subscribe an endpoint to events',
    description:
      'Deliveries follow the Standard Webhooks specification: a POST of `{ type, timestamp, sequence, data }` (`sequence`: the place of the event in the feed) with the headers `webhook-id` (the event id, the same on every retry: de-duplicate by it), `webhook-timestamp` (seconds) and `webhook-signature` (`v1,` + base64 HMAC-SHA256 of `id.timestamp.body` keyed with the secret). The response carries the secret once.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    body: CreateWebhookEndpointRequestSchema,
    secretInResponse: true,
    responses: {
      201: {
        description: 'Subscribed; copy the secret now.',
        schema: WebhookEndpointWithSecretSchema,
        headers: { Location: 'The endpoint.' },
      },
      422: URL_REFUSED,
    },
    async handler({ body, auth, req, ctx, reply }) {
      const endpoint = await createEndpoint(ctx, auth, body, req.requestId);
      reply(201, endpoint, { Location: `/api/v1/webhook-endpoints/${endpoint.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints/{id}',
    operationId: 'getWebhookEndpoint',
    summary: 'Get a webhook endpoint (without its secret)',
    tag: TAG,
    access: { scope: 'webhooks:read' },
    params: WebhookEndpointIdParams,
    responses: { 200: { description: 'The endpoint.', schema: WebhookEndpointSchema }, 404: NOT_FOUND },
    async handler({ params, ctx, reply }) {
      reply(200, await getEndpoint(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/webhook-endpoints/{id}',
    operationId: 'updateWebhookEndpoint',
    summary: 'Change, disable or re-enable a webhook endpoint',
    description:
      'While an endpoint is disabled no deliveries are made for new events (the pull feed keeps them); deliveries already pending wait and go out when it is enabled again.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookEndpointIdParams,
    body: UpdateWebhookEndpointRequestSchema,
    responses: { 200: { description: 'The endpoint as changed.', schema: WebhookEndpointSchema }, 404: NOT_FOUND, 422: URL_REFUSED },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateEndpoint(ctx, auth, params.id, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/webhook-endpoints/{id}',
    operationId: 'deleteWebhookEndpoint',
    summary: 'Delete a webhook endpoint and its delivery log',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookEndpointIdParams,
    responses: { 204: { description: 'Deleted.' }, 404: NOT_FOUND },
    async handler({ params, auth, req, res, ctx }) {
      await deleteEndpoint(ctx, auth, params.id, req.requestId);
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints/{id}/rotate-secret',
    operationId: 'rotateWebhookSecret',
    summary: 'Replace the signing secret, keeping the old one for an overlap',
    description:
      'The new secret is shown once. Until `previous_secret_expires_at` (after `overlap_minutes`, default 24 h) every delivery carries two signatures, space-separated: one with the new secret, one with the old, so receivers can switch at their own pace.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookEndpointIdParams,
    body: RotateWebhookSecretRequestSchema,
    secretInResponse: true,
    responses: {
      200: { description: 'The endpoint with its new secret, shown once.', schema: WebhookEndpointWithSecretSchema },
      404: NOT_FOUND,
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await rotateEndpointSecret(ctx, auth, params.id, body.overlap_minutes, req.requestId));
    },
  }),
];
