// import.failed: an upload refused with 422 stores no import, so its event is recorded in a small
// transaction of its own, naming the file (name, SHA-256), instrument, method and the problem sent
// back. (import.completed is recorded with the import, in uploadImport's transaction.)
import { inTransaction } from '../../db/transaction.ts';
import type { AppContext } from '../../context.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { recordEvent } from '../events/events.repository.ts';
import { uploadImport, type UploadInput } from './imports.service.ts';

type UploadRequest = Parameters<typeof uploadImport>[2];

export function importFailedData(input: UploadInput & { mode?: string }, problem: UnprocessableProblem, requestId?: string) {
  return {
    file: {
      name: input.file.originalname.slice(0, 255) || 'upload',
      content_type: (input.file.mimetype || 'application/octet-stream').slice(0, 100),
      size_bytes: input.file.size,
      sha256: sha256Hex(input.file.buffer),
    },
    instrument_id: input.instrument_id,
    method_id: input.method_id,
    profile_id: input.profile_id ?? null,
    mode: input.mode ?? null,
    request_id: requestId ?? null,
    problem: problem.toBody(),
  };
}

export async function recordImportFailed(
  ctx: AppContext,
  auth: AuthContext,
  input: UploadRequest,
  problem: UnprocessableProblem,
  requestId?: string,
) {
  const data = importFailedData(input, problem, requestId);
  await inTransaction(ctx.db, async (trx) => {
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'import.failed',
      targetType: 'import',
      after: { file_name: data.file.name, sha256: data.file.sha256, detail: problem.detail ?? problem.title },
    });
    await recordEvent(trx, 'import.failed', data, { occurredAt: nowIso(), instrumentId: input.instrument_id });
  });
}

/** uploadImport, recording import.failed when the file is refused with 422. */
export async function uploadImportOrRecordFailure(ctx: AppContext, auth: AuthContext, input: UploadRequest, requestId?: string) {
  try {
    return await uploadImport(ctx, auth, input, requestId);
  } catch (error) {
    if (error instanceof UnprocessableProblem) await recordImportFailed(ctx, auth, input, error, requestId);
    throw error;
  }
}
