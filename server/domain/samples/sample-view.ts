// Stored samples → API representations, in the unit the caller asked for.
import type { AuthContext } from '../auth/auth-context.ts';
import { convertResult, reportingDecimals } from '../chemistry/result-units.ts';
import { fromPercent, type OutputUnit } from '../chemistry/units.ts';
import type { SampleCorrection } from '../drift/correction-timeline.ts';
import { findImportMeta, type ImportMeta } from '../imports/imports.repository.ts';
import { loadSample } from './sample-access.ts';
import { type BurnRow, findBurns, type RawCell, type SampleRowWithRefs, type StoredCell, type StoredResult } from './samples.repository.ts';
import { decodeResults } from './results-codec.ts';
import type { ResultFlag } from '../chemistry/result-rules.ts';
import type { Queryable } from '../../db/transaction.ts';
import type { GradeEvaluationSchema } from '../grades/evaluation.schemas.ts';
import type { z } from '../../lib/zod.ts';

const toNumber = (value: string | null) => (value === null ? null : Number(value));

/** A stored % string as a number in the unit; in % the string is read as it is (the same number, without decimal arithmetic). */
const numberIn = (value: string | null, unit: OutputUnit) =>
  value === null ? null : Number(unit === '%' ? value : fromPercent(value, unit));

function toResultView(stored: StoredResult, unit: OutputUnit) {
  const converted = convertResult(stored, unit, stored.decimals);
  return {
    element: stored.element,
    mean: toNumber(converted.mean),
    sd: converted.sd,
    rsd: converted.rsd,
    n: converted.n,
    min: toNumber(converted.min),
    max: toNumber(converted.max),
    unit,
    raw_mean: numberIn(stored.raw_mean, unit),
    reported: converted.reported,
    qualifier: converted.qualifier,
    decimals: reportingDecimals(stored.decimals, unit),
    flags: converted.flags,
    repeatability: converted.repeatability
      ? {
          range: Number(converted.repeatability.range),
          critical_range: Number(converted.repeatability.critical_range),
          exceeded: converted.repeatability.exceeded,
        }
      : null,
  };
}

/** The stored correction record as the API shows it; set_id only when one set served every corrected burn. */
function toCorrectionView(json: string | null) {
  if (!json) return null;
  const stored = JSON.parse(json) as SampleCorrection;
  return { set_id: stored.set_ids.length === 1 ? stored.set_ids[0] : null, ...stored };
}

/** The stored verdict, shaped by GradeEvaluationSchema when it was written. */
type SampleConformanceView = z.input<typeof GradeEvaluationSchema>;

export function toSampleSummary(row: SampleRowWithRefs, unit: OutputUnit) {
  const results = decodeResults(row.results_json);
  return {
    id: row.id,
    sample_code: row.sample_code,
    heat: row.heat,
    grade: row.grade,
    kind: row.kind as 'preliminary' | 'final' | 'ladle' | 'incoming' | 'control' | null,
    status: row.status,
    instrument: { id: row.instrument_id, code: row.instrument_code },
    method: { id: row.method_id, code: row.method_code },
    fields: JSON.parse(row.fields_json) as Record<string, string>,
    source: row.source,
    import_id: row.import_id,
    burn_count: Number(row.burn_count),
    flags: JSON.parse(row.flags_json) as ResultFlag[],
    results: results.map((r) => toResultView(r, unit)),
    correction: toCorrectionView(row.correction_json),
    conformance: row.conformance_json ? (JSON.parse(row.conformance_json) as SampleConformanceView) : null,
    revision: row.revision,
    release:
      row.status === 'released' && row.released_at
        ? { by: row.released_by_label ?? '', at: row.released_at, comment: row.release_comment, concession: Boolean(row.concession) }
        : null,
    created_by: row.created_by_label,
    created_at: row.created_at,
    updated_at: row.updated_at,
  };
}

function toBurnView(burn: BurnRow, unit: OutputUnit) {
  const values = JSON.parse(burn.values_json) as Record<string, StoredCell>;
  const raw = JSON.parse(burn.raw_json) as Record<string, RawCell>;
  const corrected = burn.corrected_json ? (JSON.parse(burn.corrected_json) as Record<string, StoredCell>) : null;
  const inUnit = (v: string | null) => numberIn(v, unit);
  return {
    number: burn.burn_number,
    measured_at: burn.measured_at,
    excluded: Boolean(burn.excluded),
    exclusion: burn.exclusion_reason ? { reason: burn.exclusion_reason, by: burn.excluded_by ?? '', at: burn.excluded_at ?? '' } : null,
    source_line: burn.source_line,
    correction_set_id: burn.correction_set_id ?? null,
    values: Object.fromEntries(
      Object.entries(values).map(([element, cell]) => [
        element,
        {
          value: inUnit(cell.v),
          qualifier: cell.q,
          raw: raw[element]?.raw ?? cell.v ?? '',
          raw_unit: raw[element]?.unit ?? '%',
          corrected: corrected?.[element] ? { value: inUnit(corrected[element].v), qualifier: corrected[element].q } : null,
        },
      ]),
    ),
  };
}

/** What GET /samples/{id} adds to the list entry: the burns and where the sample came from. */
export function toSampleExtras(
  row: SampleRowWithRefs,
  burns: BurnRow[],
  importMeta: Pick<ImportMeta, 'sha256' | 'file_name'> | undefined,
  unit: OutputUnit,
) {
  return {
    burns: burns.map((b) => toBurnView(b, unit)),
    provenance: {
      source: row.source,
      import_id: row.import_id,
      file_sha256: importMeta?.sha256 ?? null,
      file_name: importMeta?.file_name ?? null,
      lines: burns.map((b) => b.source_line).filter((line): line is number => line !== null),
    },
  };
}

/** A sample with its burns and provenance, as GET /samples/{id} returns it. */
export function toSampleDetail(
  row: SampleRowWithRefs,
  burns: BurnRow[],
  importMeta: Pick<ImportMeta, 'sha256' | 'file_name'> | undefined,
  unit: OutputUnit,
) {
  return { ...toSampleSummary(row, unit), ...toSampleExtras(row, burns, importMeta, unit) };
}

export async function loadSampleDetail(db: Queryable, auth: AuthContext, id: string, unit: OutputUnit) {
  const row = await loadSample(db, auth, id);
  const burns = await findBurns(db, id);
  const importMeta = row.import_id ? await findImportMeta(db, row.import_id) : undefined;
  return toSampleDetail(row, burns, importMeta, unit);
}
