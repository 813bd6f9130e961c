// CSV export of samples: one row per sample, identification columns, then one column per
// element with the reported value (qualifier included, e.g. "<0.002"). Text cells that a
// spreadsheet would run as a formula are neutralised (OWASP "CSV injection").
import { stringify } from 'csv-stringify/sync';

export interface CsvSample {
  id: string;
  sample_code: string;
  heat: string | null;
  grade: string | null;
  kind: string | null;
  status: string;
  instrument: { code: string };
  method: { code: string };
  fields: Record<string, string>;
  flags: string[];
  created_at: string;
  updated_at: string;
  results: { element: string; reported: string | null; qualifier: string | null }[];
}

const FORMULA_START = /^[=+\-@\t\r]/;

/** Prefixes a quote to text a spreadsheet would evaluate (=, +, -, @, tab, CR). */
function guardCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** A sample's own field value: a field named like an Object member ("constructor") is data, not code. */
function fieldValue(fields: Record<string, string>, name: string): string {
  return Object.hasOwn(fields, name) ? fields[name] : '';
}

export function samplesToCsv(samples: CsvSample[], unit: string): string {
  const elementSet = new Set<string>();
  const fieldSet = new Set<string>();
  for (const sample of samples) {
    for (const r of sample.results) elementSet.add(r.element);
    for (const f of Object.keys(sample.fields)) fieldSet.add(f);
  }
  const elements = [...elementSet];
  const fieldNames = [...fieldSet];
  const header = [
    'id',
    'sample_code',
    'heat',
    'grade',
    'kind',
    'status',
    'instrument',
    'method',
    ...fieldNames,
    'created_at',
    'updated_at',
    'flags',
    ...elements.map((e) => `${e} [${unit}]`),
  ];
  const rows = samples.map((s) => {
    const byElement = new Map(s.results.map((r) => [r.element, r]));
    const cells = [
      s.id,
      s.sample_code,
      s.heat ?? '',
      s.grade ?? '',
      s.kind ?? '',
      s.status,
      s.instrument.code,
      s.method.code,
      ...fieldNames.map((f) => fieldValue(s.fields, f)),
      s.created_at,
      s.updated_at,
      s.flags.join(' '),
    ];
    const values = elements.map((e) => {
      const r = byElement.get(e);
      return r?.reported == null ? '' : `${r.qualifier ?? ''}${r.reported}`;
    });
    // Reported chemistry may legitimately start with "<" or ">"; only text columns are guarded.
    return [...cells.map(guardCell), ...values];
  });
  return stringify([header.map(guardCell), ...rows]);
}
