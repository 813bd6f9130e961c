// Listing and exporting samples: the filters of GET /samples, one page at a time or every
// matching sample as CSV. A key restricted to instruments sees only their samples.
import { setImmediate as nextTurn } from 'node:timers/promises';
import type { AppContext } from '../../context.ts';
import type { PageRequest } from '../../db/keyset.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import type { OutputUnit } from '../chemistry/units.ts';
import { decodeResults } from './results-codec.ts';
import { CsvColumns, csvHeader, csvLines } from './samples-csv.ts';
import { countSampleRows, listSampleColumnRows, listSampleRows, type SampleFilters, type SampleOrder } from './samples.repository.ts';
import type { SampleListQuerySchema } from './samples.schemas.ts';
import { toSampleSummary } from './sample-view.ts';
import { preparedSamplesPage } from './prepared-documents.ts';

/** The CSV export refuses more samples than this (422): narrow the filters. */
export const CSV_MAX_ROWS = 100_000;

/** The export reads and writes this many samples at a time: turning a stored sample into its CSV
 * line takes about 0.1 ms, so a page holds the event loop for some 20 ms. */
const CSV_PAGE = 200;

type SampleListQuery = z.output<typeof SampleListQuerySchema>;

/** Newest first, or by last change (oldest first) when polling with `updated_since`. */
function orderOf(query: Pick<SampleListQuery, 'updated_since'>): SampleOrder {
  return query.updated_since ? 'updated_asc' : 'created_desc';
}

/** A page of GET /samples: in % from the prepared documents, in other units converted afresh. */
export async function listSamplesPage(ctx: AppContext, auth: AuthContext, query: SampleListQuery) {
  const filters = { ...query, onlyInstrumentIds: auth.instrumentIds };
  if (query.unit === '%') return preparedSamplesPage(ctx.db, filters, orderOf(query), query);
  const page = await listSampleRows(ctx.db, filters, orderOf(query), query);
  return mapPage(page, (row) => toSampleSummary(row, query.unit));
}

/** Every page of a keyset list, in order. Between pages other requests get a turn: a SQLite query
 * answers synchronously, so without one the whole export would run as one task. */
async function* pages<Row>(list: (page: PageRequest) => Promise<Page<Row>>): AsyncGenerator<Row[]> {
  let cursor: string | undefined;
  do {
    const page = await list({ limit: CSV_PAGE, cursor });
    yield page.data;
    cursor = page.next_cursor ?? undefined;
    await nextTurn();
  } while (cursor);
}

function tooMany(): UnprocessableProblem {
  return new UnprocessableProblem(`More than ${CSV_MAX_ROWS} samples match: narrow the filters (e.g. created_from/created_to).`);
}

/**
 * Every matching sample as CSV, in pieces to stream: the header line first, then the lines a page
 * at a time. Refuses (422) before reading any sample when more than CSV_MAX_ROWS match. The header
 * names every element and field of the samples, so a first pass over the same pages collects
 * them; the samples it saw are the ones exported (one created meanwhile is left out), and one
 * changed meanwhile so that it no longer fits the header ends the stream with an error.
 */
export async function exportSamplesCsv(
  ctx: AppContext,
  auth: AuthContext,
  query: Omit<SampleListQuery, 'cursor' | 'limit'>,
): Promise<AsyncGenerator<string>> {
  const filters: SampleFilters = { ...query, onlyInstrumentIds: auth.instrumentIds };
  const order = orderOf(query);
  if ((await countSampleRows(ctx.db, filters)) > CSV_MAX_ROWS) throw tooMany();
  const columns = new CsvColumns();
  const exported = new Set<string>();
  for await (const rows of pages((page) => listSampleColumnRows(ctx.db, filters, order, page))) {
    for (const row of rows) {
      exported.add(row.id);
      columns.add(
        decodeResults(row.results_json).map((r) => r.element),
        Object.keys(JSON.parse(row.fields_json)),
      );
    }
    if (exported.size > CSV_MAX_ROWS) throw tooMany();
  }
  return csvPieces(ctx, filters, order, query.unit, columns, exported);
}

async function* csvPieces(
  ctx: AppContext,
  filters: SampleFilters,
  order: SampleOrder,
  unit: OutputUnit,
  columns: CsvColumns,
  exported: Set<string>,
): AsyncGenerator<string> {
  yield csvHeader(columns, unit);
  for await (const rows of pages((page) => listSampleRows(ctx.db, filters, order, page))) {
    const samples = rows.filter((row) => exported.has(row.id)).map((row) => toSampleSummary(row, unit));
    const misfit = samples.find((sample) => !columns.covers(sample));
    if (misfit) throw new Error(`sample ${misfit.id} changed during the CSV export and no longer fits its header`);
    const lines = csvLines(samples, columns);
    if (lines) yield lines;
  }
}
