// The lab's definitions of custom sample fields: labels (and a description) for the keys samples
// carry in `fields`, so screens show "Casting station" instead of `cast_station`. Samples keep
// their keys; a key without a definition is shown as it is.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { listSampleFieldRows, replaceSampleFieldRows } from './sample-fields.repository.ts';
import type { PutSampleFieldsRequestSchema } from './sample-fields.schemas.ts';

type SampleFields = z.output<typeof PutSampleFieldsRequestSchema>['fields'];

export async function listSampleFields(db: Queryable) {
  const rows = await listSampleFieldRows(db);
  return { data: rows.map(({ key, label, description, updated_at }) => ({ key, label, description, updated_at })) };
}

/** Replaces every definition (in transaction `db`); used by the API and the demo seed. */
export async function storeSampleFields(db: Queryable, fields: SampleFields, at = nowIso()): Promise<void> {
  await replaceSampleFieldRows(
    db,
    fields.map((f, position) => ({ key: f.key, label: f.label, description: f.description, position, updated_at: at })),
  );
}

export async function putSampleFields(ctx: AppContext, auth: AuthContext, fields: SampleFields, requestId?: string) {
  return inTransaction(ctx.db, async (trx) => {
    const before = await listSampleFields(trx);
    await storeSampleFields(trx, fields);
    const after = await listSampleFields(trx);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'sample_fields.replaced',
      targetType: 'sample_fields',
      targetId: 'lab',
      before: before.data,
      after: after.data,
    });
    return after;
  });
}
