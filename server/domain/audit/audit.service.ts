// Reading the audit trail. Writing it is recordAudit, inside each change's own transaction.
import type { AppContext } from '../../context.ts';
import type { z } from '../../lib/zod.ts';
import { listAudit } from './audit.repository.ts';
import type { AuditQuerySchema } from './audit.schemas.ts';
import type { AuthContext } from '../auth/auth-context.ts';

/** A key restricted to instruments reads only the events it caused: others may concern other instruments. */
export function listAuditPage(ctx: AppContext, auth: AuthContext, query: z.output<typeof AuditQuerySchema>) {
  const filters = {
    actorId: query.actor_id,
    onlyActorId: auth.instrumentIds ? (auth.apiKeyId ?? auth.userId) : undefined,
    action: query.action,
    targetType: query.target_type,
    targetId: query.target_id,
    since: query.since,
    until: query.until,
  };
  return listAudit(ctx.db, filters, query);
}
