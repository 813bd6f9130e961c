// Reference materials: registered once with their certified values (converted exactly to %),
// listed and read. There is no edit: a run keeps pointing at the values it used.
import type { AppContext } from '../../context.ts';
import { isUniqueViolation } from '../../db/errors.ts';
import { ConflictProblem, NotFoundProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { toPercent } from '../chemistry/units.ts';
import {
  codeKey,
  findReferenceMaterial,
  findReferenceMaterialByCode,
  insertReferenceMaterial,
  listReferenceMaterials,
  type ReferenceMaterial,
  type ReferenceMaterialRow,
  toReferenceMaterial,
} from './reference-materials.repository.ts';
import { inTransaction } from '../../db/transaction.ts';
import { mapPage } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import type { CreateReferenceMaterialRequestSchema, ReferenceMaterialListQuerySchema } from './reference-materials.schemas.ts';

export type ReferenceMaterialInput = z.output<typeof CreateReferenceMaterialRequestSchema>;

export function toReferenceMaterialView(material: ReferenceMaterial) {
  const { created_by_label, ...rest } = material;
  return { ...rest, created_by: created_by_label };
}

/** Ordered by code, ignoring case. */
export async function listReferenceMaterialsPage(ctx: AppContext, query: z.output<typeof ReferenceMaterialListQuerySchema>) {
  const page = await listReferenceMaterials(ctx.db, { matrix: query.matrix, kind: query.kind }, query);
  return mapPage(page, toReferenceMaterialView);
}

export async function getReferenceMaterial(ctx: AppContext, id: string): Promise<ReferenceMaterial> {
  const material = await findReferenceMaterial(ctx.db, id);
  if (!material) throw new NotFoundProblem(`No reference material ${id}.`);
  return material;
}

/** Builds the row; shared with the demo seed. */
export function referenceMaterialRow(input: ReferenceMaterialInput, createdBy: string, now = nowIso()): ReferenceMaterialRow {
  const values = input.values.map((v) => ({ element: v.element, nominal: toPercent(v.nominal, v.unit), given: v.nominal, unit: v.unit }));
  return {
    id: newId('rfm'),
    code: input.code,
    code_key: codeKey(input.code),
    name: input.name,
    matrix: input.matrix,
    kind: input.kind,
    values_json: JSON.stringify(values),
    certificate: input.certificate,
    created_by_label: createdBy,
    created_at: now,
  };
}

export async function createReferenceMaterial(
  ctx: AppContext,
  auth: AuthContext,
  input: ReferenceMaterialInput,
  requestId?: string,
): Promise<ReferenceMaterial> {
  const actor = actorOf(auth);
  const row = referenceMaterialRow(input, actor.label);
  const conflict = () => new ConflictProblem(`A reference material with the code ${input.code} exists (codes are compared ignoring case).`);
  try {
    await inTransaction(ctx.db, async (trx) => {
      if (await findReferenceMaterialByCode(trx, input.code)) throw conflict();
      await insertReferenceMaterial(trx, row);
      await recordAudit(trx, {
        actor,
        requestId,
        action: 'reference_material.created',
        targetType: 'reference_material',
        targetId: row.id,
        after: toReferenceMaterial(row),
      });
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict();
    throw error;
  }
  return toReferenceMaterial(row);
}
