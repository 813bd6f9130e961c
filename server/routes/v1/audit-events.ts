import { listAudit } from '../../domain/audit/audit.repository.ts';
import { AuditEventListSchema, AuditQuerySchema } from '../../domain/audit/audit.schemas.ts';
import { decodeCursor, pageOf } from '../../http/pagination.ts';
import { defineRoute } from '../../http/route.ts';

export const auditRoutes = [
  defineRoute({
    method: 'get',
    path: '/audit-events',
    operationId: 'listAuditEvents',
    summary: 'The audit trail, newest first',
    description:
      'Every state-changing call: who (user or API key), what, which record, when, and the record before and after where it applies.',
    tag: 'Audit',
    access: { scope: 'audit:read' },
    query: AuditQuerySchema,
    responses: { 200: { description: 'A page of audit events.', schema: AuditEventListSchema } },
    async handler({ query, res, ctx }) {
      const after = query.cursor ? decodeCursor<{ occurred_at: string; id: string }>(query.cursor, ['occurred_at', 'id']) : undefined;
      const rows = await listAudit(ctx.db, {
        actorId: query.actor_id,
        action: query.action,
        targetType: query.target_type,
        targetId: query.target_id,
        since: query.since,
        until: query.until,
        after,
        limit: query.limit,
      });
      res.json(
        pageOf(
          rows,
          query.limit,
          (row) => row,
          (row) => ({ occurred_at: row.occurred_at, id: row.id }),
        ),
      );
    },
  }),
];
