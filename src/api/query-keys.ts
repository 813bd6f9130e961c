// Every TanStack Query key of the console, one factory per area. Queries and invalidations both
// take their keys from here, so a key cannot be spelt two ways and an area can invalidate
// another's data (an import adds samples) without importing that feature.
export const lookupKeys = {
  all: ['lookups'] as const,
  instruments: () => [...lookupKeys.all, 'instruments'] as const,
  methods: () => [...lookupKeys.all, 'methods'] as const,
  importProfiles: () => [...lookupKeys.all, 'import-profiles'] as const,
  referenceMaterials: () => [...lookupKeys.all, 'reference-materials'] as const,
  sampleFields: () => [...lookupKeys.all, 'sample-fields'] as const,
};

export const authKeys = {
  me: () => ['auth', 'me'] as const,
};

export const sampleKeys = {
  all: ['samples'] as const,
  lists: () => [...sampleKeys.all, 'list'] as const,
  list: (filters: object, unit: string, pageSize: number) => [...sampleKeys.lists(), filters, unit, pageSize] as const,
  details: (id: string) => [...sampleKeys.all, 'detail', id] as const,
  detail: (id: string, unit: string) => [...sampleKeys.details(id), unit] as const,
  revisions: (id: string) => [...sampleKeys.all, 'revisions', id] as const,
  /** Under the sample's details, so any change to the sample makes its previews stale too. */
  exclusionPreview: (id: string, burn: number, excluded: boolean, unit: string) =>
    [...sampleKeys.details(id), 'exclusion-preview', burn, excluded, unit] as const,
};

export const importKeys = {
  all: ['imports'] as const,
  list: () => [...importKeys.all, 'list'] as const,
  detail: (id: string) => [...importKeys.all, 'detail', id] as const,
};

export const driftKeys = {
  runs: ['standardizations'] as const,
  runList: (instrumentId: string, methodId: string | null) => [...driftKeys.runs, 'list', instrumentId, methodId] as const,
  run: (id: string) => [...driftKeys.runs, 'one', id] as const,
  series: ['drift'] as const,
  seriesOf: (instrumentId: string, element: string, methodId: string | null) =>
    [...driftKeys.series, instrumentId, element, methodId] as const,
  corrections: ['corrections'] as const,
  correctionsOf: (instrumentId: string) => [...driftKeys.corrections, instrumentId] as const,
};

export const requestLogKeys = {
  all: ['request-log'] as const,
  lists: () => [...requestLogKeys.all, 'list'] as const,
  list: (filters: object) => [...requestLogKeys.lists(), filters] as const,
  entry: (id: string) => [...requestLogKeys.all, 'entry', id] as const,
};

export const gradeKeys = {
  all: ['grades'] as const,
  list: () => [...gradeKeys.all, 'list'] as const,
};

export const userKeys = { all: ['users'] as const };

export const apiKeyKeys = {
  all: ['api-keys'] as const,
  list: (includeRevoked: boolean) => [...apiKeyKeys.all, { includeRevoked }] as const,
};

export const auditKeys = {
  list: (filters: { action?: string; targetId?: string }) => ['audit-events', filters] as const,
};

export const systemKeys = {
  health: () => ['health'] as const,
  instrumentFeeds: () => ['instrument-feeds'] as const,
  outbox: () => ['outbox'] as const,
};

export const webhookKeys = {
  all: ['webhooks'] as const,
  list: () => [...webhookKeys.all, 'list'] as const,
  endpoint: (id: string) => [...webhookKeys.all, 'endpoint', id] as const,
  deliveries: (endpointId: string) => [...webhookKeys.all, 'deliveries', endpointId] as const,
  delivery: (id: string) => [...webhookKeys.all, 'delivery', id] as const,
};

export const eventKeys = {
  feed: (after: string | undefined, types: string) => ['events', { after, types }] as const,
};

export const controlKeys = {
  all: ['control'] as const,
  list: () => [...controlKeys.all, 'list'] as const,
  detail: (id: string) => [...controlKeys.all, 'detail', id] as const,
  chart: (id: string, element: string) => [...controlKeys.all, 'chart', id, element] as const,
  /** An instrument with its control status per method. */
  instrument: (instrumentId: string) => [...controlKeys.all, 'instrument', instrumentId] as const,
};

export const alertKeys = {
  preferences: () => ['alert-preferences'] as const,
};
