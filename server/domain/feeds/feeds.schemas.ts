// An instrument's feed: what the agent on its PC last reported (server/domain/feeds) and whether
// it is still reporting. The agent (agent/) sends a heartbeat; people and screens read the state.
import { z } from '../../lib/zod.ts';

const at = z.iso.datetime({ offset: true });

export const FEED_STATES = ['alive', 'stale', 'no_agent'] as const;

export const AgentHeartbeatRequestSchema = z
  .object({
    agent_version: z.string().trim().min(1).max(40).openapi({ example: '0.1.0' }),
    host: z.string().trim().min(1).max(200).optional().openapi({ description: 'The instrument PC’s host name.', example: 'SPARK-PC-1' }),
    queue_length: z
      .number()
      .int()
      .min(0)
      .max(1_000_000)
      .openapi({ description: 'Files found and not yet delivered (waiting or retrying).' }),
    last_success_at: at.nullable().optional().openapi({ description: 'When the agent last delivered a file (ISO 8601).' }),
    last_file: z
      .object({ name: z.string().min(1).max(260), at })
      .nullable()
      .optional()
      .openapi({ description: 'The last file delivered: its name in the watched folder and when it was delivered.' }),
    last_error: z
      .object({ message: z.string().min(1).max(2000), at })
      .nullable()
      .optional()
      .openapi({ description: 'The last error the agent met (server unreachable, a file refused…), or null once it recovered.' }),
  })
  .openapi('AgentHeartbeatRequest');

export const InstrumentFeedSchema = z
  .object({
    instrument: z.object({ id: z.string(), code: z.string() }),
    state: z.enum(FEED_STATES).openapi({
      description:
        '`alive`: the agent reported within `stale_after_minutes`; `stale`: it has been silent for longer (PC off, network down, agent stopped); `no_agent`: no agent ever reported for this instrument.',
    }),
    stale_after_minutes: z.number().int(),
    reported_at: z.string().nullable().openapi({ description: 'The last heartbeat.' }),
    agent: z.object({ version: z.string(), host: z.string().nullable(), reported_by: z.string() }).nullable(),
    queue_length: z.number().int().nullable(),
    last_success_at: z.string().nullable(),
    last_file: z.object({ name: z.string(), at: z.string() }).nullable(),
    last_error: z.object({ message: z.string(), at: z.string() }).nullable(),
  })
  .openapi('InstrumentFeed', { description: 'Whether results leave the instrument PC by themselves: the state of its agent.' });

export const InstrumentFeedListSchema = z.object({ data: z.array(InstrumentFeedSchema) }).openapi('InstrumentFeedList');
