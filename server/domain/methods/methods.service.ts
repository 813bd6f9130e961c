// Methods: create, change settings, list. A change never rewrites stored results: each result
// keeps the settings it was computed with.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, NotFoundProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { findMethod, findMethodByCode, insertMethod, listMethods, type Method, updateMethodRow } from './methods.repository.ts';
import { inTransaction } from '../../db/transaction.ts';
import type { Page } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import type { CreateMethodRequestSchema, MethodListQuerySchema, UpdateMethodRequestSchema } from './methods.schemas.ts';

export type MethodInput = z.output<typeof CreateMethodRequestSchema>;
export type MethodChanges = z.output<typeof UpdateMethodRequestSchema>;

export function listMethodsPage(ctx: AppContext, query: z.output<typeof MethodListQuerySchema>): Promise<Page<Method>> {
  return listMethods(ctx.db, { matrix: query.matrix }, query);
}

export async function getMethod(ctx: AppContext, id: string): Promise<Method> {
  const method = await findMethod(ctx.db, id);
  if (!method) throw new NotFoundProblem(`No method ${id}.`);
  return method;
}

export async function createMethod(ctx: AppContext, auth: AuthContext, input: MethodInput, requestId?: string): Promise<Method> {
  const now = nowIso();
  const method: Method = { id: newId('mth'), ...input, created_at: now, updated_at: now };
  await inTransaction(ctx.db, async (trx) => {
    if (await findMethodByCode(trx, input.code)) throw new ConflictProblem(`A method with the code ${input.code} exists.`);
    await insertMethod(trx, method);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'method.created',
      targetType: 'method',
      targetId: method.id,
      after: method,
    });
  });
  return method;
}

export async function updateMethod(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  changes: MethodChanges,
  requestId?: string,
): Promise<Method> {
  return inTransaction(ctx.db, async (trx) => {
    const before = await findMethod(trx, id);
    if (!before) throw new NotFoundProblem(`No method ${id}.`);
    const after: Method = { ...before, ...changes, updated_at: nowIso() };
    await updateMethodRow(trx, after);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'method.updated',
      targetType: 'method',
      targetId: id,
      before,
      after,
    });
    return after;
  });
}
