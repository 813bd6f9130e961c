// The CPU-heavy part of an import, without the database: read the file, then either describe it
// (preview) or build every accepted sample with its results and the import report (upload).
// Runs in a worker thread (import-worker.ts); everything it needs from the database — the method
// and the activated correction sets — comes in the task, and built samples go back in chunks.
import { CorrectionTimeline, type TimelineRow } from '../drift/correction-timeline.ts';
import type { Method } from '../methods/methods.repository.ts';
import type { buildSampleRows } from '../samples/sample-builder.ts';
import type { ImportIssue, ImportReport } from './import-report.ts';
import { FlagCounter } from './import-flag-summary.ts';
import { buildImportedSamples } from './import-samples.ts';
import { refuseNaiveTimesNearCorrections } from './naive-times.ts';
import type { ImportPreviewSchema } from './imports.schemas.ts';
import { FileLayoutError, parseResultFile, type ParsedFile, type ParseOptions } from './parse/index.ts';
import type { z } from '../../lib/zod.ts';

export type BuiltSample = ReturnType<typeof buildSampleRows>;

export interface PreviewTask {
  kind: 'preview';
  bytes: Uint8Array;
  options: ParseOptions;
}

export interface BuildTask {
  kind: 'build';
  bytes: Uint8Array;
  options: ParseOptions;
  mode: 'all_or_nothing' | 'per_sample';
  context: { instrumentId: string; method: Method; importId: string; createdBy: string; now: string; corrections: TimelineRow[] };
}

export type ImportTask = PreviewTask | BuildTask;

export type ImportPreview = Omit<z.output<typeof ImportPreviewSchema>, 'duplicate_of'>;

/** What a task comes back with; `refused` and `unreadable` become 422 problems listing the issues. */
export type ImportOutcome =
  | { kind: 'unreadable' | 'refused'; detail: string; issues: ImportIssue[] }
  | { kind: 'preview'; preview: ImportPreview }
  | { kind: 'built'; report: ImportReport };

/** Built samples travel in messages of this many, so that no single message takes long to read. */
const CHUNK_SAMPLES = 200;

function layoutOf(parsed: ParsedFile): ImportReport['layout'] {
  return {
    encoding: parsed.bom ? `${parsed.encoding} (BOM)` : parsed.encoding,
    delimiter: parsed.delimiter === '\t' ? 'tab' : parsed.delimiter,
    decimal_separator: parsed.decimal_separator,
    layout: parsed.layout,
    time_zone: parsed.time_zone,
    columns: parsed.columns.map((c) => ({
      header: c.header,
      role: c.role,
      ...(c.element ? { element: c.element } : {}),
      ...(c.unit ? { unit: c.unit } : {}),
      ...(c.field ? { field: c.field } : {}),
      source: c.source,
      ...(c.kept ? { kept: true } : {}),
      ...(c.attention ? { attention: c.attention } : {}),
    })),
  };
}

function preview(parsed: ParsedFile): ImportPreview {
  return {
    layout: layoutOf(parsed),
    counts: {
      rows: parsed.counts.rows,
      samples: parsed.samples.length,
      burns: parsed.counts.burns,
      values: parsed.counts.values,
      samples_with_rejected_lines: parsed.samples.filter((s) => s.rejected.length > 0).length,
    },
    samples: parsed.samples.slice(0, 20).map((s) => ({
      sample_code: s.sample_code,
      heat: s.heat ?? null,
      grade: s.grade ?? null,
      kind: s.kind ?? null,
      first_line: s.first_line,
      burns: s.burns.map((b) => ({
        line: b.line,
        burn_number: b.burn_number,
        measured_at: b.measured_at ?? null,
        values: Object.fromEntries(Object.entries(b.values).map(([el, v]) => [el, v.raw])),
      })),
    })),
    warnings: parsed.warnings,
    rejected: parsed.rejected,
  };
}

function build(parsed: ParsedFile, task: BuildTask, sendChunk: (samples: BuiltSample[]) => void): ImportOutcome {
  const starts = task.context.corrections.flatMap((row) => (row.effective_from ? [new Date(row.effective_from).toISOString()] : []));
  refuseNaiveTimesNearCorrections(parsed, starts);
  if (task.mode === 'all_or_nothing' && parsed.rejected.length > 0) {
    return {
      kind: 'refused',
      detail: `${parsed.rejected.length} value(s) cannot be read, so nothing was imported: the whole file is refused when any value is unreadable. Correct the lines listed and upload the file again, or import per sample (mode per_sample) to store the other samples.`,
      issues: parsed.rejected,
    };
  }
  const accepted = parsed.samples.filter((s) => s.rejected.length === 0);
  if (accepted.length === 0) return { kind: 'refused', detail: 'No sample in this file can be imported.', issues: parsed.rejected };

  const { context } = task;
  const corrections = new CorrectionTimeline(context.corrections);
  const warnings: ImportIssue[] = [...parsed.warnings];
  const sampleIds: string[] = [];
  const flags = new FlagCounter();
  let burns = 0;
  for (let i = 0; i < accepted.length; i += CHUNK_SAMPLES) {
    const built = buildImportedSamples(accepted.slice(i, i + CHUNK_SAMPLES), { ...context, corrections }, warnings);
    for (const b of built) {
      sampleIds.push(b.sample.id);
      flags.count(b.sample);
      burns += b.burns.length;
    }
    sendChunk(built);
  }
  return {
    kind: 'built',
    report: {
      layout: layoutOf(parsed),
      counts: {
        rows: parsed.counts.rows,
        samples_created: sampleIds.length,
        samples_rejected: parsed.samples.length - accepted.length,
        lines_rejected: new Set(parsed.rejected.map((issue) => issue.line)).size,
        burns,
        values: accepted.reduce((sum, s) => sum + s.burns.reduce((n, b) => n + Object.keys(b.values).length, 0), 0),
      },
      sample_ids: sampleIds,
      flag_summary: flags.summary(context.method),
      warnings,
      rejected: parsed.rejected,
    },
  };
}

/** Runs one task; a file that cannot be read at all comes back as `unreadable`, not as an error. */
export function runImportTask(task: ImportTask, sendChunk: (samples: BuiltSample[]) => void): ImportOutcome {
  let parsed: ParsedFile;
  try {
    parsed = parseResultFile(task.bytes, task.options);
  } catch (error) {
    if (!(error instanceof FileLayoutError)) throw error;
    return { kind: 'unreadable', detail: `The file cannot be read as result data: ${error.message}`, issues: error.issues };
  }
  return task.kind === 'preview' ? { kind: 'preview', preview: preview(parsed) } : build(parsed, task, sendChunk);
}
