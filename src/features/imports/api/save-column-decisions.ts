import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { ImportProfile } from '../../../api/lookups.ts';
import { lookupKeys } from '../../../api/query-keys.ts';
import { type ColumnDecision, type PreviewColumn, withDecisions } from '../column-decisions.ts';

export interface SaveDecisions {
  /** The profile the upload used: the decisions are added to it. Without one, a new profile is created. */
  profile?: ImportProfile;
  /** The new profile's name (no profile chosen). */
  name: string;
  layout: 'wide' | 'long';
  /** The file's header line (1-based), which a new profile must name. */
  headerRow: number;
  decisions: { column: PreviewColumn; decision: ColumnDecision }[];
}

/** Saves the column decisions into an import profile and answers the profile as stored. */
export function useSaveColumnDecisions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ profile, name, layout, headerRow, decisions }: SaveDecisions) => {
      const body = withDecisions(profile, decisions);
      if (profile) return unwrap(api.PATCH('/import-profiles/{id}', { params: { path: { id: profile.id } }, body }));
      return unwrap(
        api.POST('/import-profiles', {
          body: {
            name,
            description: 'Column decisions saved from the upload preview; everything else is detected.',
            delimiter: 'auto',
            decimal_separator: 'auto',
            encoding: 'auto',
            header_row: headerRow,
            layout,
            long_columns: null,
            default_unit: null,
            ...body,
          },
        }),
      );
    },
    onSuccess: (saved) => {
      queryClient.setQueryData<ImportProfile[]>(lookupKeys.importProfiles(), (list) =>
        list ? [...list.filter((p) => p.id !== saved.id), saved] : list,
      );
      return queryClient.invalidateQueries({ queryKey: lookupKeys.importProfiles() });
    },
  });
}
