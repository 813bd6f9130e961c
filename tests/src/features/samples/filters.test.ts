import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  csvHref,
  localDayStart,
  readFilters,
  readUnit,
  samplesListFilters,
  toApiQuery,
  writeFilters,
} from '../../../../src/features/samples/filters.ts';

// tests/src is type-checked for the browser (no Node types); the time zone is set through the env.
const env = (globalThis as unknown as { process: { env: Record<string, string | undefined> } }).process.env;
let savedTz: string | undefined;
beforeEach(() => {
  savedTz = env.TZ;
  env.TZ = 'America/Chicago';
});
afterEach(() => {
  if (savedTz === undefined) delete env.TZ;
  else env.TZ = savedTz;
});

describe('sample filters in the URL', () => {
  it('reads every filter the table offers and writes them back in a stable order', () => {
    const query =
      'unit=ppm&heat=K24-0412&grade=SAE+1045&sample_code=K24-0412-F1&instrument_id=ins_1&method_id=mth_1&kind=final&status=draft&flag=repeatability_exceeded&created_from=2024-03-04&created_to=2024-03-05&import_id=imp_1';
    const params = new URLSearchParams(query);
    const filters = readFilters(params);
    expect(filters).toEqual({
      heat: 'K24-0412',
      grade: 'SAE 1045',
      sample_code: 'K24-0412-F1',
      instrument_id: 'ins_1',
      method_id: 'mth_1',
      import_id: 'imp_1',
      kind: 'final',
      status: 'draft',
      flag: 'repeatability_exceeded',
      created_from: '2024-03-04',
      created_to: '2024-03-05',
    });
    expect(readUnit(params)).toBe('ppm');
    const written = writeFilters(filters, 'ppm');
    expect(written.toString()).toBe(
      'sample_code=K24-0412-F1&heat=K24-0412&grade=SAE+1045&instrument_id=ins_1&method_id=mth_1&import_id=imp_1&flag=repeatability_exceeded&kind=final&status=draft&created_from=2024-03-04&created_to=2024-03-05&unit=ppm',
    );
    expect(readFilters(written)).toEqual(filters);
  });

  it('leaves out blanks, unknown kinds and statuses, impossible days and the default unit', () => {
    const params = new URLSearchParams(
      'heat=%20%20&grade=&kind=scrap&status=approved&created_from=2024-02-30&created_to=04.03.2024&unit=kg',
    );
    expect(readFilters(params)).toEqual({});
    expect(readUnit(params)).toBe('%');
    expect(writeFilters({ heat: '  K24-0412 ', grade: '' }, '%').toString()).toBe('heat=K24-0412');
  });
});

describe('days → instants for the API', () => {
  it('starts a day at local midnight and ends it (exclusively) at the next local midnight', () => {
    // America/Chicago is UTC−6 in winter; daylight saving time began on 10 March 2024 (second
    // Sunday of March, US Energy Policy Act of 2005 — from memory), so that day has 23 hours.
    expect(localDayStart('2024-03-04')).toBe('2024-03-04T06:00:00.000Z');
    expect(toApiQuery({ created_from: '2024-03-10', created_to: '2024-03-10' }, '%')).toEqual({
      created_from: '2024-03-10T06:00:00.000Z',
      created_to: '2024-03-11T05:00:00.000Z',
      unit: '%',
    });
    expect(localDayStart('2024-12-31', 1)).toBe('2025-01-01T06:00:00.000Z');
  });

  it('links the CSV export to the same filters and unit', () => {
    const href = csvHref({ heat: 'K24-0412', kind: 'final', created_from: '2024-03-04' }, 'ppb');
    const url = new URL(href, 'https://lab.kestrelbend.test');
    expect(url.pathname).toBe('/api/v1/samples.csv');
    expect(Object.fromEntries(url.searchParams)).toEqual({
      heat: 'K24-0412',
      kind: 'final',
      created_from: '2024-03-04T06:00:00.000Z',
      unit: 'ppb',
    });
    expect(csvHref({}, '%')).toBe('/api/v1/samples.csv?unit=%25');
  });
});

describe('the Samples list default', () => {
  it('leaves out control-sample points unless shown, a kind is chosen or an import is shown', () => {
    expect(samplesListFilters({})).toEqual({ exclude_kind: 'control' });
    expect(toApiQuery(samplesListFilters({ heat: 'K24-0412' }), '%')).toEqual({ heat: 'K24-0412', exclude_kind: 'control', unit: '%' });
    expect(samplesListFilters({ controls: 'shown' })).toEqual({ controls: 'shown' });
    expect(toApiQuery({ controls: 'shown' }, '%')).toEqual({ unit: '%' });
    expect(samplesListFilters({ kind: 'control' })).toEqual({ kind: 'control' });
    expect(samplesListFilters({ import_id: 'imp_1' })).toEqual({ import_id: 'imp_1' });
    expect(readFilters(new URLSearchParams('controls=shown')).controls).toBe('shown');
    expect(readFilters(new URLSearchParams('controls=yes')).controls).toBeUndefined();
    expect(writeFilters({ heat: 'K24-0412', controls: 'shown' }).toString()).toBe('heat=K24-0412&controls=shown');
  });
});
