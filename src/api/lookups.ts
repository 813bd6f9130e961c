// The lab's short reference lists (instruments, methods, import profiles, reference materials,
// custom sample fields),
// loaded whole — every page — for selects and for showing codes next to ids. Every page of the
// console reads them from here, under one set of keys, so they show the same thing everywhere.
// They change rarely, so they stay fresh for five minutes.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { allPages } from './all-pages.ts';
import { api, unwrap } from './client.ts';
import { lookupKeys } from './query-keys.ts';
import type { components } from './schema';

export type Instrument = components['schemas']['Instrument'];
export type Method = components['schemas']['Method'];
export type ImportProfile = components['schemas']['ImportProfile'];
export type ReferenceMaterial = components['schemas']['ReferenceMaterial'];
export type SampleField = components['schemas']['SampleFieldList']['data'][number];

const FRESH = 5 * 60_000;

const instrumentsQuery = queryOptions({
  queryKey: lookupKeys.instruments(),
  queryFn: () => allPages((cursor) => unwrap(api.GET('/instruments', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

const methodsQuery = queryOptions({
  queryKey: lookupKeys.methods(),
  queryFn: () => allPages((cursor) => unwrap(api.GET('/methods', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

const importProfilesQuery = queryOptions({
  queryKey: lookupKeys.importProfiles(),
  queryFn: () => allPages((cursor) => unwrap(api.GET('/import-profiles', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

const referenceMaterialsQuery = queryOptions({
  queryKey: lookupKeys.referenceMaterials(),
  queryFn: () => allPages((cursor) => unwrap(api.GET('/reference-materials', { params: { query: { limit: 200, cursor } } }))),
  staleTime: FRESH,
});

const sampleFieldsQuery = queryOptions({
  queryKey: lookupKeys.sampleFields(),
  queryFn: async () => (await unwrap(api.GET('/sample-fields'))).data,
  staleTime: FRESH,
});

export const useInstruments = () => useQuery(instrumentsQuery);
export const useMethods = () => useQuery(methodsQuery);
export const useImportProfiles = () => useQuery(importProfilesQuery);
export const useReferenceMaterials = () => useQuery(referenceMaterialsQuery);
export const useSampleFields = () => useQuery(sampleFieldsQuery);
