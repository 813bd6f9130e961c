// From a parsed file to new samples: kinds checked against the trade's list, values kept as
// written (raw) and canonical (%), issues turned into the report's entries.
import type { CorrectionTimeline } from '../drift/correction-timeline.ts';
import type { Method } from '../methods/methods.repository.ts';
import { SAMPLE_KINDS } from '../samples/samples.schemas.ts';
import { buildSampleRows, type NewBurn } from '../samples/sample-builder.ts';
import type { ImportIssue } from './import-report.ts';
import type { ParsedBurn, ParsedSample } from './parse/index.ts';

function toNewBurns(burns: ParsedBurn[]): NewBurn[] {
  return burns.map((burn) => {
    const values: NewBurn['values'] = {};
    const raw: NewBurn['raw'] = {};
    for (const element in burn.values) {
      const cell = burn.values[element];
      values[element] = { v: cell.value, q: cell.qualifier };
      if (cell.raw !== cell.value || cell.unit !== '%') raw[element] = { raw: cell.raw, unit: cell.unit };
    }
    return { burn_number: burn.burn_number, measured_at: burn.measured_at ?? null, values, raw, source_line: burn.line };
  });
}

/** The trade's sample kinds; anything else written in a kind column is kept as a field. */
function splitKind(sample: ParsedSample, warnings: ImportIssue[]): { kind: string | null; fields: Record<string, string> } {
  if (!sample.kind) return { kind: null, fields: sample.fields };
  const kind = sample.kind.trim().toLowerCase();
  if ((SAMPLE_KINDS as readonly string[]).includes(kind)) return { kind, fields: sample.fields };
  warnings.push({
    line: sample.first_line,
    column: 'kind',
    code: 'unknown_kind',
    message: `"${sample.kind}" is not one of ${SAMPLE_KINDS.join(', ')}; kept as the field "kind".`,
  });
  return { kind: null, fields: { ...sample.fields, kind: sample.kind } };
}

export function buildImportedSamples(
  samples: ParsedSample[],
  context: {
    instrumentId: string;
    method: Method;
    importId: string | null;
    createdBy: string;
    now: string;
    corrections?: CorrectionTimeline;
  },
  warnings: ImportIssue[],
) {
  return samples.map((sample) => {
    const { kind, fields } = splitKind(sample, warnings);
    return buildSampleRows(
      {
        sample_code: sample.sample_code,
        heat: sample.heat ?? null,
        grade: sample.grade ?? null,
        kind,
        fields,
        instrument_id: context.instrumentId,
        method: context.method,
        source: 'import',
        import_id: context.importId,
        first_line: sample.first_line,
        created_by_label: context.createdBy,
        burns: toNewBurns(sample.burns),
        corrections: context.corrections,
      },
      context.now,
    );
  });
}
