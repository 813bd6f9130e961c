// Instruments: create, rename, list. Codes are unique ignoring case. An API key restricted to
// some instruments sees and writes only those.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, ForbiddenProblem, NotFoundProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import {
  findInstrument,
  findInstrumentByCode,
  insertInstrument,
  type Instrument,
  type InstrumentRow,
  listInstrumentRows,
  updateInstrumentRow,
} from './instruments.repository.ts';
import type { InstrumentListQuerySchema } from './instruments.schemas.ts';
import { inTransaction } from '../../db/transaction.ts';
import type { Page } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';

/** Throws 403 when the caller's key is restricted to other instruments. */
export function assertInstrumentAllowed(auth: AuthContext, instrumentId: string): void {
  if (auth.instrumentIds && !auth.instrumentIds.includes(instrumentId)) {
    throw new ForbiddenProblem(`This API key is restricted to other instruments than ${instrumentId}.`);
  }
}

/** Ordered by code; a key restricted to instruments sees only those. */
export function listInstrumentsPage(
  ctx: AppContext,
  auth: AuthContext,
  query: z.output<typeof InstrumentListQuerySchema>,
): Promise<Page<Instrument>> {
  return listInstrumentRows(ctx.db, { onlyIds: auth.instrumentIds }, query);
}

export async function getInstrument(ctx: AppContext, auth: AuthContext, id: string): Promise<Instrument> {
  const row = await findInstrument(ctx.db, id);
  if (!row || (auth.instrumentIds && !auth.instrumentIds.includes(id))) throw new NotFoundProblem(`No instrument ${id}.`);
  return row;
}

export async function createInstrument(
  ctx: AppContext,
  auth: AuthContext,
  input: { code: string; name: string; site: string },
  requestId?: string,
): Promise<Instrument> {
  const now = nowIso();
  const row: InstrumentRow = { id: newId('ins'), ...input, created_at: now, updated_at: now };
  await inTransaction(ctx.db, async (trx) => {
    if (await findInstrumentByCode(trx, input.code)) throw new ConflictProblem(`An instrument with the code ${input.code} exists.`);
    await insertInstrument(trx, row);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'instrument.created',
      targetType: 'instrument',
      targetId: row.id,
      after: row,
    });
  });
  return row;
}

export async function updateInstrument(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  changes: Partial<Pick<Instrument, 'code' | 'name' | 'site'>>,
  requestId?: string,
): Promise<Instrument> {
  return inTransaction(ctx.db, async (trx) => {
    const before = await findInstrument(trx, id);
    if (!before) throw new NotFoundProblem(`No instrument ${id}.`);
    if (changes.code) {
      const clash = await findInstrumentByCode(trx, changes.code);
      if (clash && clash.id !== id) throw new ConflictProblem(`An instrument with the code ${changes.code} exists.`);
    }
    const after = { ...before, ...changes, updated_at: nowIso() };
    await updateInstrumentRow(trx, id, after);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'instrument.updated',
      targetType: 'instrument',
      targetId: id,
      before,
      after,
    });
    return after;
  });
}
