import { pingDb } from '../../db/knex.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../lib/zod.ts';

const HealthSchema = z
  .object({
    status: z.enum(['ok', 'degraded']),
    version: z.string().openapi({ example: '0.1.0' }),
    database: z.object({ ok: z.boolean(), client: z.enum(['sqlite', 'postgresql']) }),
    time: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('Health');

export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/health',
    operationId: 'getHealth',
    summary: 'Server and database health',
    tag: 'System',
    access: 'public',
    responses: {
      200: { description: 'The server is up; `database.ok` says whether the database answers.', schema: HealthSchema },
      503: { description: 'The database does not answer.', schema: HealthSchema },
    },
    async handler({ ctx, reply }) {
      const ok = await pingDb(ctx.db);
      reply(ok ? 200 : 503, {
        status: ok ? 'ok' : 'degraded',
        version: ctx.config.version,
        database: { ok, client: ctx.config.databaseUrl ? 'postgresql' : 'sqlite' },
        time: new Date().toISOString(),
      });
    },
  }),
];
