// Listing and exporting samples: the filters of GET /samples, one page at a time or every
// matching sample as CSV. A key restricted to instruments sees only their samples.
import type { AppContext } from '../../context.ts';
import { mapPage } from '../../lib/pagination.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { samplesToCsv } from './samples-csv.ts';
import { listSampleRows, type SampleOrder } from './samples.repository.ts';
import type { SampleListQuerySchema } from './samples.schemas.ts';
import { toSampleSummary } from './sample-view.ts';

/** The CSV export refuses more samples than this (422): narrow the filters. */
export const CSV_MAX_ROWS = 100_000;

type SampleListQuery = z.output<typeof SampleListQuerySchema>;

/** Newest first, or by last change (oldest first) when polling with `updated_since`. */
function orderOf(query: Pick<SampleListQuery, 'updated_since'>): SampleOrder {
  return query.updated_since ? 'updated_asc' : 'created_desc';
}

export async function listSamplesPage(ctx: AppContext, auth: AuthContext, query: SampleListQuery) {
  const filters = { ...query, onlyInstrumentIds: auth.instrumentIds };
  const page = await listSampleRows(ctx.db, filters, orderOf(query), query);
  return mapPage(page, (row) => toSampleSummary(row, query.unit));
}

/** Every matching sample as CSV text, or 422 when more than CSV_MAX_ROWS match. */
export async function exportSamplesCsv(ctx: AppContext, auth: AuthContext, query: Omit<SampleListQuery, 'cursor' | 'limit'>) {
  const filters = { ...query, onlyInstrumentIds: auth.instrumentIds };
  const page = await listSampleRows(ctx.db, filters, orderOf(query), { limit: CSV_MAX_ROWS });
  if (page.next_cursor !== null) {
    throw new UnprocessableProblem(`More than ${CSV_MAX_ROWS} samples match: narrow the filters (e.g. created_from/created_to).`);
  }
  return samplesToCsv(
    page.data.map((row) => toSampleSummary(row, query.unit)),
    query.unit,
  );
}
