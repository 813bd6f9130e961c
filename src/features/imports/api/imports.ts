import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { postMultipart, type UploadAnswer, type UploadProgress } from '../../../api/upload.ts';
import { importKeys, sampleKeys } from '../../../api/query-keys.ts';

export type Import = components['schemas']['Import'];
export type ImportPreview = components['schemas']['ImportPreview'];
export type ImportIssue = components['schemas']['ImportIssue'];
export type ImportMode = Import['mode'];

const importsQuery = infiniteQueryOptions({
  queryKey: importKeys.list(),
  queryFn: ({ pageParam }) => unwrap(api.GET('/imports', { params: { query: { limit: 50, cursor: pageParam } } })),
  initialPageParam: undefined as string | undefined,
  getNextPageParam: (page) => page.next_cursor ?? undefined,
});

export function useImports() {
  return useInfiniteQuery(importsQuery);
}

const importQuery = (id: string) =>
  queryOptions({
    queryKey: importKeys.detail(id),
    queryFn: () => unwrap(api.GET('/imports/{id}', { params: { path: { id } } })),
    staleTime: Infinity, // an import's report never changes
  });

export function useImport(id: string) {
  return useQuery(importQuery(id));
}

export interface UploadChoice {
  file: File;
  instrumentId: string;
  methodId: string;
  profileId?: string;
}

function formOf(choice: UploadChoice, extra: Record<string, string> = {}): FormData {
  const form = new FormData();
  form.set('instrument_id', choice.instrumentId);
  form.set('method_id', choice.methodId);
  if (choice.profileId) form.set('profile_id', choice.profileId);
  for (const [name, value] of Object.entries(extra)) form.set(name, value);
  form.set('file', choice.file, choice.file.name);
  return form;
}

/** A multipart mutation with its upload progress (null before the first progress event). */
function useUploadMutation<TInput, TOutput>(
  send: (input: TInput, onProgress: (p: UploadProgress) => void) => Promise<TOutput>,
  onSuccess?: (output: TOutput) => unknown,
) {
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const mutation = useMutation({
    mutationFn: (input: TInput) => {
      setProgress(null);
      return send(input, setProgress);
    },
    onSuccess,
  });
  return { ...mutation, progress };
}

export function usePreviewImport() {
  return useUploadMutation((choice: UploadChoice, onProgress) =>
    postMultipart('/imports/preview', formOf(choice), onProgress).then((answer) => answer.data),
  );
}

/** Commits the upload: 201 = imported now, 200 = these bytes were imported before (nothing created). */
export function useCommitImport() {
  const queryClient = useQueryClient();
  return useUploadMutation(
    ({ mode, ...choice }: UploadChoice & { mode: ImportMode }, onProgress) =>
      postMultipart('/imports', formOf(choice, { mode }), onProgress),
    (answer: UploadAnswer<Import>) => {
      queryClient.setQueryData(importQuery(answer.data.id).queryKey, answer.data);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: importKeys.list() }),
        queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
      ]);
    },
  );
}
