// The lab's short reference lists (instruments, methods, import profiles), loaded whole for selects
// and for showing codes next to ids. They change rarely, so they stay fresh for five minutes.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { allPages } from '../../../api/all-pages.ts';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';

export type Instrument = components['schemas']['Instrument'];
export type Method = components['schemas']['Method'];
export type ImportProfile = components['schemas']['ImportProfile'];

const FRESH = 5 * 60_000;

export const instrumentsQuery = queryOptions({
  queryKey: ['instruments', 'all'],
  queryFn: () => allPages((cursor) => unwrap(api.GET('/instruments', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

export const methodsQuery = queryOptions({
  queryKey: ['methods', 'all'],
  queryFn: () => allPages((cursor) => unwrap(api.GET('/methods', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

export const importProfilesQuery = queryOptions({
  queryKey: ['import-profiles', 'all'],
  queryFn: () => allPages((cursor) => unwrap(api.GET('/import-profiles', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

export const useInstruments = () => useQuery(instrumentsQuery);
export const useMethods = () => useQuery(methodsQuery);
export const useImportProfiles = () => useQuery(importProfilesQuery);
