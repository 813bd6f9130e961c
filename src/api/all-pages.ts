/** Every item of a cursor-paginated list, for short lists (instruments, methods) that fill a select. */
export async function allPages<T>(
  fetchPage: (cursor: string | undefined) => Promise<{ data: T[]; next_cursor: string | null }>,
  maxPages = 20,
): Promise<T[]> {
  const items: T[] = [];
  let cursor: string | undefined;
  for (let page = 0; page < maxPages; page += 1) {
    const result = await fetchPage(cursor);
    items.push(...result.data);
    if (!result.next_cursor) break;
    cursor = result.next_cursor;
  }
  return items;
}
