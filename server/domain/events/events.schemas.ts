import { z } from '../../lib/zod.ts';
import { EVENT_TYPES, type EventType } from './events.repository.ts';

export const EventTypeSchema = z.enum(EVENT_TYPES).openapi('EventType', {
  description: 'What happened, `resource.happening`. The same types name webhook subscriptions.',
});

const DATA_DESCRIPTION =
  'The resource as the API returns it, taken in the transaction that made the change: for `sample.*` the sample as `GET /samples/{id}` returns it (in %), for `import.completed` the import as `GET /imports/{id}` returns it, for `import.failed` the refused file (name, SHA-256, size), instrument, method and the problem answered, for `standardization.*` the run summary.';

export const EventSchema = z
  .object({
    id: z.string().openapi({ description: 'Also the `webhook-id` of every delivery of this event.', example: 'evt_01jd3kz8…' }),
    sequence: z.number().int().openapi({ description: 'Strictly increasing in the order events were recorded.' }),
    type: EventTypeSchema,
    occurred_at: z.string().openapi({ format: 'date-time' }),
    instrument_id: z.string().nullable().openapi({ description: 'The instrument the event is about; null for lab-wide events.' }),
    data: z.record(z.string(), z.unknown()).openapi({ description: DATA_DESCRIPTION }),
  })
  .openapi('Event');

export const EventFeedSchema = z
  .object({
    data: z.array(EventSchema),
    next_cursor: z.string().nullable().openapi({
      description:
        'Pass as `after` to resume. Unlike other lists it is given on the last page too (after the last event returned, or the `after` you sent when nothing new is ready), so store it and poll with it; null only when no event was ever returned.',
    }),
    has_more: z.boolean().openapi({ description: 'More events are ready now: ask again at once.' }),
  })
  .openapi('EventFeed');

function eventTypeList(value: string | undefined, ctx: z.RefinementCtx): EventType[] | undefined {
  if (value === undefined) return undefined;
  const types = value
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  for (const type of types) {
    if (!(EVENT_TYPES as readonly string[]).includes(type)) ctx.addIssue({ code: 'custom', message: `unknown event type ${type}` });
  }
  return types as EventType[];
}

export const EventFeedQuerySchema = z.object({
  after: z
    .string()
    .max(500)
    .optional()
    .openapi({ description: 'The `next_cursor` of your previous call; omit to start at the oldest event kept.' }),
  types: z
    .string()
    .max(1000)
    .optional()
    .transform(eventTypeList)
    .openapi({
      description: `Comma-separated event types to return (default all): ${EVENT_TYPES.join(', ')}.`,
      example: 'sample.created,sample.released',
    }),
  limit: z.coerce.number().int().min(1).max(500).default(100).openapi({ description: 'At most this many events (1–500).' }),
});

export const EventIdParams = z.object({ id: z.string().min(1).max(40) });
