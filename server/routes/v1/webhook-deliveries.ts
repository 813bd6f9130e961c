import {
  RecoverDeliveriesRequestSchema,
  RecoverDeliveriesSchema,
  WebhookDeliveryDetailSchema,
  WebhookDeliveryIdParams,
  WebhookDeliveryListQuerySchema,
  WebhookDeliveryListSchema,
  WebhookDeliverySchema,
} from '../../domain/webhooks/deliveries.schemas.ts';
import {
  getDelivery,
  listEndpointDeliveriesPage,
  recoverDeliveries,
  retryDelivery,
  sendTestEvent,
} from '../../domain/webhooks/deliveries.service.ts';
import { WebhookEndpointIdParams } from '../../domain/webhooks/webhooks.schemas.ts';
import { defineRoute } from '../../http/route.ts';

const TAG = 'Webhooks';

export const webhookDeliveryRoutes = [
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints/{id}/deliveries',
    operationId: 'listWebhookDeliveries',
    summary: "An endpoint's delivery log, newest first",
    tag: TAG,
    access: { scope: 'webhooks:read' },
    params: WebhookEndpointIdParams,
    query: WebhookDeliveryListQuerySchema,
    responses: {
      200: { description: 'A page of deliveries.', schema: WebhookDeliveryListSchema },
      404: { description: 'No such endpoint.' },
    },
    async handler({ params, query, ctx, reply }) {
      reply(200, await listEndpointDeliveriesPage(ctx, params.id, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/webhook-deliveries/{id}',
    operationId: 'getWebhookDelivery',
    summary: 'One delivery with every attempt',
    description: 'Each attempt with its HTTP status, duration, the first 2 KB of the answer, the error and when the next attempt was due.',
    tag: TAG,
    access: { scope: 'webhooks:read' },
    params: WebhookDeliveryIdParams,
    responses: { 200: { description: 'The delivery.', schema: WebhookDeliveryDetailSchema }, 404: { description: 'No such delivery.' } },
    async handler({ params, ctx, reply }) {
      reply(200, await getDelivery(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-deliveries/{id}/retry',
    operationId: 'retryWebhookDelivery',
    summary: 'Send a delivery again now',
    description:
      'Also a delivered or failed one. The message keeps its `webhook-id`, so a receiver that de-duplicates ignores a copy it already has.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookDeliveryIdParams,
    responses: {
      202: { description: 'Queued.', schema: WebhookDeliverySchema },
      404: { description: 'No such delivery.' },
      409: { description: 'An attempt is under way.' },
    },
    async handler({ params, auth, req, ctx, reply }) {
      reply(202, await retryDelivery(ctx, auth, params.id, req.requestId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints/{id}/test',
    operationId: 'sendWebhookTestEvent',
    summary: 'Send a meltwire.test event to this endpoint',
    description: 'A signed delivery like any other, of type `meltwire.test`, to this endpoint only; it is not in the events feed.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookEndpointIdParams,
    responses: {
      202: { description: 'Queued; follow it in the delivery log.', schema: WebhookDeliverySchema },
      404: { description: 'No such endpoint.' },
      409: { description: 'The endpoint is disabled.' },
    },
    async handler({ params, auth, req, ctx, reply }) {
      reply(202, await sendTestEvent(ctx, auth, params.id, req.requestId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints/{id}/recover',
    operationId: 'recoverWebhookDeliveries',
    summary: 'Send again everything that failed since a time',
    description:
      'Re-queues every failed delivery to this endpoint created since `since` (each gets one more attempt), e.g. after the receiver was down.',
    tag: TAG,
    access: { scope: 'webhooks:write', labWide: true },
    params: WebhookEndpointIdParams,
    body: RecoverDeliveriesRequestSchema,
    responses: { 202: { description: 'Queued.', schema: RecoverDeliveriesSchema }, 404: { description: 'No such endpoint.' } },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(202, await recoverDeliveries(ctx, auth, params.id, body.since, req.requestId));
    },
  }),
];
