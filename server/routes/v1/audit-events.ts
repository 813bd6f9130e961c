import { listAuditPage } from '../../domain/audit/audit.service.ts';
import { AuditEventListSchema, AuditQuerySchema } from '../../domain/audit/audit.schemas.ts';
import { defineRoute } from '../../http/route.ts';

export const auditRoutes = [
  defineRoute({
    method: 'get',
    path: '/audit-events',
    operationId: 'listAuditEvents',
    summary: 'The audit trail, newest first',
    description:
      'Every state-changing call: who (user or API key), what, which record, when, and the record before and after where it applies. An API key restricted to instruments sees only the events it caused.',
    tag: 'Audit',
    access: { scope: 'audit:read' },
    query: AuditQuerySchema,
    responses: { 200: { description: 'A page of audit events.', schema: AuditEventListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listAuditPage(ctx, auth, query));
    },
  }),
];
