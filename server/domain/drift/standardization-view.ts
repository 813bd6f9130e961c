// Stored standardization runs → API representations.
import { Decimal } from 'decimal.js';
import { nowIso } from '../../lib/time.ts';
import type { AppContext } from '../../context.ts';
import { type Page } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { getInstrument } from '../instruments/instruments.service.ts';
import type { StandardizationListQuerySchema } from './standardizations.schemas.ts';
import {
  findSetInForce,
  listStandardizationRows,
  type ElementCorrection,
  type StandardizationRowWithRefs,
  type StoredMeasurement,
} from './standardizations.repository.ts';
import type { Queryable } from '../../db/transaction.ts';

const Exact = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });

/** How far each element moved from the set before: α / α_previous − 1 (20 significant digits) and β − β_previous. */
function withChange(c: ElementCorrection) {
  const slopeChange =
    c.slope !== null && c.previous_slope !== null && !new Exact(c.previous_slope).isZero()
      ? new Exact(c.slope).div(c.previous_slope).minus(1).toSignificantDigits(20).toFixed()
      : null;
  const offsetChange = c.offset !== null && c.previous_offset !== null ? new Exact(c.offset).minus(c.previous_offset).toFixed() : null;
  return { ...c, slope_change: slopeChange, offset_change: offsetChange };
}

export function toStandardizationView(row: StandardizationRowWithRefs, inForceId: string | null) {
  const measurements = JSON.parse(row.measurements_json) as StoredMeasurement[];
  return {
    id: row.id,
    instrument: { id: row.instrument_id, code: row.instrument_code },
    method: { id: row.method_id, code: row.method_code },
    mode: row.mode,
    status: row.status,
    flag: row.flag,
    in_force: row.id === inForceId,
    measured_at: row.measured_at,
    note: row.note,
    source_file: row.source_file_json ? (JSON.parse(row.source_file_json) as { name: string; sha256: string }) : null,
    base_set_id: row.base_set_id,
    activation:
      row.status === 'activated'
        ? {
            activated_at: row.activated_at as string,
            activated_by: row.activated_by_label ?? '',
            effective_from: row.effective_from as string,
            override_reason: row.override_reason,
          }
        : null,
    measurements: measurements.map((m) => ({
      reference_material: m.reference_material,
      burns: m.burns.map((b) => ({
        values: Object.fromEntries(
          Object.entries(b.values).map(([element, cell]) => [
            element,
            { value: cell.v, qualifier: cell.q, raw: b.raw[element]?.raw ?? cell.v ?? '', raw_unit: b.raw[element]?.unit ?? '%' },
          ]),
        ),
      })),
      means: m.means,
    })),
    corrections: (JSON.parse(row.corrections_json) as ElementCorrection[]).map(withChange),
    created_by: row.created_by_label,
    created_at: row.created_at,
  };
}

export type StandardizationView = ReturnType<typeof toStandardizationView>;

/** The id of the set in force now for each (instrument, method) pair among the rows, each looked up once. */
export async function inForceIds(
  db: Queryable,
  rows: readonly StandardizationRowWithRefs[],
  at = nowIso(),
): Promise<Map<string, string | null>> {
  const ids = new Map<string, string | null>();
  for (const row of rows) {
    const key = `${row.instrument_id}|${row.method_id}`;
    if (!ids.has(key)) ids.set(key, (await findSetInForce(db, row.instrument_id, row.method_id, at))?.id ?? null);
  }
  return ids;
}

async function toStandardizationViews(db: Queryable, rows: readonly StandardizationRowWithRefs[]) {
  const ids = await inForceIds(db, rows);
  return rows.map((row) => toStandardizationView(row, ids.get(`${row.instrument_id}|${row.method_id}`) ?? null));
}

/** One instrument's runs, newest measurement first; 404 when the caller cannot see the instrument. */
export async function listStandardizationsPage(
  ctx: AppContext,
  auth: AuthContext,
  instrumentId: string,
  query: z.output<typeof StandardizationListQuerySchema>,
): Promise<Page<StandardizationView>> {
  await getInstrument(ctx, auth, instrumentId);
  const filters = { instrumentId, methodId: query.method_id, status: query.status, flag: query.flag };
  const page = await listStandardizationRows(ctx.db, filters, query);
  return { data: await toStandardizationViews(ctx.db, page.data), next_cursor: page.next_cursor };
}
