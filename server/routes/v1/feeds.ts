import { AgentHeartbeatRequestSchema, InstrumentFeedListSchema, InstrumentFeedSchema } from '../../domain/feeds/feeds.schemas.ts';
import { getFeed, listFeeds, recordHeartbeat } from '../../domain/feeds/feeds.service.ts';
import { InstrumentIdParams } from '../../domain/instruments/instruments.schemas.ts';
import { defineRoute } from '../../http/route.ts';

const STALE_NOTE = 'A feed is `stale` once its agent has been silent for `AGENT_STALE_MINUTES` (15 by default).';

export const feedRoutes = [
  defineRoute({
    method: 'post',
    path: '/instruments/{id}/agent-heartbeat',
    operationId: 'reportAgentHeartbeat',
    summary: "Report the instrument PC agent's state",
    description: `Sent by the agent (\`agent/\`) that delivers an instrument's result files: its version, how many files wait, the last delivery and the last error. Each heartbeat replaces the previous one. ${STALE_NOTE}`,
    tag: 'Instruments',
    access: { scope: 'imports:write' },
    params: InstrumentIdParams,
    body: AgentHeartbeatRequestSchema,
    responses: {
      200: { description: 'The feed as people now see it.', schema: InstrumentFeedSchema },
      404: { description: 'No such instrument.' },
    },
    async handler({ params, body, auth, ctx, reply }) {
      reply(200, await recordHeartbeat(ctx, auth, params.id, body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/instruments/{id}/feed',
    operationId: 'getInstrumentFeed',
    summary: "Whether an instrument's results arrive by themselves",
    description: STALE_NOTE,
    tag: 'Instruments',
    access: { scope: 'samples:read' },
    params: InstrumentIdParams,
    responses: { 200: { description: 'The feed.', schema: InstrumentFeedSchema }, 404: { description: 'No such instrument.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getFeed(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/instrument-feeds',
    operationId: 'listInstrumentFeeds',
    summary: "Every instrument's feed",
    description: `Every instrument the caller may see, ordered by code. ${STALE_NOTE}`,
    tag: 'Instruments',
    access: { scope: 'samples:read' },
    responses: { 200: { description: 'The feeds.', schema: InstrumentFeedListSchema } },
    async handler({ auth, ctx, reply }) {
      reply(200, { data: await listFeeds(ctx, auth) });
    },
  }),
];
