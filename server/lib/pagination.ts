// Cursor pagination shared by every list endpoint: { data, next_cursor }.
import { z } from './zod.ts';
import { ValidationProblem } from './problems.ts';

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

/** One page of a list, as every list endpoint returns it. */
export interface Page<T> {
  data: T[];
  next_cursor: string | null;
}

/** What a cursor holds: the keyset values of the last row of the previous page (and the list's order). */
export type CursorValues = Record<string, string | number>;

export function encodeCursor(value: CursorValues): string {
  return Buffer.from(JSON.stringify(value)).toString('base64url');
}

/** Reads a cursor made by encodeCursor holding at least these keys; anything else is a 400 naming query.cursor. */
export function decodeCursor<T extends CursorValues>(cursor: string, keys: (keyof T & string)[]): T {
  try {
    const parsed: unknown = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
    if (parsed && typeof parsed === 'object' && !Array.isArray(parsed)) {
      const values = parsed as Record<string, unknown>;
      const valid = (key: string) => Object.hasOwn(values, key) && ['string', 'number'].includes(typeof values[key]);
      if (keys.every(valid)) return values as T;
    }
  } catch {
    // fall through to the validation problem
  }
  throw new ValidationProblem([{ location: 'query.cursor', message: 'Not a cursor returned by this API.' }]);
}

/** The same page with each item turned into its API form. */
export function mapPage<A, B>(page: Page<A>, toItem: (row: A) => B): Page<B> {
  return { data: page.data.map(toItem), next_cursor: page.next_cursor };
}
