// Grades: the list, one grade, creating one and adding a version.
import { infiniteQueryOptions, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { gradeKeys } from '../../../api/query-keys.ts';
import type { components } from '../../../api/schema';

export type Grade = components['schemas']['Grade'];
export type CreateGradeRequest = components['schemas']['CreateGradeRequest'];

export const gradesQuery = infiniteQueryOptions({
  queryKey: gradeKeys.list(),
  queryFn: ({ pageParam }) => unwrap(api.GET('/grades', { params: { query: { limit: 100, cursor: pageParam } } })),
  initialPageParam: undefined as string | undefined,
  getNextPageParam: (page) => page.next_cursor ?? undefined,
});

export const useGrades = () => useInfiniteQuery(gradesQuery);

/** Creates a grade, or adds a version when `existing` names one. */
export function useSaveGrade() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ existing, body }: { existing: string | null; body: CreateGradeRequest }) => {
      if (!existing) return unwrap(api.POST('/grades', { body }));
      const { code: _code, ...definition } = body;
      return unwrap(api.PUT('/grades/{code}', { params: { path: { code: existing } }, body: definition }));
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: gradeKeys.all }),
  });
}
