import { NotFoundProblem } from '../../lib/problems.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../lib/zod.ts';

const CapturedMailSchema = z
  .object({
    id: z.number().int(),
    received_at: z.string().openapi({ format: 'date-time' }),
    from: z.string(),
    to: z.array(z.string()),
    subject: z.string(),
    text: z.string(),
  })
  .openapi('CapturedMail');

export const outboxRoutes = [
  defineRoute({
    method: 'get',
    path: '/dev/outbox',
    operationId: 'listOutbox',
    summary: 'E-mails captured by the built-in SMTP server (development only)',
    description:
      'Available when `SMTP_URL` is not set outside production: Meltwire then runs its own SMTP server and keeps the last 200 messages here instead of delivering them.',
    tag: 'System',
    access: { scope: 'users:write' },
    responses: {
      200: { description: 'Newest first.', schema: z.object({ data: z.array(CapturedMailSchema) }).openapi('Outbox') },
      404: { description: 'Mail goes to a real SMTP server; there is no outbox.' },
    },
    handler({ ctx, reply }) {
      if (!ctx.outbox) throw new NotFoundProblem('Mail goes to a real SMTP server; there is no outbox.');
      reply(200, { data: ctx.outbox.messages() });
    },
  }),
];
