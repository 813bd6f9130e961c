import { EventFeedQuerySchema, EventFeedSchema, EventIdParams, EventSchema } from '../../domain/events/events.schemas.ts';
import { getEvent, listEventFeed } from '../../domain/events/events.service.ts';
import { defineRoute } from '../../http/route.ts';

export const eventRoutes = [
  defineRoute({
    method: 'get',
    path: '/events',
    operationId: 'listEvents',
    summary: 'The change feed: events in order, from a cursor',
    description:
      'Every event recorded with its change, oldest first. Keep `next_cursor` and call again with `after=<next_cursor>`: you get each event once and never miss one, even when two changes commit in the other order (an event is handed out only when no transaction still running can come before it, so a just-committed event may appear a moment later). The webhooks carry the same events in the same order. A key restricted to instruments sees only events about them. Events are kept for EVENT_RETENTION_DAYS (default 30).',
    tag: 'Events',
    access: { scope: 'events:read' },
    query: EventFeedQuerySchema,
    responses: { 200: { description: 'The next events, at most `limit`.', schema: EventFeedSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listEventFeed(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/events/{id}',
    operationId: 'getEvent',
    summary: 'Get one event',
    tag: 'Events',
    access: { scope: 'events:read' },
    params: EventIdParams,
    responses: { 200: { description: 'The event.', schema: EventSchema }, 404: { description: 'No such event, or not yours to see.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getEvent(ctx, auth, params.id));
    },
  }),
];
