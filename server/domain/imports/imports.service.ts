// Uploading a result file: deduplicated by SHA-256, read and built in an import worker thread
// (import-work.ts), and stored in one transaction — all or nothing per file by default, or per
// sample when asked. The raw bytes are kept.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, type FieldError, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { latestMeasurementTime, nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { recordEvent } from '../events/events.repository.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findMethod } from '../methods/methods.repository.ts';
import { timelineRows, type TimelineRow } from '../drift/correction-timeline.ts';
import { storeNewSamples } from '../samples/samples.service.ts';
import type { ImportIssue, ImportReport } from './import-report.ts';
import type { ImportTask } from './import-work.ts';
import { runImportWork } from './import-workers.ts';
import { getImportProfile } from './import-profiles.service.ts';
import { findImportBySha, findImportFile, findImportMeta, insertImport, listImportRows, toImport } from './imports.repository.ts';
import { mapPage } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import { inTransaction } from '../../db/transaction.ts';
import { prepareDocumentsSoon } from '../samples/prepared-documents.ts';
import type { ImportListQuerySchema, ImportPreviewRequestSchema } from './imports.schemas.ts';

/** The upload's form fields as validated, with the file multer received. */
export type UploadInput = Omit<z.output<typeof ImportPreviewRequestSchema>, 'file'> & { file: Express.Multer.File };

/** At most this many issues are listed in one problem; `errors_total` gives the full count. */
const MAX_LISTED_ISSUES = 200;

function issueLocation(issue: ImportIssue): string {
  return ['file', issue.line !== undefined ? `line ${issue.line}` : null, issue.column ?? null].filter(Boolean).join(':');
}

export function fileProblem(detail: string, issues: ImportIssue[]): UnprocessableProblem {
  const errors: FieldError[] = issues
    .slice(0, MAX_LISTED_ISSUES)
    .map((issue) => ({ location: issueLocation(issue), message: issue.message, code: issue.code }));
  const problem = new UnprocessableProblem(detail, errors);
  Object.assign(problem.extensions, { errors_total: issues.length, issues: issues.slice(0, MAX_LISTED_ISSUES) });
  return problem;
}

/** The method and import profile a request names (a file upload, a standardization file); each
 * unknown one becomes an entry of `errors`. */
export async function findMethodAndProfile(ctx: AppContext, input: { method_id: string; profile_id?: string }, errors: FieldError[]) {
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
  return { method, profile };
}

/** The instrument, method and profile the upload names; every unknown reference is reported at once. */
async function resolveReferences(ctx: AppContext, auth: AuthContext, input: UploadInput) {
  const errors: FieldError[] = [];
  const instrument = await findInstrument(ctx.db, input.instrument_id);
  if (!instrument)
    errors.push({ location: 'body.instrument_id', message: `no instrument ${input.instrument_id}`, code: 'unknown_reference' });
  else assertInstrumentAllowed(auth, instrument.id);
  const { method, profile } = await findMethodAndProfile(ctx, input, errors);
  if (errors.length) throw new UnprocessableProblem('The upload refers to an instrument, method or profile that does not exist.', errors);
  const review = {
    code: method!.code,
    matrix: method!.matrix,
    elements: method!.elements.map((e) => e.element),
    balance_by_difference: method!.reporting.balance_by_difference,
    unlisted_elements: method!.reporting.unlisted_elements,
  };
  return { method: method!, options: { profile, defaultUnit: method!.default_unit, latestTime: latestMeasurementTime(), method: review } };
}

/** Reads the file in an import worker; an unreadable or refused file becomes its 422 problem. */
async function work(ctx: AppContext, task: ImportTask) {
  const { outcome, built } = await runImportWork(ctx.importWorkers, task);
  if (outcome.kind === 'unreadable' || outcome.kind === 'refused') throw fileProblem(outcome.detail, outcome.issues);
  return { outcome, built };
}

export async function previewImport(ctx: AppContext, auth: AuthContext, input: UploadInput) {
  const { options } = await resolveReferences(ctx, auth, input);
  const { outcome } = await work(ctx, { kind: 'preview', bytes: input.file.buffer, options });
  if (outcome.kind !== 'preview') throw new Error(`an import preview came back as ${outcome.kind}`);
  const duplicate = await findImportBySha(ctx.db, sha256Hex(input.file.buffer));
  return { ...outcome.preview, duplicate_of: duplicate?.id ?? null };
}

/** Samples are built outside the storing transaction against the activated correction sets read
 * before it; if an activation lands in between, they are built again (at most this many times). */
const BUILD_ATTEMPTS = 3;

class CorrectionsChanged extends Error {}

const fingerprint = (rows: TimelineRow[]) => rows.map((row) => `${row.id}@${String(row.effective_from)}`).join('|');

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
  const { method, options } = await resolveReferences(ctx, auth, input);
  const id = newId('imp');
  const actor = actorOf(auth);
  const now = nowIso();
  for (let attempt = 1; attempt <= BUILD_ATTEMPTS; attempt++) {
    const corrections = await timelineRows(ctx.db, input.instrument_id, method.id);
    const context = { instrumentId: input.instrument_id, method, importId: id, createdBy: actor.label, now, corrections };
    const { outcome, built } = await work(ctx, { kind: 'build', bytes: input.file.buffer, options, mode: input.mode, context });
    if (outcome.kind !== 'built') throw new Error(`an import build came back as ${outcome.kind}`);
    const report = outcome.report;
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
    try {
      await inTransaction(ctx.db, async (trx) => {
        // Read again in the storing transaction: an activation lands wholly before or after.
        if (fingerprint(await timelineRows(trx, input.instrument_id, method.id)) !== fingerprint(corrections))
          throw new CorrectionsChanged();
        await insertImport(trx, row);
        await storeNewSamples(trx, built, actor, requestId, { auditEach: false, userId: auth.userId });
        await recordAudit(trx, {
          actor,
          requestId,
          action: 'import.completed',
          targetType: 'import',
          targetId: id,
          after: { file_name: row.file_name, sha256, mode: input.mode, counts: report.counts },
        });
        await recordEvent(trx, 'import.completed', toImport(row), { occurredAt: now, instrumentId: row.instrument_id });
      });
    } catch (error) {
      if (error instanceof CorrectionsChanged) continue;
      throw error;
    }
    prepareDocumentsSoon(
      ctx.db,
      built.map((b) => b.sample.id),
      (error) => ctx.logger.warn({ err: error, import_id: id }, 'preparing the imported samples for reading failed'),
    );
    const { content: _content, ...meta } = row;
    return { created: true, record: toImport(meta) };
  }
  throw new ConflictProblem(
    'Correction sets for this instrument and method were activated while the file was being imported; upload it again.',
  );
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

/**
 * The raw file exactly as it was uploaded, and the media type to serve it as: it was read as
 * delimited text, so text/csv in the encoding it was read in — never the Content-Type the
 * uploader sent, which could make a browser run the bytes as a page or script of this origin.
 */
export async function getImportFile(ctx: AppContext, auth: AuthContext, id: string) {
  const file = await findImportFile(ctx.db, id);
  if (!visible(auth, file)) throw new NotFoundProblem(`No import ${id}.`);
  const { report_json, ...rest } = file;
  const encoding = (JSON.parse(report_json) as ImportReport).layout.encoding.startsWith('windows-1252') ? 'windows-1252' : 'utf-8';
  return { ...rest, media_type: `text/csv; charset=${encoding}` };
}
