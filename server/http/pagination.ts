// Cursor pagination shared by every list endpoint: { data, next_cursor }.
import { z } from '../openapi/zod.ts';
import { ValidationProblem } from './problem.ts';

export const paginationQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50).openapi({ description: 'Page size (1–200).' }),
  cursor: z.string().max(500).optional().openapi({ description: "Opaque cursor from the previous page's `next_cursor`." }),
});

export function listOf<T extends z.ZodType>(item: T, name: string) {
  return z
    .object({
      data: z.array(item),
      next_cursor: z.string().nullable().openapi({ description: 'Pass as `cursor` to get the next page; null on the last page.' }),
    })
    .openapi(name);
}

export function encodeCursor(value: Record<string, string | number>): string {
  return Buffer.from(JSON.stringify(value)).toString('base64url');
}

export function decodeCursor<T extends Record<string, string | number>>(cursor: string, keys: (keyof T)[]): T {
  try {
    const parsed = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as T;
    if (parsed && typeof parsed === 'object' && keys.every((key) => key in parsed)) return parsed;
  } catch {
    // fall through to the validation problem
  }
  throw new ValidationProblem([{ location: 'query.cursor', message: 'Not a cursor returned by this API.' }]);
}

/** Splits a page fetched with limit + 1 rows into the page and the cursor of the next one. */
export function pageOf<Row, Item>(
  rows: Row[],
  limit: number,
  toItem: (row: Row) => Item,
  toCursor: (row: Row) => Record<string, string | number>,
) {
  const hasMore = rows.length > limit;
  const page = hasMore ? rows.slice(0, limit) : rows;
  return {
    data: page.map(toItem),
    next_cursor: hasMore ? encodeCursor(toCursor(page[page.length - 1])) : null,
  };
}
