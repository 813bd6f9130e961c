// The instruments, methods and reference materials the Drift pages pick from (first 200 of each:
// a lab has a handful).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';

export type Instrument = components['schemas']['Instrument'];
export type Method = components['schemas']['Method'];
export type ReferenceMaterial = components['schemas']['ReferenceMaterial'];

export const instrumentsQuery = queryOptions({
  queryKey: ['instruments', 'all'],
  queryFn: async () => (await unwrap(api.GET('/instruments', { params: { query: { limit: 200 } } }))).data,
  staleTime: 60_000,
});

export const methodsQuery = queryOptions({
  queryKey: ['methods', 'all'],
  queryFn: async () => (await unwrap(api.GET('/methods', { params: { query: { limit: 200 } } }))).data,
  staleTime: 60_000,
});

export const referenceMaterialsQuery = queryOptions({
  queryKey: ['reference-materials', 'all'],
  queryFn: async () => (await unwrap(api.GET('/reference-materials', { params: { query: { limit: 200 } } }))).data,
  staleTime: 60_000,
});

export const useInstruments = () => useQuery(instrumentsQuery);
export const useMethods = () => useQuery(methodsQuery);
export const useReferenceMaterials = () => useQuery(referenceMaterialsQuery);
