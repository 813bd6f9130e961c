// Keyset (cursor) pagination, the one way every list pages: order by columns whose last one is
// unique, start strictly after the previous page's last row, fetch one row more than asked to know
// whether another page follows. Stable under inserts, and an index can serve every page.
import type { Knex } from 'knex';
import { type CursorValues, decodeCursor, encodeCursor, type Page } from '../lib/pagination.ts';

export interface KeysetColumn<Row> {
  /** The column as the query names it, e.g. "samples.created_at". */
  column: string;
  order: 'asc' | 'desc';
  /** Its name inside the cursor. */
  key: string;
  /** Its value in a fetched row. */
  valueOf(row: Row): string | number;
}

export interface PageRequest {
  cursor?: string;
  limit: number;
  /** Lists with several orders name theirs: a cursor made under another order starts from the top. */
  order?: string;
}

/** Rows strictly after `after` in the keyset's order: (a, b) > (x, y) written out column by column. */
function whereAfter<Row>(query: Knex.QueryBuilder, keyset: KeysetColumn<Row>[], after: CursorValues): void {
  query.where((outer) => {
    keyset.forEach((current, i) => {
      outer.orWhere((inner) => {
        for (const earlier of keyset.slice(0, i)) inner.where(earlier.column, after[earlier.key]);
        inner.where(current.column, current.order === 'asc' ? '>' : '<', after[current.key]);
      });
    });
  });
}

/** Applies the keyset's order and the request's cursor to the query and returns one page of rows. */
export async function keysetPage<Row>(query: Knex.QueryBuilder, keyset: KeysetColumn<Row>[], request: PageRequest): Promise<Page<Row>> {
  const keys = keyset.map((c) => c.key);
  const decoded = request.cursor ? decodeCursor(request.cursor, request.order ? [...keys, 'by'] : keys) : undefined;
  const after = decoded && (!request.order || decoded.by === request.order) ? decoded : undefined;
  if (after) whereAfter(query, keyset, after);
  query.orderBy(keyset.map((c) => ({ column: c.column, order: c.order })));
  const rows = (await query.limit(request.limit + 1)) as Row[];
  const hasMore = rows.length > request.limit;
  const data = hasMore ? rows.slice(0, request.limit) : rows;
  const last = data[data.length - 1];
  const cursorOf = (row: Row): CursorValues => ({
    ...Object.fromEntries(keyset.map((c) => [c.key, c.valueOf(row)])),
    ...(request.order ? { by: request.order } : {}),
  });
  return { data, next_cursor: hasMore ? encodeCursor(cursorOf(last)) : null };
}
