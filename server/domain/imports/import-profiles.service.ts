// Create, read and change import profiles. Names are unique ignoring case; an update is
// merged into the stored profile and the result validated as a whole, so no change can leave
// a profile the parser cannot use. Every change is audited in the same transaction.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, NotFoundProblem } from '../../lib/problems.ts';
import { parseOrProblem } from '../../lib/readable-issues.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import type { Actor } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import {
  findImportProfile,
  findImportProfileByName,
  type ImportProfile,
  type ImportProfileRow,
  insertImportProfile,
  listImportProfileRows,
  profileNameKey,
  toImportProfile,
  updateImportProfileRow,
} from './import-profiles.repository.ts';
import {
  CreateImportProfileRequestSchema,
  type ImportProfileInput,
  type ImportProfileListQuerySchema,
  type UpdateImportProfileRequestSchema,
} from './import-profiles.schemas.ts';
import type { z } from '../../lib/zod.ts';
import { inTransaction } from '../../db/transaction.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';

interface Audited {
  actor: Actor;
  userId?: string;
  requestId?: string;
}

function splitInput(input: ImportProfileInput) {
  const { name, description, ...definition } = input;
  return { name, description, definition_json: JSON.stringify(definition) };
}

/** Oldest first. */
export async function listImportProfilesPage(
  ctx: Pick<AppContext, 'db'>,
  query: z.output<typeof ImportProfileListQuerySchema>,
): Promise<Page<ImportProfile>> {
  return mapPage(await listImportProfileRows(ctx.db, query), toImportProfile);
}

export async function getImportProfile(ctx: Pick<AppContext, 'db'>, id: string): Promise<ImportProfile> {
  const row = await findImportProfile(ctx.db, id);
  if (!row) throw new NotFoundProblem(`No import profile ${id}.`);
  return toImportProfile(row);
}

/** A concurrent insert of the same name reaches the unique index (SQLite or PostgreSQL). */
function isUniqueViolation(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return code === 'SQLITE_CONSTRAINT_UNIQUE' || code === '23505';
}

function duplicateName(name: string): ConflictProblem {
  return new ConflictProblem(`An import profile named "${name}" already exists (names are compared ignoring case).`);
}

export async function createImportProfile(ctx: AppContext, input: ImportProfileInput, by: Audited): Promise<ImportProfile> {
  const now = nowIso();
  const row: ImportProfileRow = {
    id: newId('ipr'),
    ...splitInput(input),
    name_key: profileNameKey(input.name),
    revision: 1,
    created_by: by.userId ?? null,
    created_at: now,
    updated_at: now,
  };
  try {
    return await inTransaction(ctx.db, async (trx) => {
      if (await findImportProfileByName(trx, input.name)) throw duplicateName(input.name);
      await insertImportProfile(trx, row);
      const profile = toImportProfile(row);
      await recordAudit(trx, {
        actor: by.actor,
        requestId: by.requestId,
        action: 'import_profile.created',
        targetType: 'import_profile',
        targetId: row.id,
        after: profile,
      });
      return profile;
    });
  } catch (error) {
    throw isUniqueViolation(error) ? duplicateName(input.name) : error;
  }
}

export async function updateImportProfile(
  ctx: AppContext,
  id: string,
  changes: z.output<typeof UpdateImportProfileRequestSchema>,
  by: Audited,
): Promise<ImportProfile> {
  return inTransaction(ctx.db, async (trx) => {
    const row = await findImportProfile(trx, id);
    if (!row) throw new NotFoundProblem(`No import profile ${id}.`);
    const before = toImportProfile(row);
    const { id: _id, revision: _revision, created_at: _created, updated_at: _updated, ...stored } = before;
    const merged = parseOrProblem(
      'body',
      CreateImportProfileRequestSchema,
      { ...stored, ...changes },
      'The profile would not be valid after this change; see errors[].',
    );
    if (profileNameKey(merged.name) !== row.name_key && (await findImportProfileByName(trx, merged.name))) throw duplicateName(merged.name);
    const changed: Partial<ImportProfileRow> = {
      ...splitInput(merged),
      name_key: profileNameKey(merged.name),
      revision: Number(row.revision) + 1,
      updated_at: nowIso(),
    };
    await updateImportProfileRow(trx, id, changed);
    const after = toImportProfile({ ...row, ...changed });
    await recordAudit(trx, {
      actor: by.actor,
      requestId: by.requestId,
      action: 'import_profile.updated',
      targetType: 'import_profile',
      targetId: id,
      before,
      after,
    });
    return after;
  });
}
