// CSV export of samples: one row per sample, identification columns, then one column per
// element with the reported value (qualifier included, e.g. "<0.002"). Text cells that a
// spreadsheet would run as a formula are neutralised (OWASP "CSV injection"). Written in pieces
// — the header, then lines a page of samples at a time — so that an export can be streamed.
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
  conformance: { conforms: boolean | null; grade: { version: number } } | null;
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

/** The CSV's element and field columns: every element and field of the exported samples, in
 * order of first appearance (samples in export order, each sample's results in its order). */
export class CsvColumns {
  // Sets iterate in insertion order: first appearance.
  private readonly elements = new Set<string>();
  private readonly fields = new Set<string>();

  add(elements: Iterable<string>, fieldNames: Iterable<string>): void {
    for (const element of elements) this.elements.add(element);
    for (const field of fieldNames) this.fields.add(field);
  }

  covers(sample: CsvSample): boolean {
    return sample.results.every((r) => this.elements.has(r.element)) && Object.keys(sample.fields).every((f) => this.fields.has(f));
  }

  get elementNames(): string[] {
    return [...this.elements];
  }

  get fieldNames(): string[] {
    return [...this.fields];
  }
}

/** The header line. */
export function csvHeader(columns: CsvColumns, unit: string): string {
  const header = [
    'id',
    'sample_code',
    'heat',
    'grade',
    'kind',
    'status',
    'instrument',
    'method',
    ...columns.fieldNames,
    'created_at',
    'updated_at',
    'flags',
    'conforms',
    ...columns.elementNames.map((e) => `${e} [${unit}]`),
  ];
  return stringify([header.map(guardCell)]);
}

/** One line per sample; every element and field of theirs must be among the columns. */
export function csvLines(samples: CsvSample[], columns: CsvColumns): string {
  const { elementNames, fieldNames } = columns;
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
      s.conformance ? (s.conformance.conforms === null ? 'undecided' : String(s.conformance.conforms)) : '',
    ];
    const values = elementNames.map((e) => {
      const r = byElement.get(e);
      return r?.reported == null ? '' : `${r.qualifier ?? ''}${r.reported}`;
    });
    // Reported chemistry may legitimately start with "<" or ">"; only text columns are guarded.
    return [...cells.map(guardCell), ...values];
  });
  return rows.length ? stringify(rows) : '';
}
