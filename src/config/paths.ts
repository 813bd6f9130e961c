// Every console address, in one place: links and redirects take them from here instead of typing
// "/…" by hand. The route table (src/app/router.tsx) declares the same addresses.
const id = (value: string) => encodeURIComponent(value);

export const paths = {
  home: '/',
  signIn: '/sign-in',
  resetPassword: '/reset-password',
  acceptInvitation: '/accept-invitation',
  samples: '/samples',
  /** A sample, in a unit other than % when asked. */
  sample: (sampleId: string, unit?: string) => `/samples/${id(sampleId)}${unit && unit !== '%' ? `?unit=${id(unit)}` : ''}`,
  /** The Samples page with a filter query already written (see writeFilters). */
  samplesMatching: (query: URLSearchParams) => `/samples${query.size > 0 ? `?${query.toString()}` : ''}`,
  /** The samples of an import, only those carrying a flag when given. */
  samplesOfImport: (importId: string, flag?: string) => `/samples?import_id=${id(importId)}${flag ? `&flag=${id(flag)}` : ''}`,
  imports: '/imports',
  upload: '/imports/new',
  import: (importId: string) => `/imports/${id(importId)}`,
  drift: '/drift',
  driftOf: (instrumentId: string, methodId: string) => `/drift?instrument=${id(instrumentId)}&method=${id(methodId)}`,
  driftNewRun: '/drift/new',
  driftRun: (runId: string) => `/drift/runs/${id(runId)}`,
  grades: '/grades',
  quickStart: '/quick-start',
  apiKeys: '/api-keys',
  reference: '/reference',
  requestLog: '/request-log',
  requestLogEntry: (entryId: string) => `/request-log?entry=${id(entryId)}`,
  users: '/users',
  audit: '/audit',
  outbox: '/outbox',
  webhooks: '/webhooks',
  webhookEndpoint: (endpointId: string) => `/webhooks/${id(endpointId)}`,
  events: '/events',
  controlSamples: '/control-samples',
  /** A control sample's chart, of one element when given. */
  controlChart: (controlSampleId: string, element?: string) =>
    `/control-samples/${id(controlSampleId)}${element ? `?element=${id(element)}` : ''}`,
  myAlerts: '/my-alerts',
} as const;
