// The signed-in user's choice of which events e-mail them.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { alertKeys } from '../../../api/query-keys.ts';
import type { components } from '../../../api/schema';

export type AlertPreference = components['schemas']['AlertPreference'];
export type AlertKind = components['schemas']['AlertKind'];

/** The kinds in the order the page lists them, with what each one mails about. */
export const ALERT_KIND_LABELS: Record<AlertKind, string> = {
  control_out_of_control: 'A control point breaks a run rule',
  out_of_spec: 'A sample does not conform to its grade',
  standardization_flagged: 'A standardization run is flagged',
  webhook_disabled: 'A webhook endpoint was disabled after failed deliveries',
  feed_stale: "An instrument PC's agent falls silent (its feed turns stale)",
};

const preferencesQuery = queryOptions({
  queryKey: alertKeys.preferences(),
  queryFn: () => unwrap(api.GET('/me/alert-preferences')),
});

export const useAlertPreferences = () => useQuery(preferencesQuery);

export function useSaveAlertPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (data: AlertPreference[]) => unwrap(api.PUT('/me/alert-preferences', { body: { data } })),
    onSuccess: (saved) => queryClient.setQueryData(alertKeys.preferences(), saved),
  });
}
