import { Button } from './button.tsx';

/** The "Load more" button under a cursor-paginated table (a TanStack infinite query's state). */
export function LoadMore({ list }: { list: { hasNextPage: boolean; isFetchingNextPage: boolean; fetchNextPage: () => unknown } }) {
  if (!list.hasNextPage) return null;
  return (
    <Button variant="secondary" onClick={() => list.fetchNextPage()} disabled={list.isFetchingNextPage}>
      {list.isFetchingNextPage ? 'Loading…' : 'Load more'}
    </Button>
  );
}
