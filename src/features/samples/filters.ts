// The samples table's filters live in the URL query, so a filtered table is a link to share.
// URL form: the API's own names (heat, grade, …), dates as YYYY-MM-DD in the reader's time zone,
// `unit` only when not %. The API wants instants, so a day becomes [its local start, the next
// day's local start) — `created_to` is exclusive on the server.
import { OutputUnitValues, SampleKindValues, SampleStatusValues } from '../../api/openapi-enums.ts';
import type { components } from '../../api/schema';

export type SampleKind = NonNullable<components['schemas']['SampleKind']>;
export type SampleStatus = components['schemas']['SampleStatus'];
export type OutputUnit = components['schemas']['OutputUnit'];

// The allowed values, generated from the OpenAPI document by `npm run openapi`.
export const SAMPLE_KINDS: readonly SampleKind[] = SampleKindValues;
export const SAMPLE_STATUSES: readonly SampleStatus[] = SampleStatusValues;
/** The verdicts a sample list can be filtered by (GET /samples?conforms=). */
export const VERDICTS = ['true', 'false', 'undecided'] as const;
export type Verdict = (typeof VERDICTS)[number];
export const VERDICT_LABELS: Record<Verdict, string> = { true: 'conforms', false: 'out of spec', undecided: 'cannot decide' };

export const OUTPUT_UNITS: readonly OutputUnit[] = OutputUnitValues;

const TEXT_FILTERS = ['sample_code', 'heat', 'grade', 'instrument_id', 'method_id', 'import_id', 'flag'] as const;
const FILTER_KEYS = [...TEXT_FILTERS, 'kind', 'status', 'conforms', 'created_from', 'created_to', 'controls'] as const;
export type FilterKey = (typeof FILTER_KEYS)[number];

export interface SampleFilters {
  sample_code?: string;
  heat?: string;
  grade?: string;
  instrument_id?: string;
  method_id?: string;
  import_id?: string;
  flag?: string;
  kind?: SampleKind;
  status?: SampleStatus;
  /** The verdict against the sample's grade. */
  conforms?: Verdict;
  /** YYYY-MM-DD, first day included. */
  created_from?: string;
  /** YYYY-MM-DD, last day included. */
  created_to?: string;
  /** `shown`: the Samples list includes control-sample points, which it leaves out by default. */
  controls?: 'shown';
  /** Not in the URL: set by samplesListFilters for the API's `exclude_kind`. */
  exclude_kind?: SampleKind;
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const isOneOf = <T extends string>(list: readonly T[], value: string): value is T => (list as readonly string[]).includes(value);

function isDay(text: string): boolean {
  if (!DAY.test(text)) return false;
  const [y, m, d] = text.split('-').map(Number);
  const date = new Date(y, m - 1, d);
  return date.getFullYear() === y && date.getMonth() === m - 1 && date.getDate() === d;
}

/** Filters from a URL query; blank, unknown and malformed values are left out. */
export function readFilters(params: URLSearchParams): SampleFilters {
  const filters: SampleFilters = {};
  for (const key of TEXT_FILTERS) {
    const value = params.get(key)?.trim();
    if (value) filters[key] = value;
  }
  const kind = params.get('kind') ?? '';
  if (isOneOf(SAMPLE_KINDS, kind)) filters.kind = kind;
  const status = params.get('status') ?? '';
  if (isOneOf(SAMPLE_STATUSES, status)) filters.status = status;
  const conforms = params.get('conforms') ?? '';
  if (isOneOf(VERDICTS, conforms)) filters.conforms = conforms;
  for (const key of ['created_from', 'created_to'] as const) {
    const value = params.get(key) ?? '';
    if (isDay(value)) filters[key] = value;
  }
  if (params.get('controls') === 'shown') filters.controls = 'shown';
  return filters;
}

/**
 * The Samples list leaves out control-sample points unless asked (`controls=shown`), a kind is
 * chosen or an import is shown: the list is where heats and lots are reviewed, and routine
 * control measurements (on their charts) would otherwise fill its pages.
 */
export function samplesListFilters(filters: SampleFilters): SampleFilters {
  const hides = !filters.kind && !filters.import_id && filters.controls !== 'shown';
  return hides ? { ...filters, exclude_kind: 'control' } : filters;
}

/** Whether the Samples list is leaving out control-sample points for these filters. */
export const hidesControls = (filters: SampleFilters) => samplesListFilters(filters).exclude_kind === 'control';

export function readUnit(params: URLSearchParams): OutputUnit {
  const unit = params.get('unit') ?? '';
  return isOneOf(OUTPUT_UNITS, unit) ? unit : '%';
}

/** The URL query for filters and unit, in a stable order, without empty values or the default unit. */
export function writeFilters(filters: SampleFilters, unit: OutputUnit = '%'): URLSearchParams {
  const params = new URLSearchParams();
  for (const key of FILTER_KEYS) {
    const value = filters[key]?.trim();
    if (value) params.set(key, value);
  }
  if (unit !== '%') params.set('unit', unit);
  return params;
}

/** Midnight starting the day, local time, as an ISO instant (UTC). `offsetDays` moves to a later day. */
export function localDayStart(day: string, offsetDays = 0): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(y, m - 1, d + offsetDays).toISOString();
}

export type SamplesApiQuery = Omit<SampleFilters, 'created_from' | 'created_to' | 'controls'> & {
  created_from?: string;
  created_to?: string;
  unit: OutputUnit;
};

/** The query for GET /samples and /samples.csv. */
export function toApiQuery(filters: SampleFilters, unit: OutputUnit): SamplesApiQuery {
  // `controls` is the console's own switch; the API gets exclude_kind from samplesListFilters.
  const { created_from, created_to, controls: _controls, ...rest } = filters;
  return {
    ...rest,
    ...(created_from ? { created_from: localDayStart(created_from) } : {}),
    ...(created_to ? { created_to: localDayStart(created_to, 1) } : {}),
    unit,
  };
}

/** The CSV export of exactly what the table shows. */
export function csvHref(filters: SampleFilters, unit: OutputUnit): string {
  const query = new URLSearchParams(
    Object.entries(toApiQuery(filters, unit)).filter((entry): entry is [string, string] => typeof entry[1] === 'string' && entry[1] !== ''),
  );
  return `/api/v1/samples.csv?${query.toString()}`;
}
