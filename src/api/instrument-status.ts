// An instrument with its control status per method (`verify` after a control rule violation until
// a disposition). Shared: the control pages show it as a banner, the release dialog asks for an
// acknowledgement while it is `verify`.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from './client.ts';
import { controlKeys } from './query-keys.ts';
import type { components } from './schema';

export type InstrumentDetail = components['schemas']['InstrumentDetail'];
export type InstrumentControl = components['schemas']['InstrumentControlStatus'];

export const instrumentStatusQuery = (instrumentId: string) =>
  queryOptions({
    queryKey: controlKeys.instrument(instrumentId),
    queryFn: () => unwrap(api.GET('/instruments/{id}', { params: { path: { id: instrumentId } } })),
  });

export const useInstrumentStatus = (instrumentId: string) => useQuery({ ...instrumentStatusQuery(instrumentId), enabled: !!instrumentId });

/** The control status of one method on the instrument; in control when it never had a violation. */
export function controlOf(detail: InstrumentDetail | undefined, methodId: string): InstrumentControl | null {
  return detail?.control.find((c) => c.method_id === methodId) ?? null;
}
