// Builds the rows of a new sample (pushed or imported): burns as received, corrected with the
// correction set in force at each burn's measurement time (else the sample's creation time), and
// results computed from the corrected values (raw_mean from the values as measured).
import { newId } from '../../lib/ids.ts';
import { correctBurn, type CorrectionTimeline, ingestCorrection } from '../drift/correction-timeline.ts';
import type { Method } from '../methods/methods.repository.ts';
import { computeSampleResults } from './sample-results.ts';
import type { BurnRow, RawCell, SampleRow, StoredCell } from './samples.repository.ts';
import { encodeResults } from './results-codec.ts';

export interface NewBurn {
  burn_number: number;
  measured_at?: string | null;
  values: Record<string, StoredCell>;
  raw: Record<string, RawCell>;
  source_line?: number | null;
}

export interface NewSample {
  sample_code: string;
  heat?: string | null;
  grade?: string | null;
  kind?: string | null;
  fields?: Record<string, string>;
  instrument_id: string;
  method: Method;
  source: 'push' | 'import';
  import_id?: string | null;
  first_line?: number | null;
  created_by_label: string;
  burns: NewBurn[];
  /** The instrument's and method's activated correction sets; absent or empty = no correction. */
  corrections?: CorrectionTimeline;
}

export function buildSampleRows(input: NewSample, now: string): { sample: SampleRow; burns: BurnRow[] } {
  const id = newId('smp');
  const timeline = input.corrections;
  const corrected = input.burns.map((b) => correctBurn(b.values, timeline ? timeline.at(b.measured_at ?? now) : null));
  const { results, flags } = computeSampleResults(
    input.burns.map((b, i) => ({ excluded: false, values: b.values, corrected: corrected[i].corrected })),
    input.method,
  );
  const correction = ingestCorrection(corrected);
  return {
    sample: {
      id,
      sample_code: input.sample_code,
      heat: input.heat ?? null,
      grade: input.grade ?? null,
      kind: input.kind ?? null,
      instrument_id: input.instrument_id,
      method_id: input.method.id,
      fields_json: JSON.stringify(input.fields ?? {}),
      status: 'draft',
      source: input.source,
      import_id: input.import_id ?? null,
      first_line: input.first_line ?? null,
      results_json: encodeResults(results),
      flags_json: JSON.stringify(flags),
      correction_json: correction && JSON.stringify(correction),
      // Judged against the grade when stored (storeNewSamples): the grade is in the database.
      conformance_json: null,
      conforms: null,
      changed_by_user_id: null, // set when stored (storeNewSamples)
      released_by_user_id: null,
      released_by_label: null,
      released_at: null,
      release_comment: null,
      concession: false,
      revision: 1,
      created_by_label: input.created_by_label,
      created_at: now,
      updated_at: now,
    },
    burns: input.burns.map((burn, i) => ({
      id: newId('brn'),
      sample_id: id,
      burn_number: burn.burn_number,
      measured_at: burn.measured_at ?? null,
      values_json: JSON.stringify(burn.values),
      raw_json: JSON.stringify(burn.raw),
      excluded: false,
      exclusion_reason: null,
      excluded_by: null,
      excluded_at: null,
      source_line: burn.source_line ?? null,
      correction_set_id: corrected[i].correction_set_id,
      corrected_json: corrected[i].corrected && JSON.stringify(corrected[i].corrected),
    })),
  };
}
