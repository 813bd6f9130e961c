// Uploading a result file: deduplicated by SHA-256, parsed, and stored in one transaction —
// all or nothing per file by default, or per sample when asked. The raw bytes are kept.
import type { AppContext } from '../../context.ts';
import { type FieldError, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { recordEvent } from '../events/events.repository.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findMethod, type Method } from '../methods/methods.repository.ts';
import { timelineLoader } from '../drift/correction-timeline.ts';
import { storeNewSamples } from '../samples/samples.service.ts';
import type { ImportIssue, ImportReport } from './import-report.ts';
import { buildImportedSamples } from './import-samples.ts';
import { getImportProfile } from './import-profiles.service.ts';
import { findImportBySha, findImportFile, findImportMeta, insertImport, listImportRows, toImport } from './imports.repository.ts';
import { mapPage } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import { FileLayoutError, parseResultFile, type ParsedFile } from './parse/index.ts';
import { inTransaction } from '../../db/transaction.ts';
import type { ImportListQuerySchema, ImportPreviewRequestSchema } from './imports.schemas.ts';

/** The upload's form fields as validated, with the file multer received. */
export type UploadInput = Omit<z.output<typeof ImportPreviewRequestSchema>, 'file'> & { file: Express.Multer.File };

/** At most this many issues are listed in one problem; `errors_total` gives the full count. */
const MAX_LISTED_ISSUES = 200;

function issueLocation(issue: ImportIssue): string {
  return ['file', issue.line !== undefined ? `line ${issue.line}` : null, issue.column ?? null].filter(Boolean).join(':');
}

function fileProblem(detail: string, issues: ImportIssue[]): UnprocessableProblem {
  const errors: FieldError[] = issues
    .slice(0, MAX_LISTED_ISSUES)
    .map((issue) => ({ location: issueLocation(issue), message: issue.message, code: issue.code }));
  const problem = new UnprocessableProblem(detail, errors);
  Object.assign(problem.extensions, { errors_total: issues.length, issues: issues.slice(0, MAX_LISTED_ISSUES) });
  return problem;
}

async function prepare(ctx: AppContext, auth: AuthContext, input: UploadInput): Promise<{ method: Method; parsed: ParsedFile }> {
  const errors: FieldError[] = [];
  const instrument = await findInstrument(ctx.db, input.instrument_id);
  if (!instrument)
    errors.push({ location: 'body.instrument_id', message: `no instrument ${input.instrument_id}`, code: 'unknown_reference' });
  else assertInstrumentAllowed(auth, instrument.id);
  const method = await findMethod(ctx.db, input.method_id);
  if (!method) errors.push({ location: 'body.method_id', message: `no method ${input.method_id}`, code: 'unknown_reference' });
  let profile;
  if (input.profile_id) {
    try {
      profile = await getImportProfile(ctx, input.profile_id);
    } catch (error) {
      if (!(error instanceof NotFoundProblem)) throw error;
      errors.push({ location: 'body.profile_id', message: `no import profile ${input.profile_id}`, code: 'unknown_reference' });
    }
  }
  if (errors.length) throw new UnprocessableProblem('The upload refers to an instrument, method or profile that does not exist.', errors);
  try {
    return { method: method!, parsed: parseResultFile(input.file.buffer, { profile, defaultUnit: method!.default_unit }) };
  } catch (error) {
    if (error instanceof FileLayoutError) throw fileProblem(`The file cannot be read as result data: ${error.message}`, error.issues);
    throw error;
  }
}

function layoutOf(parsed: ParsedFile): ImportReport['layout'] {
  return {
    encoding: parsed.bom ? `${parsed.encoding} (BOM)` : parsed.encoding,
    delimiter: parsed.delimiter === '\t' ? 'tab' : parsed.delimiter,
    decimal_separator: parsed.decimal_separator,
    layout: parsed.layout,
    columns: parsed.columns.map((c) => ({
      header: c.header,
      role: c.role,
      ...(c.element ? { element: c.element } : {}),
      ...(c.unit ? { unit: c.unit } : {}),
    })),
  };
}

export async function previewImport(ctx: AppContext, auth: AuthContext, input: UploadInput) {
  const { parsed } = await prepare(ctx, auth, input);
  const duplicate = await findImportBySha(ctx.db, sha256Hex(input.file.buffer));
  return {
    layout: layoutOf(parsed),
    counts: { rows: parsed.counts.rows, samples: parsed.samples.length, burns: parsed.counts.burns, values: parsed.counts.values },
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
    duplicate_of: duplicate?.id ?? null,
  };
}

/** Stores the file and its samples; an identical earlier upload is returned instead (created = false). */
export async function uploadImport(
  ctx: AppContext,
  auth: AuthContext,
  input: UploadInput & { mode: 'all_or_nothing' | 'per_sample' },
  requestId?: string,
) {
  const sha256 = sha256Hex(input.file.buffer);
  const existing = await findImportBySha(ctx.db, sha256);
  if (existing) {
    assertInstrumentAllowed(auth, existing.instrument_id);
    return { created: false, record: toImport(existing) };
  }
  const { method, parsed } = await prepare(ctx, auth, input);
  if (input.mode === 'all_or_nothing' && parsed.rejected.length > 0) {
    throw fileProblem(
      `${parsed.rejected.length} value(s) cannot be read, so nothing was imported. Fix the lines listed in errors[], or upload with mode=per_sample to import the other samples.`,
      parsed.rejected,
    );
  }
  const accepted = parsed.samples.filter((s) => s.rejected.length === 0);
  if (accepted.length === 0) throw fileProblem('No sample in this file can be imported.', parsed.rejected);

  const id = newId('imp');
  const actor = actorOf(auth);
  const now = nowIso();
  const row = await inTransaction(ctx.db, async (trx) => {
    // The correction sets are read in the storing transaction: an activation lands wholly before or after.
    const corrections = await timelineLoader(trx)(input.instrument_id, method.id);
    const warnings: ImportIssue[] = [...parsed.warnings];
    const built = buildImportedSamples(
      accepted,
      { instrumentId: input.instrument_id, method, importId: id, createdBy: actor.label, now, corrections },
      warnings,
    );
    const report: ImportReport = {
      layout: layoutOf(parsed),
      counts: {
        rows: parsed.counts.rows,
        samples_created: built.length,
        samples_rejected: parsed.samples.length - accepted.length,
        lines_rejected: new Set(parsed.rejected.map((issue) => issue.line)).size,
        burns: built.reduce((sum, b) => sum + b.burns.length, 0),
        values: accepted.reduce((sum, s) => sum + s.burns.reduce((n, b) => n + Object.keys(b.values).length, 0), 0),
      },
      sample_ids: built.map((b) => b.sample.id),
      warnings,
      rejected: parsed.rejected,
    };
    const row = {
      id,
      instrument_id: input.instrument_id,
      method_id: input.method_id,
      profile_id: input.profile_id ?? null,
      file_name: input.file.originalname.slice(0, 255) || 'upload',
      content_type: (input.file.mimetype || 'application/octet-stream').slice(0, 100),
      size_bytes: input.file.size,
      sha256,
      content: input.file.buffer,
      mode: input.mode,
      report_json: JSON.stringify(report),
      created_by_type: actor.type,
      created_by_id: actor.id,
      created_by_label: actor.label,
      created_at: now,
    };
    await insertImport(trx, row);
    await storeNewSamples(trx, built, actor, requestId, { auditEach: false });
    await recordAudit(trx, {
      actor,
      requestId,
      action: 'import.completed',
      targetType: 'import',
      targetId: id,
      after: { file_name: row.file_name, sha256, mode: input.mode, counts: report.counts },
    });
    await recordEvent(trx, 'import.completed', toImport(row), { occurredAt: now, instrumentId: row.instrument_id });
    return row;
  });
  const { content: _content, ...meta } = row;
  return { created: true, record: toImport(meta) };
}

/** Newest first; a key restricted to instruments sees only their imports. */
export async function listImportsPage(ctx: AppContext, auth: AuthContext, query: z.output<typeof ImportListQuerySchema>) {
  const filters = { instrumentId: query.instrument_id, onlyInstrumentIds: auth.instrumentIds };
  return mapPage(await listImportRows(ctx.db, filters, query), toImport);
}

function visible<Row extends { instrument_id: string }>(auth: AuthContext, row: Row | undefined): row is Row {
  return row !== undefined && (!auth.instrumentIds || auth.instrumentIds.includes(row.instrument_id));
}

export async function getImport(ctx: AppContext, auth: AuthContext, id: string) {
  const row = await findImportMeta(ctx.db, id);
  if (!visible(auth, row)) throw new NotFoundProblem(`No import ${id}.`);
  return toImport(row);
}

/** The raw file exactly as it was uploaded. */
export async function getImportFile(ctx: AppContext, auth: AuthContext, id: string) {
  const file = await findImportFile(ctx.db, id);
  if (!visible(auth, file)) throw new NotFoundProblem(`No import ${id}.`);
  return file;
}
